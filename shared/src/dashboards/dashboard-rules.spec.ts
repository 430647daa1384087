import { closingRisk, monthsEndingAt, pipelineStage, wholePercent } from './dashboard-rules';

describe('dashboard rules', () => {
  it.each([
    ['pricing', 5, 'high'],
    ['in-progress', 7, 'high'],
    ['in-progress', -2, 'high'],
    ['quoted', 20, 'medium'],
    ['approved', 20, 'low'],
    ['quoted', 40, 'low'],
    ['letter-issued', 2, 'low'],
    ['accepted', 2, 'none'],
    ['withdrawn', 1, 'none'],
  ] as const)('a request %s with %i days left is %s', (status, days, risk) => {
    expect(closingRisk(status, days)).toBe(risk);
  });

  it.each([
    ['draft', null],
    ['intake', null],
    ['pricing', 'to-price'],
    ['quoted', 'awaiting-approval'],
    ['approved', 'to-schedule'],
    ['scheduled', 'to-correct'],
    ['in-progress', 'to-correct'],
    ['reopened', 'to-correct'],
    ['corrected', 'letters-due'],
    ['letter-issued', null],
    ['declined', null],
  ] as const)('a request %s sits in stage %s', (status, stage) => {
    expect(pipelineStage(status)).toBe(stage);
  });

  it('lists the months ending with the current one, across a year end', () => {
    expect(monthsEndingAt('2026-02-10', 4)).toEqual(['2025-11', '2025-12', '2026-01', '2026-02']);
  });

  it('rounds a percentage half up', () => {
    expect(wholePercent(1, 3)).toBe(33);
    expect(wholePercent(2, 3)).toBe(67);
    expect(wholePercent(1, 8)).toBe(13);
    expect(wholePercent(0, 0)).toBe(0);
  });
});
