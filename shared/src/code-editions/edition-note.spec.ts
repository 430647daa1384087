import { editionNote, editionNoteForLocation } from './edition-note';

describe('editionNote', () => {
  describe('for a missing GFCI in a laundry area', () => {
    // Source: NFPA 70 (NEC) 2014, 210.8(A)(10): laundry areas, new in that edition (as quoted in 2014
    // code-change summaries; docs/trade-facts.md).
    it('is required under a 2017 adoption, and says so as information', () => {
      const note = editionNote('gfci-missing', 'laundry', 2017);
      expect(note?.requiredSince).toBe(2014);
      expect(note?.requiredByAdoptedEdition).toBe(true);
      expect(note?.reference).toContain('210.8(A)');
      expect(note?.text).toMatch(/^Information only/);
      expect(note?.text).toContain('not required to be brought up to the current edition');
      expect(note?.text).toContain('406.4(D)(3)');
    });
  });

  describe('for a missing GFCI in a kitchen', () => {
    // Source: NFPA 70 (NEC) 2005–2020, 210.8(A)(6): kitchen counter-top receptacles; NFPA 70 (NEC) 2023,
    // 210.8(A)(6): all kitchen receptacles (2023 change summaries; docs/trade-facts.md).
    it('keeps the countertop rule and says the all-receptacle rule is not in a 2020 adoption', () => {
      const note = editionNote('gfci-missing', 'kitchen', 2020);
      expect(note?.requiredSince).toBe(2005);
      expect(note?.requiredByAdoptedEdition).toBe(true);
      expect(note?.text).toContain('2005 edition or earlier');
      expect(note?.text).toMatch(/all kitchen receptacles since the 2023 edition; the adopted 2020 edition does not include this/);
    });
  });

  describe('for a finished basement rule', () => {
    // Source: NFPA 70 (NEC) 2020, 210.8(A)(5): all basements, finished or not (2020 change summaries).
    it('is not in a 2017 adoption and is in a 2020 adoption', () => {
      expect(editionNoteForLocation('gfci-missing', 'basements-all', 2017)?.requiredByAdoptedEdition).toBe(false);
      expect(editionNoteForLocation('gfci-missing', 'basements-all', 2020)?.requiredByAdoptedEdition).toBe(true);
    });
  });

  describe('for a missing AFCI', () => {
    // Source: NFPA 70 (NEC) 2014, 210.12(A): kitchens and laundry areas added to the AFCI list; bathrooms
    // are not in it (2014 change summaries; docs/trade-facts.md).
    it('points at 406.4(D)(4) for replacements in a kitchen', () => {
      const note = editionNote('afci-missing', 'kitchen', 2017);
      expect(note?.requiredSince).toBe(2014);
      expect(note?.reference).toContain('406.4(D)(4)');
    });

    it('says a bathroom is not a listed AFCI room', () => {
      const note = editionNote('afci-missing', 'bathroom', 2023);
      expect(note?.requiredSince).toBeNull();
      expect(note?.requiredByAdoptedEdition).toBe(false);
      expect(note?.text).toContain('does not list this room');
    });
  });

  describe('for a missing weather cover outdoors', () => {
    it('marks the weather-resistant date as from memory', () => {
      const note = editionNote('weather-cover-missing', 'exterior', 2023);
      expect(note?.requiredSince).toBe(2014);
      expect(note?.text).toContain('from memory');
    });
  });

  describe('for other codes or places', () => {
    it('gives no note', () => {
      expect(editionNote('double-tap', 'panel', 2020)).toBeNull();
      expect(editionNote('gfci-missing', 'unknown', 2020)).toBeNull();
      expect(editionNoteForLocation('gfci-missing', 'no-such-place', 2020)).toBeNull();
    });
  });
});
