/**
 * When NFPA 70 (the National Electrical Code) first asks for a protection at a location, per
 * location key and edition. Values follow the edition history summarised in the project's trade
 * reference (section 2): 210.8(A) GFCI locations, 210.12 AFCI rooms, 406.9 damp/wet receptacles.
 * List positions inside 210.8(A) move between editions, so a rule is stored as a location key
 * plus the edition, never as an item number.
 *
 * `isAtOrBefore` marks values taken from the first column of that history (2005): the location is
 * already listed there, and the history does not say how much earlier it was added.
 */
export interface EditionRule {
  /** Stable key of the location ("laundry-areas", "kitchen-all-receptacles"). */
  readonly key: string;
  /** The location in plain words, as it reads in a sentence. */
  readonly label: string;
  /** The NEC section that carries the rule. */
  readonly section: string;
  /** First edition (in the history) that requires the protection there. */
  readonly sinceEdition: number;
  readonly isAtOrBefore: boolean;
  /** Whether the value is from memory rather than from a checked summary. */
  readonly isFromMemory: boolean;
}

const rule = (
  key: string,
  label: string,
  section: string,
  sinceEdition: number,
  flags: { isAtOrBefore?: boolean; isFromMemory?: boolean } = {},
): EditionRule => ({
  key,
  label,
  section,
  sinceEdition,
  isAtOrBefore: flags.isAtOrBefore ?? false,
  isFromMemory: flags.isFromMemory ?? false,
});

const FIRST_COLUMN = { isAtOrBefore: true } as const;

/** NEC 210.8(A), dwelling-unit GFCI protection of receptacles, by location. */
export const GFCI_RULES: readonly EditionRule[] = [
  rule('bathrooms', 'bathroom receptacles', '210.8(A)', 2005, FIRST_COLUMN),
  rule('garages', 'garage receptacles', '210.8(A)', 2005, FIRST_COLUMN),
  rule('accessory-buildings', 'receptacles in accessory buildings with a floor at or below grade', '210.8(A)', 2005, FIRST_COLUMN),
  rule('outdoors', 'outdoor receptacles', '210.8(A)', 2005, FIRST_COLUMN),
  rule('crawl-spaces', 'receptacles in crawl spaces at or below grade', '210.8(A)', 2005, FIRST_COLUMN),
  rule('basements-unfinished', 'receptacles in unfinished basements', '210.8(A)', 2005, FIRST_COLUMN),
  rule('basements-all', 'receptacles in finished and unfinished basements', '210.8(A)', 2020),
  rule('kitchen-countertop', 'kitchen countertop receptacles', '210.8(A)', 2005, FIRST_COLUMN),
  rule('kitchen-all-receptacles', 'all kitchen receptacles', '210.8(A)', 2023),
  rule('sinks-laundry-utility-wet-bar', 'receptacles within 6 ft of laundry, utility and wet-bar sinks', '210.8(A)', 2005, FIRST_COLUMN),
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
  rule('bedrooms', 'bedroom outlets', '210.12', 1999),
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
  rule('wet-location-in-use-cover', 'wet-location receptacles with a cover that is weatherproof with a plug inserted (in-use cover)', '406.9(B)(1)', 2014, FIRST_COLUMN),
  rule('weather-resistant-receptacles', 'weather-resistant (WR) receptacles in damp and wet locations', '406.9', 2008, { isFromMemory: true }),
];

export function findRule(rules: readonly EditionRule[], key: string): EditionRule | undefined {
  return rules.find((r) => r.key === key);
}
