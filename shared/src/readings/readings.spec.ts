import { copperResistanceOhms } from './conductor-resistance';
import { evaluateReadings, evaluateTripTime } from './evaluate-readings';
import { maxGfciTripSeconds } from './gfci-trip-time';
import { ReadingsSchema } from './readings.schema';
import { voltageDropPercent, voltageDropVolts } from './voltage-drop';
import { labelsApplyTo, missingProof, missingProofMessage, proofReadingsFor } from './reading-kinds';

describe('maxGfciTripSeconds', () => {
  // UL 943: Class A GFCI maximum trip time T = (20/I)^1.43 s, I in mA, stated for 6–264 mA.
  it.each([
    [6, 5.59],
    [7.4, 4.14],
    [10, 2.69],
    [20, 1.0],
    [50, 0.27],
    [100, 0.1],
  ])('allows at most %p mA → %p s (UL 943 curve)', (ma, seconds) => {
    expect(maxGfciTripSeconds(ma)).toBeCloseTo(seconds, 2);
  });

  it('allows about 25 ms at 264 mA, the top of the curve (UL 943)', () => {
    expect(maxGfciTripSeconds(264)).toBeCloseTo(0.025, 3);
  });

  it('states no limit outside 6–264 mA (UL 943 gives the curve for that range only)', () => {
    expect(maxGfciTripSeconds(5.9)).toBeNull();
    expect(maxGfciTripSeconds(265)).toBeNull();
    expect(maxGfciTripSeconds(Number.NaN)).toBeNull();
  });
});

describe('evaluateTripTime', () => {
  it('is within when a plug-in tester at 7.4 mA sees a trip in 25 ms (UL 943: ≤ 4.14 s)', () => {
    expect(evaluateTripTime(25, 7.4)).toMatchObject({ status: 'within', expected: 'At most 4144 ms' });
  });

  it('is outside when the trip at 20 mA takes longer than 1 s (UL 943: (20/20)^1.43 = 1 s)', () => {
    expect(evaluateTripTime(1001, 20).status).toBe('outside');
    expect(evaluateTripTime(1000, 20).status).toBe('within');
  });

  it('has no limit below 4 mA, where a Class A device must not trip (UL 943)', () => {
    expect(evaluateTripTime(30, 3)).toMatchObject({ status: 'recorded' });
    expect(evaluateTripTime(30, 3).expected).toContain('must not trip');
  });
});

describe('copperResistanceOhms', () => {
  // NEC Chapter 9 Table 8: 12 AWG solid uncoated copper 1.93 Ω/kft at 75 °C; α = 0.00323 (Table 8 note, from memory).
  it('gives 50 ft of 12 AWG at 20 °C as about 0.079 Ω (NEC Chapter 9 Table 8, temperature corrected)', () => {
    expect(copperResistanceOhms('12', 50, 20)).toBeCloseTo(0.079, 3);
  });

  it('gives the table value at 75 °C: 1,000 ft of 14 AWG solid is 3.07 Ω (NEC Chapter 9 Table 8)', () => {
    expect(copperResistanceOhms('14', 1000, 75)).toBeCloseTo(3.07, 6);
  });

  it('makes copper at 20 °C about 0.82 of the 75 °C value (NEC Chapter 9 Table 8 note)', () => {
    expect(copperResistanceOhms('10', 1000, 20) / copperResistanceOhms('10', 1000, 75)).toBeCloseTo(0.822, 3);
  });
});

describe('voltageDropVolts', () => {
  // VD = 2·K·I·L/CM, K = 12.9 for copper (common practice); 12 AWG = 6,530 cmil (NEC Chapter 9 Table 8).
  it('drops about 3.79 V (3.16 %) for 16 A over 60 ft of 12 AWG copper at 120 V', () => {
    expect(voltageDropVolts('12', 16, 60)).toBeCloseTo(3.79, 2);
    expect(voltageDropPercent('12', 16, 60)).toBeCloseTo(3.16, 2);
  });

  it('drops about 2.39 V (1.99 %) for the same load in 10 AWG (10,380 cmil, NEC Chapter 9 Table 8)', () => {
    expect(voltageDropVolts('10', 16, 60)).toBeCloseTo(2.39, 2);
    expect(voltageDropPercent('10', 16, 60)).toBeCloseTo(1.99, 2);
  });
});

