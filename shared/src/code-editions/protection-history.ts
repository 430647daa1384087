/**
 * When NFPA 70 (the National Electrical Code) first asks for a protection at a location, per
 * location key. Values follow the edition history summarised in the project's trade reference
 * (section 2): 210.8(A) GFCI locations, 210.12 AFCI rooms, 406.9 damp/wet receptacles, 406.12
 * tamper-resistant receptacles. List positions inside 210.8(A) move between editions, so a rule is
 * stored as a location key plus the edition, never as an item number.
 *
 * Two kinds of date sit on each rule:
 * - `sinceEdition`: the first edition of the 2005-2023 history that lists the place. `isAtOrBefore`
 *   marks values taken from the first column of that history (2005): the place is already listed
 *   there. These values drive the comparison with the locally adopted edition (new work and
 *   replacements today).
 * - `firstYear`: the year the NEC first asked for it in dwellings, reaching back before 2005, so that
 *   a house can be compared with the code in force when it was built. Null when the history does
 *   not say how far back a 2005 listing goes. Most pre-2005 years are the dates inspectors commonly
 *   quote and are flagged `isFirstYearFromMemory`.
 */
export interface EditionRule {
  /** Stable key of the location ("laundry-areas", "kitchen-all-receptacles"). */
  readonly key: string;
  /** The location in plain words, as it reads in a sentence. */
  readonly label: string;
  /** The NEC section that carries the rule (2017-2023 numbering). */
  readonly section: string;
  /** First edition (in the 2005-2023 history) that requires the protection there. */
  readonly sinceEdition: number;
  readonly isAtOrBefore: boolean;
  /** Whether `sinceEdition` is from memory rather than from a checked summary. */
  readonly isFromMemory: boolean;
  /** Year the NEC first required it in dwellings; null when not recorded (only "by 2005"). */
  readonly firstYear: number | null;
  /** Year the first requirement took effect when that was later than its edition (AFCI: 1999 → 2002). */
  readonly firstInForce: number | null;
  readonly isFirstYearFromMemory: boolean;
}

interface RuleFlags {
  isAtOrBefore?: boolean;
  isFromMemory?: boolean;
  /** Year first required, when earlier than `sinceEdition` or when `sinceEdition` is only "at or before". */
  firstYear?: number | null;
  firstInForce?: number;
  isFirstYearFromMemory?: boolean;
}

const rule = (key: string, label: string, section: string, sinceEdition: number, flags: RuleFlags = {}): EditionRule => {
  const isAtOrBefore = flags.isAtOrBefore ?? false;
  const isFromMemory = flags.isFromMemory ?? false;
  // A rule first listed after 2005 came in with that edition; a 2005 listing says nothing about earlier years.
  const firstYear = flags.firstYear !== undefined ? flags.firstYear : isAtOrBefore ? null : sinceEdition;
  return {
    key,
    label,
    section,
    sinceEdition,
    isAtOrBefore,
    isFromMemory,
    firstYear,
    firstInForce: flags.firstInForce ?? null,
    isFirstYearFromMemory: flags.isFirstYearFromMemory ?? isFromMemory,
  };
};

const FIRST_COLUMN = { isAtOrBefore: true } as const;
/** Listed in the 2005 column; first required in `year`, a commonly quoted date (from memory). */
const firstQuoted = (year: number): RuleFlags => ({ isAtOrBefore: true, firstYear: year, isFirstYearFromMemory: true });

