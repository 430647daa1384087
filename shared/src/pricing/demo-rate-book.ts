import type { RateBook, RateBookEntry, Material } from './rate-book.schema';

/*
 * Demo rate book of a fictional contractor, "Brightline Electric Co.". Used by the seeds, the
 * worked examples in docs/pricing.md and the tests.
 *
 * Every figure is common practice (no source): visit terms sit inside the ranges of the trade
 * reference's "How small contractors price service work" table, and each entry's labour minutes
 * and material costs inside its "Labour and materials per finding code" table (2025 US, one unit,
 * easy site). The minutesLow/minutesHigh pair of an entry is that table's range for the job.
 */

/** Shorthand for a time-and-materials entry; materials cost per unit is the sum of its list. */
function timed(
  id: string,
  code: string | null,
  name: string,
  unit: string,
  minutes: { priced: number; low: number; high: number },
  materials: Material[],
  markupBp: number | null = null,
): RateBookEntry {
  return {
    id,
    code,
    name,
    unit,
    pricing: {
      mode: 'time-and-materials',
      labourMinutesPerUnit: minutes.priced,
      materialsCentsPerUnit: materials.reduce((sum, m) => sum + m.quantityPerUnit * m.unitCostCents, 0),
      markupBp,
      materials,
      minutesLow: minutes.low,
      minutesHigh: minutes.high,
    },
  };
}

/** Shorthand for a flat-rate entry. */
function flat(
  id: string,
  code: string | null,
  name: string,
  unit: string,
  price: { first: number; additional: number; hardSiteBp: number },
): RateBookEntry {
  return {
    id,
    code,
    name,
    unit,
    pricing: { mode: 'flat', firstUnitCents: price.first, additionalUnitCents: price.additional, hardSiteMultiplierBp: price.hardSiteBp },
  };
}

const part = (name: string, unitCostCents: number, quantityPerUnit = 1): Material => ({ name, quantityPerUnit, unitCostCents });

const GFCI_15A = part('GFCI receptacle 15 A, TR/WR', 2_400);
const TR_RECEPTACLE = part('Tamper-resistant duplex receptacle 15 A', 350);
/** Small parts carry a higher markup (common practice: up to +100 %). */
const SMALL_PARTS_MARKUP_BP = 6_000;

