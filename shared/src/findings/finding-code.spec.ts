import { FINDING_CODE_TABLE, FINDING_CODES, findingCodeInfo } from './finding-code';

describe('finding-code table', () => {
  // Source: the project's finding-code list (24 codes with default severities and NEC sections).
  it('lists the 24 codes', () => {
    expect(FINDING_CODES).toHaveLength(24);
    expect(FINDING_CODES[0]).toBe('gfci-missing');
    expect(FINDING_CODES[FINDING_CODES.length - 1]).toBe('evaluate-general');
  });

  it.each([
    ['gfci-missing', 'safety', '210.8(A)'],
    ['afci-missing', 'upgrade', '210.12'],
    ['double-tap', 'repair', '408.41'],
    ['overcurrent-mismatch', 'safety', '240.4(D)'],
    ['knob-and-tube', 'evaluate', '394'],
  ] as const)('gives %s the severity %s and cites %s', (code, severity, ref) => {
    expect(findingCodeInfo(code).severity).toBe(severity);
    expect(findingCodeInfo(code).necRefs).toContain(ref);
  });

  it('has no NEC section for a general evaluation', () => {
    expect(FINDING_CODE_TABLE['evaluate-general'].necRefs).toEqual([]);
  });
});