describe('evaluateReadings', () => {
  const parse = (input: unknown) => ReadingsSchema.parse(input);

  it('judges a sound GFCI correction within range throughout', () => {
    const result = evaluateReadings(
      parse({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 2, tripTimeMs: 28, testCurrentMa: 7.4 }, receptacle: { polarityCorrect: true, groundPresent: true } }),
    );
    expect(result.map((r) => [r.key, r.status])).toEqual([
      ['gfci.tripsOnTest', 'within'],
      ['gfci.resets', 'within'],
      ['gfci.downstreamProven', 'recorded'],
      ['gfci.tripTimeMs', 'within'],
      ['receptacle.polarityCorrect', 'within'],
      ['receptacle.groundPresent', 'within'],
    ]);
    expect(result.find((r) => r.key === 'gfci.tripTimeMs')?.source).toContain('UL 943');
  });

  it('accepts a missing ground where the device is labelled "No Equipment Ground" (NFPA 70 (NEC) 406.4(D)(2))', () => {
    const readings = parse({ receptacle: { polarityCorrect: true, groundPresent: false } });
    expect(evaluateReadings(readings)[1].status).toBe('outside');
    expect(evaluateReadings(readings, { labels: ['No Equipment Ground', 'GFCI Protected'] })[1].status).toBe('within');
  });

  // Expected 50 ft of 12 AWG at 20 °C ≈ 0.079 Ω (NEC Chapter 9 Table 8); < 1 Ω is common practice.
  it.each([
    [0.12, 'within'],
    [0.6, 'flag'],
    [1.2, 'outside'],
  ])('rates a ground path of %p Ω over 50 ft of 12 AWG as %p', (impedanceOhms, status) => {
    const [evaluation] = evaluateReadings(parse({ groundPath: { impedanceOhms, conductorSize: '12', runLengthFt: 50, temperatureC: 20 } }));
    expect(evaluation.status).toBe(status);
    expect(evaluation.expected).toContain('0.079 Ω');
  });

  // NFPA 70 (NEC) 210.19(A) Informational Note: 3 % branch, 5 % feeder and branch.
  it.each([
    [2.5, 'within'],
    [3.16, 'flag'],
    [5.5, 'outside'],
  ])('rates a voltage drop of %p %% as %p (NEC 210.19(A) informational note)', (percent, status) => {
    const [evaluation] = evaluateReadings(parse({ voltageDrop: { percent } }));
    expect(evaluation.status).toBe(status);
  });

  it('estimates the drop expected at the test load from the run (16 A, 60 ft of 12 AWG ≈ 3.16 %)', () => {
    const result = evaluateReadings(parse({ groundPath: { impedanceOhms: 0.2, conductorSize: '12', stranding: 'stranded', runLengthFt: 60 }, voltageDrop: { percent: 3.1, loadAmps: 16 } }));
    expect(result[1].expected).toContain('3.16 %');
  });
});

describe('ReadingsSchema', () => {
  it('needs the test current with a trip time', () => {
    const result = ReadingsSchema.safeParse({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 0, tripTimeMs: 20 } });
    expect(result.success).toBe(false);
  });

  it('bounds every number', () => {
    expect(ReadingsSchema.safeParse({ groundPath: { impedanceOhms: 1e9, conductorSize: '12', runLengthFt: 50 } }).success).toBe(false);
    expect(ReadingsSchema.safeParse({ voltageDrop: { percent: -1 } }).success).toBe(false);
  });
});

describe('labelsApplyTo', () => {
  // The labels mark receptacles on GFCI protection (NFPA 70 (NEC) 2023, 406.4(D)(2)(b) and (c)).
  it('offers the GFCI labels on receptacle items that take a GFCI test, not on panels, alarms or fixtures', () => {
    for (const code of ['open-ground', 'gfci-missing', 'gfci-inoperative'] as const) expect(labelsApplyTo(code)).toBe(true);
    for (const code of ['double-tap', 'smoke-co-alarm', 'reversed-polarity', 'open-junction-box'] as const) expect(labelsApplyTo(code)).toBe(false);
  });
});

describe('missingProof', () => {
  const gfciTest = { tripsOnTest: true, resets: true, downstreamProven: 0, tripTimeMs: null, testCurrentMa: null };
  const tester = { polarityCorrect: true, groundPresent: true };

  it('asks for the GFCI test of an installed or replaced GFCI (its listing instructions: UL 943 devices; NFPA 70 (NEC) 2023, 110.3(B))', () => {
    expect(missingProof('gfci-missing', {})).toEqual(['gfci']);
    expect(missingProof('gfci-inoperative', { receptacle: tester })).toEqual(['gfci']);
    expect(missingProof('gfci-missing', { gfci: gfciTest })).toEqual([]);
  });

  it('asks for the plug-in tester on polarity, bootleg-ground and replaced receptacles (common practice)', () => {
    for (const code of ['reversed-polarity', 'false-ground', 'receptacle-damaged'] as const) {
      expect(missingProof(code, { gfci: null, receptacle: null })).toEqual(['receptacle']);
      expect(missingProof(code, { receptacle: tester })).toEqual([]);
    }
  });

  it('takes either reading for an open ground: a restored ground, or GFCI protection in its place (NFPA 70 (NEC) 2023, 406.4(D)(2))', () => {
    expect(missingProof('open-ground', {})).toEqual(['receptacle', 'gfci']);
    expect(missingProof('open-ground', { gfci: gfciTest })).toEqual([]);
    expect(missingProof('open-ground', { receptacle: tester })).toEqual([]);
  });

  it('asks nothing of items a test does not prove (a cover plate, a panel screw, an alarm)', () => {
    for (const code of ['cover-plate-missing', 'panel-deficiency', 'smoke-co-alarm', 'double-tap'] as const) {
      expect(proofReadingsFor(code)).toEqual([]);
      expect(missingProof(code, {})).toEqual([]);
    }
  });

  it('names the readings that would do in its message', () => {
    expect(missingProofMessage(['receptacle', 'gfci'])).toBe('Take the “Polarity and ground” or the “GFCI test” reading: a corrected item of this kind is proven by its test');
  });
});
