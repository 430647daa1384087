// Expected values worked by hand from the rules in docs/pricing.md (R1 half up, R5 largest
// remainder, R7 per hour) and the demo rate book; trade figures are common practice as noted.
import { DEMO_RATE_BOOK } from '../pricing/demo-rate-book';
import { buildPickList, materialKind, IN_USE_COVER, type PickItem } from './pick-list';
import { medianOf, minutesPerUnitOnVisit, minutesVerdict, singleVisitRates, totalsOf, visitRates, type OutcomeRecord } from './day-economics';

const entry = (id: string) => DEMO_RATE_BOOK.entries.find((e) => e.id === id)!;
const item = (overrides: Partial<PickItem>): PickItem => ({ itemId: 1, code: 'gfci-inoperative', room: 'kitchen', visitLabel: 'Visit A', entry: entry('gfci-replace'), quantity: 1, adderIds: [], ...overrides });

describe('pick list', () => {
  it('adds up each entry’s materials by quantity, with site-condition extras and the spare allowance once per entry', () => {
    const list = buildPickList(
      [
        item({ itemId: 1, quantity: 2, adderIds: ['tile-or-stone'] }), // 2 GFCI + 2 long-screw pairs
        item({ itemId: 2, visitLabel: 'Visit B', entry: entry('gfci-receptacle-first-device'), room: 'exterior' }), // 1 GFCI + in-use cover
        item({ itemId: 3, visitLabel: 'Visit B', code: 'double-tap', entry: entry('double-tap-pigtail'), quantity: 3 }),
        item({ itemId: 4, code: 'afci-missing', entry: entry('afci-breaker-flat') }),
      ],
      { 'gfci-replace': 1, 'double-tap-pigtail': 2 },
    );
    const byName = Object.fromEntries(list.lines.map((l) => [l.name, [l.kind, l.quantity, l.spare, l.total, l.isSiteCondition]]));
    expect(byName).toEqual({
      'GFCI receptacle 15 A, TR/WR': ['devices', 3, 1, 4, false],
      [IN_USE_COVER]: ['covers', 1, 0, 1, true],
      'Long device screws, 6-32 × 1½ in (pair)': ['wire-hardware', 2, 0, 2, true],
      'Pigtail and listed connector': ['wire-hardware', 3, 2, 5, false],
    });
    expect(list.lines.map((l) => l.kind)).toEqual(['devices', 'covers', 'wire-hardware', 'wire-hardware']);
    expect(list.lines[0].forVisits).toEqual(['Visit A', 'Visit B']);
    expect(list.itemsWithoutMaterials).toEqual([{ itemId: 4, code: 'afci-missing', reason: 'Flat-rate entry: no materials list' }]);
  });

  it('sorts materials into kinds by name', () => {
    expect(['AFCI breaker, single pole', 'Cover plate', '"No Equipment Ground" labels', 'Junction box', 'Bonding clamp', 'Mast kit, straps and weatherhead'].map(materialKind)).toEqual([
      'breakers',
      'covers',
      'labels',
      'boxes',
      'wire-hardware',
      'other',
    ]);
  });
});

describe('visit and day figures', () => {
  it('earns billed less materials cost per on-site and per paid hour (R7)', () => {
    // 31,250 − 2,400 = 28,850 over 25 min = 69,240 per hour; over 25 + 15 = 40 min = 43,275.
    expect(visitRates({ billedCents: 31_250, materialsCostCents: 2_400, onSiteMinutes: 25, driveMinutes: 15 })).toEqual({ earningsCents: 28_850, perOnSiteHourCents: 69_240, perPaidHourCents: 43_275 });
    expect(visitRates({ billedCents: 31_250, materialsCostCents: 2_400, onSiteMinutes: null, driveMinutes: 15 })).toEqual({ earningsCents: 28_850, perOnSiteHourCents: null, perPaidHourCents: null });
  });

  it('totals the day plan’s driving of every visit, and the rates over the visits whose minutes are known', () => {
    const totals = totalsOf([
      { billedCents: 10_000, materialsCostCents: 1_000, onSiteMinutes: 30, driveMinutes: 10, correctedCount: 1 },
      { billedCents: 20_000, materialsCostCents: 2_000, onSiteMinutes: 60, driveMinutes: 20, correctedCount: 2 },
      { billedCents: 5_000, materialsCostCents: 0, onSiteMinutes: null, driveMinutes: 10, correctedCount: 0 },
    ]);
    // on site: 27,000 over 90 min = 18,000/h; paid: 27,000 over 120 min = 13,500/h; driving: all three visits, 40 min.
    expect(totals).toEqual({ visitCount: 3, correctedCount: 3, billedCents: 35_000, materialsCostCents: 3_000, earningsCents: 32_000, onSiteMinutes: 90, driveMinutes: 40, perOnSiteHourCents: 18_000, perPaidHourCents: 13_500, visitsWithoutMinutes: 1 });
  });

  it('a day of six GFCI replacements of 20 minutes with 10-minute drives pays several times the first-hour minimum per hour (common practice)', () => {
    // Demo book, each job its own quote visit: $95 service call + $185 first hour + GFCI $24 × 1.35 = $32.40
    // → subtotal 31,240; materials cost 2,400; earnings 28,840 × 6 = 173,040 over 6 × 30 = 180 paid minutes.
    const day = totalsOf(Array.from({ length: 6 }, () => ({ billedCents: 31_240, materialsCostCents: 2_400, onSiteMinutes: 20, driveMinutes: 10, correctedCount: 1 })));
    expect(day.perPaidHourCents).toBe(57_680);
    expect(day.perPaidHourCents!).toBeGreaterThan(2 * DEMO_RATE_BOOK.terms.firstHourMinimumCents);
  });
});

