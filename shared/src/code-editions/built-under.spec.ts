import { builtUnder, PROTECTION_HISTORY, type BuiltUnder, type EditionRule } from './protection-history';

/**
 * Every location of the protection history against a set of build years. Each row names the
 * published source of its first year (NFPA 70 edition and section) or says "from memory" for the
 * dates inspectors commonly quote that no checked source confirms here.
 *
 * Expected outcomes, one letter per build year: R = required by the code in force when built,
 * L = added later (a recommended upgrade), Y = came in that very year (depends on local adoption),
 * N = not recorded (listed by 2005, first year unknown here).
 */
const YEARS = [1960, 1974, 1976, 1986, 1988, 1995, 2004, 2010, 2024] as const;
const LETTER: Record<string, BuiltUnder> = { R: 'required-when-built', L: 'added-later', Y: 'came-in-that-year', N: 'not-recorded' };
const FROM_MEMORY = 'from memory';

type Row = [protection: keyof typeof PROTECTION_HISTORY, key: string, firstYear: number | null, source: string, expected: string];

const ROWS: Row[] = [
  // GFCI, NEC 210.8(A) (spa outlets: Article 680)
  ['gfci', 'outdoors', 1973, FROM_MEMORY, 'LRRRRRRRR'],
  ['gfci', 'bathrooms', 1975, FROM_MEMORY, 'LLRRRRRRR'],
  ['gfci', 'garages', 1978, FROM_MEMORY, 'LLLRRRRRR'],
  ['gfci', 'spa-hot-tub-outlets', 1981, FROM_MEMORY, 'LLLRRRRRR'],
  ['gfci', 'kitchen-countertop-near-sink', 1987, FROM_MEMORY, 'LLLLRRRRR'],
  ['gfci', 'accessory-buildings', null, 'NFPA 70 (NEC) 2005, 210.8(A) (listed; earlier editions not recorded)', 'NNNNNNNRR'],
  ['gfci', 'crawl-spaces', 1990, FROM_MEMORY, 'LLLLLRRRR'],
  ['gfci', 'basements-unfinished', 1990, FROM_MEMORY, 'LLLLLRRRR'],
  ['gfci', 'basements-all', 2020, 'NFPA 70 (NEC) 2020, 210.8(A)(5)', 'LLLLLLLLR'],
  ['gfci', 'sinks-wet-bar', 1993, FROM_MEMORY, 'LLLLLRRRR'],
  ['gfci', 'kitchen-countertop', 1996, FROM_MEMORY, 'LLLLLLRRR'],
  ['gfci', 'kitchen-all-receptacles', 2023, 'NFPA 70 (NEC) 2023, 210.8(A)(6)', 'LLLLLLLLR'],
  ['gfci', 'sinks-laundry-utility-wet-bar', 2005, FROM_MEMORY, 'LLLLLLLRR'],
  ['gfci', 'sinks-other-than-kitchen', 2011, 'NFPA 70 (NEC) 2011, 210.8(A)(7)', 'LLLLLLLLR'],
  ['gfci', 'sinks-all', 2014, 'NFPA 70 (NEC) 2014, 210.8(A)(7)', 'LLLLLLLLR'],
  ['gfci', 'sink-food-prep-areas', 2023, 'NFPA 70 (NEC) 2023, 210.8(A)(7)', 'LLLLLLLLR'],
  ['gfci', 'boathouses', null, 'NFPA 70 (NEC) 2005, 210.8(A) (listed; earlier editions not recorded)', 'NNNNNNNRR'],
  ['gfci', 'tub-shower-6ft', 2014, 'NFPA 70 (NEC) 2014, 210.8(A)(9)', 'LLLLLLLLR'],
  ['gfci', 'laundry-areas', 2014, 'NFPA 70 (NEC) 2014, 210.8(A)(10)', 'LLLLLLLLR'],
  ['gfci', 'indoor-damp-wet', 2020, 'NFPA 70 (NEC) 2020, 210.8(A)(11)', 'LLLLLLLLR'],
  // AFCI, NEC 210.12
  ['afci', 'bedrooms', 1999, 'NFPA 70 (NEC) 1999, 210.12 (effective 1 January 2002)', 'LLLLLLRRR'],
  ['afci', 'bedrooms-all-outlets', 2002, 'NFPA 70 (NEC) 2002, 210.12', 'LLLLLLRRR'],
  ['afci', 'living-areas', 2008, 'NFPA 70 (NEC) 2008, 210.12(B)', 'LLLLLLLRR'],
  ['afci', 'dining-rooms', 2008, 'NFPA 70 (NEC) 2008, 210.12(B)', 'LLLLLLLRR'],
  ['afci', 'hallways', 2008, 'NFPA 70 (NEC) 2008, 210.12(B)', 'LLLLLLLRR'],
  ['afci', 'closets', 2008, 'NFPA 70 (NEC) 2008, 210.12(B)', 'LLLLLLLRR'],
  ['afci', 'libraries-dens-similar', 2008, 'NFPA 70 (NEC) 2008, 210.12(B)', 'LLLLLLLRR'],
  ['afci', 'kitchens', 2014, 'NFPA 70 (NEC) 2014, 210.12(A)', 'LLLLLLLLR'],
  ['afci', 'laundry-areas', 2014, 'NFPA 70 (NEC) 2014, 210.12(A)', 'LLLLLLLLR'],
  // Damp and wet locations, NEC 406.9
  ['weather', 'wet-location-in-use-cover', null, 'NFPA 70 (NEC) 2014, 406.9(B)(1) (listed; earlier editions not recorded)', 'NNNNNNNNR'],
  ['weather', 'weather-resistant-receptacles', 2008, FROM_MEMORY, 'LLLLLLLRR'],
  // Tamper-resistant receptacles
  ['tamper-resistant', 'tamper-resistant', 2008, 'NFPA 70 (NEC) 2008, 406.11', 'LLLLLLLRR'],
];