export const DEMO_RATE_BOOK: RateBook = {
  contractorName: 'Brightline Electric Co.',
  terms: {
    serviceCallCents: 9_500, // $95 trip charge (range $75–200)
    firstHourMinimumCents: 18_500, // $185 travel + first hour (range $150–300)
    firstHourCoversMinutes: 60,
    hourlyRateCents: 13_500, // $135/h after the first hour (range $90–175)
    billingIncrementMinutes: 15,
    materialsMarkupBp: 3_500, // +35 % (range +20–50 %)
    materialsTaxBp: 600, // 6 % on materials, a state that taxes the materials line (configure per state)
    permit: { feeCents: 9_500, handlingCents: 4_500 }, // $95 fee + $45 handling (ranges $50–250, $25–75)
    cardDepositBp: 5_000, // 50 % deposit on card payment
    quoteValidityDays: 30,
    warrantyText:
      'Workmanship is warranted for one year from the date of the completion letter. Parts carry the manufacturer’s warranty.',
    visitCapacityMinutes: 480,
  },
  entries: [
    timed('gfci-receptacle-first-device', 'gfci-missing', 'Install GFCI receptacle at the first device of the run', 'device', { priced: 30, low: 25, high: 40 }, [GFCI_15A]),
    timed('gfci-breaker', 'gfci-missing', 'Install GFCI breaker', 'circuit', { priced: 25, low: 20, high: 35 }, [part('GFCI breaker, single pole', 5_500)]),
    timed('gfci-replace', 'gfci-inoperative', 'Replace inoperative GFCI receptacle', 'device', { priced: 20, low: 15, high: 25 }, [GFCI_15A]),
    // first GFCI $125–275, each additional in the same visit $60–150
    flat('gfci-replace-flat', 'gfci-inoperative', 'Replace GFCI receptacle, flat rate', 'device', { first: 17_500, additional: 8_500, hardSiteBp: 14_000 }),
    timed('afci-breaker', 'afci-missing', 'Install AFCI breaker', 'circuit', { priced: 30, low: 20, high: 40 }, [part('AFCI breaker, single pole', 5_500)]),
    // AFCI breaker flat $150–300
    flat('afci-breaker-flat', 'afci-missing', 'AFCI breaker upgrade, flat rate', 'circuit', { first: 22_500, additional: 17_500, hardSiteBp: 13_000 }),
    timed('afci-receptacle', 'afci-missing', 'Install outlet-branch-circuit AFCI receptacle', 'device', { priced: 25, low: 20, high: 30 }, [part('OBC AFCI receptacle', 3_800)]),
    timed('polarity-correct', 'reversed-polarity', 'Re-terminate reversed receptacle with new TR device', 'device', { priced: 12, low: 10, high: 15 }, [TR_RECEPTACLE], SMALL_PARTS_MARKUP_BP),
    timed('ground-reconnect', 'open-ground', 'Connect existing equipment ground', 'device', { priced: 12, low: 10, high: 15 }, [part('Ground pigtail and screw', 75)], SMALL_PARTS_MARKUP_BP),
    timed('ground-gfci-label', 'open-ground', 'GFCI-protect and label "No Equipment Ground"', 'device', { priced: 25, low: 20, high: 30 }, [GFCI_15A, part('"No Equipment Ground" labels', 100)]),
    timed('false-ground-remove', 'false-ground', 'Remove bootleg jumper, GFCI-protect and label', 'device', { priced: 35, low: 30, high: 45 }, [GFCI_15A, part('"No Equipment Ground" labels', 100)]),
    timed('receptacle-replace', 'receptacle-damaged', 'Replace damaged receptacle and plate', 'device', { priced: 15, low: 10, high: 20 }, [TR_RECEPTACLE, part('Cover plate', 200)], SMALL_PARTS_MARKUP_BP),
    timed('weather-cover', 'weather-cover-missing', 'Install in-use cover and WR receptacle', 'device', { priced: 25, low: 20, high: 30 }, [part('Extra-duty in-use cover', 1_800), part('WR duplex receptacle', 600)]),
    timed('cover-plate', 'cover-plate-missing', 'Install cover plate', 'plate', { priced: 4, low: 2, high: 5 }, [part('Cover plate', 200)], SMALL_PARTS_MARKUP_BP),
    timed('junction-blank-cover', 'open-junction-box', 'Install blank cover on junction box', 'box', { priced: 8, low: 5, high: 10 }, [part('Blank cover', 200)], SMALL_PARTS_MARKUP_BP),
    timed('junction-box-enclose', 'open-junction-box', 'Install box around loose splices', 'box', { priced: 45, low: 30, high: 60 }, [part('Junction box', 500), part('Cable clamp', 100, 2)]),
    timed('wiring-secure-run', 'exposed-wiring', 'Secure and protect an exposed cable run', 'run', { priced: 60, low: 30, high: 90 }, [part('Staples, box', 500), part('Raceway section', 1_500)]),
    timed('double-tap-pigtail', 'double-tap', 'Correct double tap with a pigtail', 'terminal', { priced: 20, low: 15, high: 30 }, [part('Pigtail and listed connector', 100)], SMALL_PARTS_MARKUP_BP),
    timed('breaker-swap', 'overcurrent-mismatch', 'Replace oversized breaker with correct rating', 'breaker', { priced: 20, low: 15, high: 30 }, [part('Breaker, single pole', 1_400)]),
    timed('dead-front-screws', 'panel-deficiency', 'Replace missing or pointed dead-front screws', 'panel', { priced: 8, low: 5, high: 10 }, [part('Listed dead-front screw set', 500)], SMALL_PARTS_MARKUP_BP),
    timed('panel-fillers', 'panel-deficiency', 'Install breaker filler or knockout closure', 'opening', { priced: 10, low: 5, high: 15 }, [part('Breaker filler', 600)]),
    timed('panel-directory', 'panel-deficiency', 'Trace circuits and write panel directory', 'panel', { priced: 60, low: 30, high: 90 }, []),
    timed('subpanel-separate', 'subpanel-bonding', 'Separate neutrals and grounds in subpanel', 'panel', { priced: 90, low: 45, high: 120 }, [part('Ground bar kit', 1_800)]),
    timed('water-pipe-bond', 'grounding-electrode', 'Install water-pipe bonding jumper', 'bond', { priced: 45, low: 30, high: 60 }, [part('Bonding clamp', 900), part('6 AWG bare copper (ft)', 225, 10)]),
    timed('smoke-alarm-sealed', 'smoke-co-alarm', 'Install sealed 10-year smoke alarm', 'alarm', { priced: 8, low: 5, high: 10 }, [part('Sealed 10-year smoke alarm', 3_000)]),
    timed('smoke-co-hardwired', 'smoke-co-alarm', 'Replace hard-wired smoke/CO alarm like for like', 'alarm', { priced: 20, low: 15, high: 25 }, [part('Hard-wired smoke/CO alarm', 4_800)]),
    timed('fixture-replace', 'light-fixture', 'Replace light fixture', 'fixture', { priced: 45, low: 30, high: 60 }, [part('Light fixture', 4_000)]),
    timed('fan-brace', 'fan-support', 'Install fan-rated retrofit brace and rehang fan', 'fan', { priced: 70, low: 45, high: 90 }, [part('Fan-rated brace box', 2_500)]),
    timed('switch-replace', 'switch-issue', 'Replace switch', 'switch', { priced: 15, low: 10, high: 20 }, [part('Single-pole switch', 350)], SMALL_PARTS_MARKUP_BP),
    timed('aluminum-evaluate', 'aluminum-branch-wiring', 'Evaluate aluminium branch wiring', 'house', { priced: 90, low: 60, high: 120 }, []),
    timed('aluminum-pigtail', 'aluminum-branch-wiring', 'Pigtail device with connectors listed for Al/Cu', 'device', { priced: 20, low: 15, high: 30 }, [part('Al/Cu listed connector', 300, 2)]),
    timed('knob-tube-evaluate', 'knob-and-tube', 'Evaluate knob-and-tube wiring', 'house', { priced: 120, low: 60, high: 180 }, []),
    timed('service-mast-repair', 'service-equipment', 'Repair service mast and drip loop', 'service', { priced: 240, low: 120, high: 360 }, [part('Mast kit, straps and weatherhead', 35_000)]),
    timed('general-evaluation', 'evaluate-general', 'Electrical evaluation visit', 'visit', { priced: 60, low: 30, high: 90 }, []),
    timed('custom-doorbell', null, 'Replace doorbell transformer (custom entry)', 'transformer', { priced: 30, low: 20, high: 45 }, [part('Doorbell transformer', 2_200)]),
  ],
  adders: [
    // common practice: shallow/full box +20–45 min per device
    { id: 'tight-box', name: 'Shallow or crowded box', effect: { kind: 'minutes-per-unit', minutes: 30 }, appliesWhenBuiltBefore: null },
    // line/load unclear at a GFCI +15 min
    { id: 'line-load-unclear', name: 'Line and load not marked', effect: { kind: 'minutes-per-unit', minutes: 15 }, appliesWhenBuiltBefore: null },
    // tile/stone at device ×1.2; metal box without ground ×1.2; plaster/lath ×1.2–1.4; pre-1960 ×1.3–1.5
    { id: 'tile-or-stone', name: 'Tile or stone around the device', effect: { kind: 'labour-multiplier', multiplierBp: 12_000 }, appliesWhenBuiltBefore: null },
    { id: 'metal-box-no-ground', name: 'Metal box without a ground path', effect: { kind: 'labour-multiplier', multiplierBp: 12_000 }, appliesWhenBuiltBefore: null },
    { id: 'plaster-walls', name: 'Plaster and lath walls', effect: { kind: 'labour-multiplier', multiplierBp: 13_000 }, appliesWhenBuiltBefore: null },
    { id: 'built-before-1960', name: 'House built before 1960', effect: { kind: 'labour-multiplier', multiplierBp: 14_000 }, appliesWhenBuiltBefore: 1960 },
    // panel shutoff (coordinate occupant, restart equipment) +15–30 min per visit
    { id: 'panel-shutoff', name: 'Panel shutoff for the visit', effect: { kind: 'minutes-per-visit', minutes: 20 }, appliesWhenBuiltBefore: null },
  ],
};