describe('minutes against the rate book', () => {
  it('takes the median, the mean of the middle two for an even count (R1)', () => {
    expect(medianOf([20, 10, 30])).toBe(20);
    expect(medianOf([10, 25, 30, 11])).toBe(18); // (11 + 25) / 2
    expect(medianOf([10, 11])).toBe(11); // 10.5 → 11
  });

  it('splits a visit’s minutes by priced minutes, evenly by quantity when a line is flat (R5)', () => {
    const timed = (key: string, pricedMinutes: number, quantity = 1) => ({ key, code: 'x', entryKey: 'x', entryName: 'x', quantity, pricedMinutes, bookMinutesPerUnit: 10 });
    // 50 over [20, 30]: 20 and 30.
    expect([...minutesPerUnitOnVisit(50, [timed('a', 20), timed('b', 30)])]).toEqual([['a', 20], ['b', 30]]);
    // 45 over quantities [2, 1] (b is flat): 30 and 15; a per unit 15.
    expect([...minutesPerUnitOnVisit(45, [timed('a', 20, 2), timed('b', 0)])]).toEqual([['a', 15], ['b', 15]]);
  });

  it('calls an entry priced low or high beyond 25 % (at least 5 minutes) of its book minutes', () => {
    expect(minutesVerdict(20, 26)).toBe('priced-low');
    expect(minutesVerdict(20, 25)).toBe('about-right');
    expect(minutesVerdict(60, 44)).toBe('priced-high');
    expect(minutesVerdict(null, 44)).toBe('no-book-minutes');
  });
});

describe('single-visit completion rate', () => {
  it('counts first-visit finishes per code, electrician and month, and the return causes', () => {
    const r = (code: string, electricianName: string, month: string, isFirstVisit: boolean, returnCause: OutcomeRecord['returnCause'] = null): OutcomeRecord => ({ code, electricianName, month, isFirstVisit, returnCause });
    const rates = singleVisitRates([
      r('gfci-inoperative', 'Ana', '2026-11', true),
      r('gfci-inoperative', 'Ana', '2026-12', false, 'part-not-on-truck'),
      r('gfci-inoperative', 'Ben', '2026-12', true),
      r('double-tap', 'Ben', '2026-12', false, 'change-order'),
      r('double-tap', 'Ben', '2026-12', false, 'part-not-on-truck'),
    ]);
    expect(rates.overall).toEqual({ group: 'All items', items: 5, firstVisit: 2, rateBp: 4_000 });
    expect(rates.byCode).toEqual([
      { group: 'double-tap', items: 2, firstVisit: 0, rateBp: 0 },
      { group: 'gfci-inoperative', items: 3, firstVisit: 2, rateBp: 6_667 },
    ]);
    expect(rates.byElectrician.map((g) => [g.group, g.rateBp])).toEqual([['Ana', 5_000], ['Ben', 3_333]]);
    expect(rates.byMonth.map((g) => [g.group, g.items])).toEqual([['2026-11', 1], ['2026-12', 4]]);
    expect(rates.causes).toEqual([{ cause: 'part-not-on-truck', count: 2 }, { cause: 'change-order', count: 1 }]);
  });
});