function ruleOf(protection: Row[0], key: string): EditionRule {
  const r = (PROTECTION_HISTORY[protection] as readonly EditionRule[]).find((x) => x.key === key);
  if (!r) throw new Error(`No rule ${protection}/${key}`);
  return r;
}

describe('the protection history against the year a house was built', () => {
  it('has a row here for every location of the history', () => {
    const inHistory = Object.entries(PROTECTION_HISTORY).flatMap(([p, rules]) => rules.map((r) => `${p}/${r.key}`));
    expect(ROWS.map(([p, k]) => `${p}/${k}`).sort()).toEqual(inHistory.sort());
  });

  describe.each(ROWS)('%s %s (first %s; source: %s)', (protection, key, firstYear, source, expected) => {
    const r = ruleOf(protection, key);

    it('stores the first year and marks it from memory exactly when no published source is named', () => {
      expect(r.firstYear).toBe(firstYear);
      if (firstYear !== null) expect(r.isFirstYearFromMemory).toBe(source === FROM_MEMORY);
    });

    it.each(YEARS.map((year, i) => [year, LETTER[expected[i]]] as const))('a house built in %i: %s', (year, outcome) => {
      expect(builtUnder(r, year)).toBe(outcome);
    });
  });

  // Source: NFPA 70 (NEC) 1999, 210.12: bedroom AFCI effective 1 January 2002, so a house built in
  // 2000 under the 1999 edition was not yet asked for it.
  it('compares the AFCI bedroom rule with the date it took effect, not the edition', () => {
    const bedrooms = ruleOf('afci', 'bedrooms');
    expect(builtUnder(bedrooms, 2000)).toBe('added-later');
    expect(builtUnder(bedrooms, 2002)).toBe('came-in-that-year');
    expect(builtUnder(bedrooms, 2003)).toBe('required-when-built');
  });

  // NFPA 70 (NEC) 2023, 210.8(A)(6): where the 2020 edition is still adopted, a 2024 house was not
  // built under the all-kitchen-receptacles rule; where 2023 is adopted, it was.
  it('takes the locally adopted edition into account when given', () => {
    const allKitchen = ruleOf('gfci', 'kitchen-all-receptacles');
    expect(builtUnder(allKitchen, 2024, 2020)).toBe('not-in-local-edition');
    expect(builtUnder(allKitchen, 2024, 2023)).toBe('required-when-built');
    expect(builtUnder(allKitchen, 1995, 2020)).toBe('added-later');
  });

  // From memory: bathrooms 1975. The year an edition came out is not the year a town adopted it.
  it('leaves the year a rule came in open', () => {
    expect(builtUnder(ruleOf('gfci', 'bathrooms'), 1975)).toBe('came-in-that-year');
  });
});
