import { AFCI_RULES, findRule, GFCI_RULES, WEATHER_RULES, type EditionRule } from './protection-history';

function since(rules: readonly EditionRule[], key: string): number | undefined {
  return findRule(rules, key)?.sinceEdition;
}

describe('GFCI_RULES (NEC 210.8(A))', () => {
  // Source: NFPA 70 210.8(A) edition history as summarised in the trade reference, section 2.1
  // (whole 2014 and 2023 columns checked against a local adoption ordinance and 2023 change summaries).
  it.each([
    // 2014 added laundry areas and tubs/showers, and deleted "other than kitchens" (all sinks) [checked summary].
    ['laundry-areas', 2014],
    ['tub-shower-6ft', 2014],
    ['sinks-all', 2014],
    // 2011 widened the sink rule to sinks outside kitchens [checked: IAEI history of 210.8(A)(7)].
    ['sinks-other-than-kitchen', 2011],
    // 2020 made all basements and indoor damp/wet locations GFCI locations [checked: 2020 change summaries].
    ['basements-all', 2020],
    ['indoor-damp-wet', 2020],
    // 2023 made all kitchen receptacles and sinks with food/beverage preparation GFCI locations [checked].
    ['kitchen-all-receptacles', 2023],
    ['sink-food-prep-areas', 2023],
  ])('first requires %s in the %i edition', (key, edition) => {
    expect(since(GFCI_RULES, key)).toBe(edition);
    expect(findRule(GFCI_RULES, key)?.isAtOrBefore).toBe(false);
  });

  // Source: same history, 2005 column: these locations are already listed in 2005; the history
  // does not say how much earlier, so the table stores 2005 marked "at or before".
  it.each(['bathrooms', 'garages', 'outdoors', 'crawl-spaces', 'basements-unfinished', 'kitchen-countertop', 'boathouses', 'sinks-laundry-utility-wet-bar'])(
    'marks %s as listed in 2005 or earlier',
    (key) => {
      const r = findRule(GFCI_RULES, key);
      expect(r?.sinceEdition).toBe(2005);
      expect(r?.isAtOrBefore).toBe(true);
    },
  );

  it('stores every rule under a location key, never a list position', () => {
    for (const r of GFCI_RULES) {
      expect(r.key).toMatch(/^[a-z0-9-]+$/);
      // Spa and hot-tub outlets are GFCI-protected under Article 680, not 210.8(A) (section from memory).
      expect(r.section).toBe(r.key === 'spa-hot-tub-outlets' ? '680.44' : '210.8(A)');
    }
    expect(new Set(GFCI_RULES.map((r) => r.key)).size).toBe(GFCI_RULES.length);
  });
});

describe('AFCI_RULES (NEC 210.12)', () => {
  // Source: NFPA 70 210.12 edition history as summarised in the trade reference, section 2.6:
  // 1999 bedroom receptacle outlets; 2008 family, dining, living rooms, dens, sunrooms, closets,
  // hallways and similar rooms; 2014 kitchens and laundry areas [all checked summaries].
  it.each([
    ['bedrooms', 1999],
    ['living-areas', 2008],
    ['dining-rooms', 2008],
    ['hallways', 2008],
    ['closets', 2008],
    ['kitchens', 2014],
    ['laundry-areas', 2014],
  ])('first requires %s in the %i edition', (key, edition) => {
    expect(since(AFCI_RULES, key)).toBe(edition);
  });
});

describe('WEATHER_RULES (NEC 406.9)', () => {
  // Source: trade reference section 2.5: weather-resistant receptacles first required in 2008 —
  // marked there as from memory, so the table flags it from memory too.
  it('flags the 2008 weather-resistant date as from memory', () => {
    const wr = findRule(WEATHER_RULES, 'weather-resistant-receptacles');
    expect(wr?.sinceEdition).toBe(2008);
    expect(wr?.isFromMemory).toBe(true);
  });

  // Source: trade reference section 2.5: the in-use (weatherproof with a plug inserted) rule is
  // quoted from the 2014/2017 text; the earliest edition is not given, hence "2014 or earlier".
  it('stores the in-use cover rule as 2014 or earlier', () => {
    const inUse = findRule(WEATHER_RULES, 'wet-location-in-use-cover');
    expect(inUse?.sinceEdition).toBe(2014);
    expect(inUse?.isAtOrBefore).toBe(true);
  });
});
