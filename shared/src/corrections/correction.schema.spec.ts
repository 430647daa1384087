import { RecordCorrectionSchema, readingsOutside, OUTSIDE_READING_NOTE_MESSAGE } from './correction.schema';
import { ReadingsSchema } from '../readings/readings.schema';

// UL 943: a Class A GFCI trips within (20/I)^1.43 s; at 100 mA that is (0.2)^1.43 ≈ 0.1 s = 100 ms.
const slowTrip = { gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 300, testCurrentMa: 100 } };
const corrected = (overrides: object = {}) => ({ outcome: 'corrected', workPerformed: 'Replaced the GFCI receptacle', readings: slowTrip, ...overrides });

describe('readingsOutside', () => {
  it('names a trip time of 300 ms at 100 mA as outside (UL 943: at most 100 ms)', () => {
    const outside = readingsOutside(ReadingsSchema.parse(slowTrip));
    expect(outside.map((e) => [e.key, e.expected])).toEqual([['gfci.tripTimeMs', 'At most 100 ms']]);
  });

  it('does not count a missing ground labelled "No Equipment Ground" (NFPA 70 (NEC) 406.4(D)(2))', () => {
    const readings = ReadingsSchema.parse({ receptacle: { polarityCorrect: true, groundPresent: false } });
    expect(readingsOutside(readings)).toHaveLength(1);
    expect(readingsOutside(readings, ['No Equipment Ground', 'GFCI Protected'])).toEqual([]);
  });
});

describe('RecordCorrectionSchema with a reading outside its range', () => {
  it('refuses "corrected" without a note', () => {
    const result = RecordCorrectionSchema.safeParse(corrected());
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([['reason', OUTSIDE_READING_NOTE_MESSAGE]]);
  });

  it('accepts "corrected" confirmed with a note, and "Could not correct" with its reason', () => {
    expect(RecordCorrectionSchema.safeParse(corrected({ reason: 'Second device tested 24 ms; the first reading was a loose test lead' })).success).toBe(true);
    expect(RecordCorrectionSchema.safeParse({ outcome: 'not-corrected', reason: 'Device trips slowly; replacement ordered' }).success).toBe(true);
  });

  it('needs no note when every reading is within range (UL 943: 27 ms at 7.4 mA ≤ 4.14 s)', () => {
    const within = { gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 27, testCurrentMa: 7.4 } };
    expect(RecordCorrectionSchema.safeParse(corrected({ readings: within })).success).toBe(true);
  });
});
