import { editionNote, editionNoteForLocation } from './edition-note';

describe('editionNote', () => {
  describe('for a missing GFCI in a laundry area', () => {
    // Source: trade reference section 2.1: laundry areas added in the 2014 edition.
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
    // Source: trade reference section 2.1: countertop receptacles in every column from 2005; all
    // kitchen receptacles only from 2023.
    it('keeps the countertop rule and says the all-receptacle rule is not in a 2020 adoption', () => {
      const note = editionNote('gfci-missing', 'kitchen', 2020);
      expect(note?.requiredSince).toBe(2005);
      expect(note?.requiredByAdoptedEdition).toBe(true);
      expect(note?.text).toContain('2005 edition or earlier');
      expect(note?.text).toMatch(/all kitchen receptacles since the 2023 edition; the adopted 2020 edition does not include this/);
    });
  });

  describe('for a finished basement rule', () => {
    // Source: trade reference section 2.1: "all" basements from 2020.
    it('is not in a 2017 adoption and is in a 2020 adoption', () => {
      expect(editionNoteForLocation('gfci-missing', 'basements-all', 2017)?.requiredByAdoptedEdition).toBe(false);
      expect(editionNoteForLocation('gfci-missing', 'basements-all', 2020)?.requiredByAdoptedEdition).toBe(true);
    });
  });

  describe('for a missing AFCI', () => {
    // Source: trade reference section 2.6: kitchens added in 2014; bathrooms are not in the list.
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
