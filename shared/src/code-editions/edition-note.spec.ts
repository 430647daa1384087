import { editionNote, editionNoteForLocation } from './edition-note';

const house = (yearBuilt: number, necEdition: 2017 | 2020 | 2023) => ({ yearBuilt, necEdition });

describe('editionNote', () => {
  describe('for a 1978 house under a 2023 adoption', () => {
    // From memory (commonly quoted dates): GFCI at bathroom receptacles 1975, at the kitchen counter
    // within 6 ft of the sink 1987. Replacement rule: NFPA 70 (NEC) 2023, 406.4(D)(3).
    it('says the bathroom GFCI was required when the house was built', () => {
      const note = editionNote('gfci-missing', 'bathroom', house(1978, 2023));
      expect(note?.builtUnder).toBe('required-when-built');
      expect(note?.firstRequired).toBe(1975);
      expect(note?.text).toContain(
        'GFCI protection for bathroom receptacles was first required in 1975 (the year as commonly cited; check it in that edition), so this house was built under a code that asked for it.',
      );
      expect(note?.summary).toBe('GFCI: required when this 1978 house was built; required for any replacement today');
    });

    it('says the kitchen-counter GFCI came later: recommended, not a violation, but required for a replacement today', () => {
      const note = editionNote('gfci-missing', 'kitchen', house(1978, 2023));
      expect(note?.builtUnder).toBe('added-later');
      expect(note?.firstRequired).toBe(1987);
      expect(note?.text).toContain('kitchen counter-top receptacles within 6 ft of the sink was first required in 1987 (the year as commonly cited; check it in that edition), after this house was built.');
      expect(note?.text).toContain('recommended for safety, not a code violation of the original work');
      expect(note?.text).toContain('for any replacement today (NEC 406.4(D)(3))');
      expect(note?.text).toContain('authority having jurisdiction');
      expect(note?.summary).toMatch(/^GFCI: came in 1987 \(after this 1978 house was built\): a recommended upgrade; required for any replacement today$/);
    });
  });

  describe('for a kitchen in a 1990 house under a 2020 adoption', () => {
    // From memory: near the sink 1987, all counter-tops 1996. NFPA 70 (NEC) 2023, 210.8(A)(6): all
    // kitchen receptacles, not in a 2020 adoption.
    it('is partly required when built and names the rule the adopted edition does not hold yet', () => {
      const note = editionNote('gfci-missing', 'kitchen', house(1990, 2020));
      expect(note?.summary).toContain('partly required when this 1990 house was built');
      expect(note?.requiredSince).toBe(2005);
      expect(note?.requiredByAdoptedEdition).toBe(true);
      expect(note?.text).toContain('The 2020 edition does not yet ask for it for all kitchen receptacles (from the 2023 edition).');
    });
  });

  describe('for a missing GFCI in a laundry area', () => {
    // NFPA 70 (NEC) 2014, 210.8(A)(10): laundry areas.
    it('keeps the 2014 laundry-area rule as the main one', () => {
      const note = editionNote('gfci-missing', 'laundry', house(2010, 2017));
      expect(note?.requiredSince).toBe(2014);
      expect(note?.requiredByAdoptedEdition).toBe(true);
      expect(note?.reference).toContain('210.8(A)');
      expect(note?.reference).toContain('406.4(D)(3)');
      expect(note?.builtUnder).toBe('added-later');
    });
  });

  describe('for a finished basement rule', () => {
    // NFPA 70 (NEC) 2020, 210.8(A)(5): all basements.
    it('is not in a 2017 adoption and is in a 2020 adoption', () => {
      expect(editionNoteForLocation('gfci-missing', 'basements-all', house(2024, 2017))?.requiredByAdoptedEdition).toBe(false);
      expect(editionNoteForLocation('gfci-missing', 'basements-all', house(2024, 2020))?.requiredByAdoptedEdition).toBe(true);
      const under2017 = editionNoteForLocation('gfci-missing', 'basements-all', house(2024, 2017));
      expect(under2017?.text).toContain('does not ask for GFCI protection here');
      // A 2024 house where the 2017 edition is adopted was not built under the 2020 rule.
      expect(under2017?.builtUnder).toBe('not-in-local-edition');
      expect(under2017?.summary).toBe('GFCI: not asked for when this 2024 house was built: a recommended upgrade; not in the adopted 2017 edition');
    });
  });

  describe('for a missing AFCI', () => {
    // NFPA 70 (NEC) 1999, 210.12: bedroom receptacle outlets, effective 1 January 2002.
    it('names the edition and the date it took effect in a bedroom', () => {
      const note = editionNote('afci-missing', 'bedroom', house(1995, 2023));
      expect(note?.text).toContain('first required in the 1999 edition, in force from 2002, after this house was built');
      expect(note?.reference).toContain('406.4(D)(4)');
    });

    // NFPA 70 (NEC) 2014, 210.12(A): kitchens.
    it('points at 406.4(D)(4) for replacements in a kitchen', () => {
      const note = editionNote('afci-missing', 'kitchen', house(1960, 2017));
      expect(note?.requiredSince).toBe(2014);
      expect(note?.reference).toContain('406.4(D)(4)');
    });

    it('says a bathroom is not a listed AFCI room', () => {
      const note = editionNote('afci-missing', 'bathroom', house(1960, 2023));
      expect(note?.requiredSince).toBeNull();
      expect(note?.builtUnder).toBeNull();
      expect(note?.requiredByAdoptedEdition).toBe(false);
      expect(note?.text).toContain('does not list this room');
    });
  });

  describe('for a missing weather cover outdoors', () => {
    // From memory: weather-resistant receptacles 2008. NFPA 70 (NEC) 2014, 406.9(B)(1): in-use cover
    // listed by then, first edition not recorded.
    it('marks the weather-resistant date as from memory and the in-use cover as not recorded for an older house', () => {
      const note = editionNote('weather-cover-missing', 'exterior', house(1988, 2023));
      expect(note?.requiredSince).toBe(2014);
      expect(note?.text).toContain('the year as commonly cited');
      expect(note?.text).toContain('is not recorded here');
      expect(note?.builtUnder).toBe('not-recorded');
    });

    it('says in its short line what the long text says: one part not asked for, the other not recorded (2004 house)', () => {
      const note = editionNote('weather-cover-missing', 'exterior', house(2004, 2023));
      expect(note?.text).toContain('is not recorded here');
      expect(note?.summary).toContain('partly not asked for when this 2004 house was built, the rest not recorded');
      expect(note?.summary).not.toMatch(/: not asked for when/);
    });
  });

  describe('for a receptacle to replace', () => {
    // NFPA 70 (NEC) 2008, 406.11: tamper-resistant receptacles; replacements NEC 406.4(D)(5).
    it('says a replacement is tamper-resistant', () => {
      const note = editionNote('receptacle-damaged', 'bedroom', house(1974, 2020));
      expect(note?.builtUnder).toBe('added-later');
      expect(note?.text).toContain('406.4(D)(5)');
    });
  });

  describe('for other codes or places', () => {
    it('gives no note', () => {
      expect(editionNote('double-tap', 'panel', house(1978, 2020))).toBeNull();
      expect(editionNote('gfci-missing', 'unknown', house(1978, 2020))).toBeNull();
      expect(editionNoteForLocation('gfci-missing', 'no-such-place', house(1978, 2020))).toBeNull();
    });
  });
});