/** NEC 210.8(A), dwelling-unit GFCI protection of receptacles, by location (680.44 for spa outlets). */
export const GFCI_RULES: readonly EditionRule[] = [
  rule('outdoors', 'outdoor receptacles', '210.8(A)', 2005, firstQuoted(1973)),
  rule('bathrooms', 'bathroom receptacles', '210.8(A)', 2005, firstQuoted(1975)),
  rule('garages', 'garage receptacles', '210.8(A)', 2005, firstQuoted(1978)),
  rule('spa-hot-tub-outlets', 'outlets supplying a spa or hot tub', '680.44', 2005, { ...firstQuoted(1981), isFromMemory: true }),
  rule('kitchen-countertop-near-sink', 'kitchen counter-top receptacles within 6 ft of the sink', '210.8(A)', 2005, firstQuoted(1987)),
  rule('accessory-buildings', 'receptacles in accessory buildings with a floor at or below grade', '210.8(A)', 2005, FIRST_COLUMN),
  rule('crawl-spaces', 'receptacles in crawl spaces at or below grade', '210.8(A)', 2005, firstQuoted(1990)),
  rule('basements-unfinished', 'receptacles in unfinished basements', '210.8(A)', 2005, firstQuoted(1990)),
  rule('basements-all', 'receptacles in finished and unfinished basements', '210.8(A)', 2020),
  rule('sinks-wet-bar', 'receptacles within 6 ft of a wet-bar sink', '210.8(A)', 2005, firstQuoted(1993)),
  rule('kitchen-countertop', 'all kitchen counter-top receptacles', '210.8(A)', 2005, firstQuoted(1996)),
  rule('kitchen-all-receptacles', 'all kitchen receptacles', '210.8(A)', 2023),
  rule('sinks-laundry-utility-wet-bar', 'receptacles within 6 ft of laundry and utility sinks', '210.8(A)', 2005, firstQuoted(2005)),
  rule('sinks-other-than-kitchen', 'receptacles within 6 ft of sinks outside kitchens', '210.8(A)', 2011),
  rule('sinks-all', 'receptacles within 6 ft of any sink', '210.8(A)', 2014),
  rule('sink-food-prep-areas', 'receptacles at a sink with permanent food or beverage preparation or cooking', '210.8(A)', 2023),
  rule('boathouses', 'boathouse receptacles', '210.8(A)', 2005, FIRST_COLUMN),
  rule('tub-shower-6ft', 'receptacles within 6 ft of a bathtub or shower stall', '210.8(A)', 2014),
  rule('laundry-areas', 'laundry-area receptacles', '210.8(A)', 2014),
  rule('indoor-damp-wet', 'receptacles in indoor damp and wet locations', '210.8(A)', 2020),
];

/** NEC 210.12, dwelling-unit AFCI protection, by room. */
export const AFCI_RULES: readonly EditionRule[] = [
  rule('bedrooms', 'bedroom receptacle outlets', '210.12', 1999, { firstInForce: 2002 }),
  rule('bedrooms-all-outlets', 'all bedroom outlets (lighting included)', '210.12', 2002),
  rule('living-areas', 'family rooms, living rooms, parlours, dens, sunrooms and recreation rooms', '210.12', 2008),
  rule('dining-rooms', 'dining rooms', '210.12', 2008),
  rule('hallways', 'hallways', '210.12', 2008),
  rule('closets', 'closets', '210.12', 2008),
  rule('libraries-dens-similar', 'libraries, dens and similar rooms (an office is read as one)', '210.12', 2008),
  rule('kitchens', 'kitchens', '210.12', 2014),
  rule('laundry-areas', 'laundry areas', '210.12', 2014),
];

/** NEC 406.9, receptacles in damp and wet locations. */
export const WEATHER_RULES: readonly EditionRule[] = [
  rule('wet-location-in-use-cover', 'wet locations (a cover that stays weatherproof with a plug in: the in-use cover)', '406.9(B)(1)', 2014, FIRST_COLUMN),
  rule('weather-resistant-receptacles', 'damp and wet locations (weather-resistant, WR, receptacles)', '406.9', 2008, { isFromMemory: true }),
];

/** NEC 406.12 (406.11 in the 2008 edition), tamper-resistant receptacles in dwellings. */
export const TAMPER_RESISTANT_RULES: readonly EditionRule[] = [
  rule('tamper-resistant', 'receptacles throughout a dwelling (the areas of 210.52)', '406.12', 2008),
];

/** Every location of the history, across the protections. */
export const PROTECTION_HISTORY = {
  gfci: GFCI_RULES,
  afci: AFCI_RULES,
  weather: WEATHER_RULES,
  'tamper-resistant': TAMPER_RESISTANT_RULES,
} as const;

export function findRule(rules: readonly EditionRule[], key: string): EditionRule | undefined {
  return rules.find((r) => r.key === key);
}

/** How a house compares with one rule, by the year it was built. */
export const BUILT_UNDER = ['required-when-built', 'came-in-that-year', 'added-later', 'not-recorded', 'not-in-local-edition'] as const;
export type BuiltUnder = (typeof BUILT_UNDER)[number];

/**
 * Whether the code in force when the house was built asked for the protection: the first year it
 * took effect against the year built. The year it came in is "that year" (local adoption lags the
 * edition, so it could go either way); without a first year, a house built after the 2005 listing
 * was built under it and an older one is not recorded. Given the edition adopted where the house
 * is, a rule that edition does not hold yet cannot have applied to a house built since it came in.
 */
export function builtUnder(r: EditionRule, yearBuilt: number, adopted?: number): BuiltUnder {
  const first = r.firstInForce ?? r.firstYear;
  let status: BuiltUnder;
  if (first === null) status = yearBuilt > r.sinceEdition ? 'required-when-built' : 'not-recorded';
  else if (yearBuilt > first) status = 'required-when-built';
  else status = yearBuilt === first ? 'came-in-that-year' : 'added-later';
  if (adopted !== undefined && r.sinceEdition > adopted && status !== 'added-later') return 'not-in-local-edition';
  return status;
}
