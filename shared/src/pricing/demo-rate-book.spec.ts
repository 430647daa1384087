// Sources:
// - the finding codes: the project's finding-code list (spec "Finding codes", every code in its table);
// - labour and material ranges per entry: common practice, no published source (docs/trade-facts.md, "Labour and materials per finding
//   code" (common practice, no source; 2025 US, one unit, easy site), transcribed below in cents;
// - visit terms and flat prices: common practice, no published source (docs/trade-facts.md, "How small contractors price service
//   work" (common practice, no source).
import { DEMO_RATE_BOOK } from './demo-rate-book';
import { RateBookSchema } from './rate-book.schema';

const FINDING_CODES = [
  'gfci-missing', 'gfci-inoperative', 'afci-missing', 'reversed-polarity', 'open-ground', 'false-ground',
  'receptacle-damaged', 'weather-cover-missing', 'cover-plate-missing', 'open-junction-box', 'exposed-wiring',
  'double-tap', 'overcurrent-mismatch', 'panel-deficiency', 'subpanel-bonding', 'grounding-electrode',
  'smoke-co-alarm', 'light-fixture', 'fan-support', 'switch-issue', 'aluminum-branch-wiring', 'knob-and-tube',
  'service-equipment', 'evaluate-general',
];

/** entry id → [min minutes, max minutes, min materials cents, max materials cents] (section 5). */
const ENTRY_RANGES: Record<string, [number, number, number, number]> = {
  'gfci-receptacle-first-device': [25, 40, 1_800, 3_000], // GFCI receptacle at first device; GFCI 15 A 18–30
  'gfci-breaker': [20, 35, 4_000, 7_000],
  'gfci-replace': [15, 25, 1_800, 3_000],
  'afci-breaker': [20, 40, 4_000, 7_000],
  'afci-receptacle': [20, 30, 3_000, 4_500],
  'polarity-correct': [10, 15, 200, 500],
  'ground-reconnect': [10, 15, 0, 100], // pigtail/screw < $1
  'ground-gfci-label': [20, 30, 1_800, 3_100], // GFCI 18–30 plus small parts < $1
  'false-ground-remove': [30, 45, 1_800, 3_100], // remove jumper 10–15 + GFCI and labels 20–30
  'receptacle-replace': [10, 20, 300, 800], // TR 2–5 + plate 1–3
  'weather-cover': [20, 30, 1_400, 3_800], // in-use cover 10–30 + WR duplex 4–8
  'cover-plate': [2, 5, 100, 500],
  'junction-blank-cover': [5, 10, 100, 300],
  'junction-box-enclose': [30, 60, 300, 1_100], // box 2–8 + clamps 1–3
  'wiring-secure-run': [30, 90, 1_000, 3_000], // staples 5/box + raceway 5–25
  'double-tap-pigtail': [15, 30, 0, 100],
  'breaker-swap': [15, 30, 800, 2_000],
  'dead-front-screws': [5, 10, 300, 800],
  'panel-fillers': [5, 15, 200, 1_000],
  'panel-directory': [30, 90, 0, 0],
  'subpanel-separate': [45, 120, 1_000, 2_500],
  'water-pipe-bond': [30, 60, 1_800, 4_500], // clamp 3–15 + 10 ft of 6 AWG at 1.50–3/ft
  'smoke-alarm-sealed': [5, 10, 2_000, 4_000],
  'smoke-co-hardwired': [15, 25, 3_500, 6_000],
  'fixture-replace': [30, 60, 2_000, 6_000],
  'fan-brace': [45, 90, 1_500, 3_500],
  'switch-replace': [10, 20, 200, 500],
  'aluminum-evaluate': [60, 120, 0, 0],
  'aluminum-pigtail': [15, 30, 400, 800], // two connectors at 2–4
  'knob-tube-evaluate': [60, 180, 0, 0],
  'service-mast-repair': [120, 360, 5_000, 100_000],
  'general-evaluation': [30, 90, 0, 0],
};

/** flat entry id → [first unit min, max, each additional min, max] (section 6). */
const FLAT_RANGES: Record<string, [number, number, number, number]> = {
  'gfci-replace-flat': [12_500, 27_500, 6_000, 15_000], // first GFCI $125–275, each additional $60–150
  'afci-breaker-flat': [15_000, 30_000, 15_000, 30_000], // AFCI breaker $150–300
};

describe('DEMO_RATE_BOOK', () => {
  it('is a valid rate book', () => {
    expect(RateBookSchema.parse(DEMO_RATE_BOOK)).toEqual(DEMO_RATE_BOOK);
  });

  it.each(FINDING_CODES)('has an entry for %s', (code) => {
    expect(DEMO_RATE_BOOK.entries.some((e) => e.code === code)).toBe(true);
  });

  it('uses no code outside the finding-code list', () => {
    const codes = DEMO_RATE_BOOK.entries.map((e) => e.code).filter((c): c is string => c !== null);
    expect(codes.filter((c) => !FINDING_CODES.includes(c))).toEqual([]);
  });

  describe.each(DEMO_RATE_BOOK.entries.filter((e) => e.code !== null).map((e) => [e.id, e] as const))('entry %s', (id, entry) => {
    const pricing = entry.pricing;
    if (pricing.mode === 'time-and-materials') {
      it('has labour minutes and materials inside the common-practice ranges', () => {
        const [minMinutes, maxMinutes, minMaterials, maxMaterials] = ENTRY_RANGES[id];
        for (const m of [pricing.minutesLow, pricing.labourMinutesPerUnit, pricing.minutesHigh]) {
          expect(m).toBeGreaterThanOrEqual(minMinutes);
          expect(m).toBeLessThanOrEqual(maxMinutes);
        }
        expect(pricing.minutesLow).toBe(minMinutes);
        expect(pricing.minutesHigh).toBe(maxMinutes);
        expect(pricing.materialsCentsPerUnit).toBeGreaterThanOrEqual(minMaterials);
        expect(pricing.materialsCentsPerUnit).toBeLessThanOrEqual(maxMaterials);
      });
    } else {
      it('has first-unit and each-additional prices inside the common-practice ranges', () => {
        const [firstMin, firstMax, addMin, addMax] = FLAT_RANGES[id];
        expect(pricing.firstUnitCents).toBeGreaterThanOrEqual(firstMin);
        expect(pricing.firstUnitCents).toBeLessThanOrEqual(firstMax);
        expect(pricing.additionalUnitCents).toBeGreaterThanOrEqual(addMin);
        expect(pricing.additionalUnitCents).toBeLessThanOrEqual(addMax);
      });
    }
  });

  it.each([
    ['serviceCallCents', 7_500, 20_000], //      trip / service call $75–200
    ['firstHourMinimumCents', 15_000, 30_000], // minimum first hour $150–300
    ['hourlyRateCents', 9_000, 17_500], //        labour after the first hour $90–175/h
    ['materialsMarkupBp', 2_000, 5_000], //       materials +20–50 %
  ] as const)('sets %s inside the common-practice range', (field, min, max) => {
    expect(DEMO_RATE_BOOK.terms[field]).toBeGreaterThanOrEqual(min);
    expect(DEMO_RATE_BOOK.terms[field]).toBeLessThanOrEqual(max);
  });

  it('bills in 15- or 30-minute increments, passes a permit through within $50–250 + $25–75 (common practice)', () => {
    const { billingIncrementMinutes, permit } = DEMO_RATE_BOOK.terms;
    expect([15, 30]).toContain(billingIncrementMinutes);
    expect(permit.feeCents).toBeGreaterThanOrEqual(5_000);
    expect(permit.feeCents).toBeLessThanOrEqual(25_000);
    expect(permit.handlingCents).toBeGreaterThanOrEqual(2_500);
    expect(permit.handlingCents).toBeLessThanOrEqual(7_500);
  });

  it.each([
    ['plaster-walls', 12_000, 14_000], //     plaster/lath ×1.2–1.4
    ['built-before-1960', 13_000, 15_000], // pre-~1960 house ×1.3–1.5
    ['tile-or-stone', 12_000, 12_000], //     tile/stone at device ×1.2
    ['metal-box-no-ground', 12_000, 12_000], // metal box without ground ×1.2
  ])('sets the %s multiplier inside the common-practice range', (id, min, max) => {
    const effect = DEMO_RATE_BOOK.adders.find((a) => a.id === id)?.effect;
    expect(effect?.kind).toBe('labour-multiplier');
    const bp = effect?.kind === 'labour-multiplier' ? effect.multiplierBp : 0;
    expect(bp).toBeGreaterThanOrEqual(min);
    expect(bp).toBeLessThanOrEqual(max);
  });
});
