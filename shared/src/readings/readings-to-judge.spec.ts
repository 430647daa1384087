import { evaluateReadings } from './evaluate-readings';
import { readingsToJudge } from './readings-to-judge';

describe('readingsToJudge', () => {
  it('still judges a 9,000 ms trip at 6 mA as outside while the downstream count is out of range (UL 943 curve: (20/6)^1.43 ≈ 5.6 s at 6 mA)', () => {
    const { readings, unjudged } = readingsToJudge({ gfci: { tripsOnTest: true, resets: true, downstreamProven: 99_999, tripTimeMs: 9_000, testCurrentMa: 6 } });
    expect(unjudged).toEqual(['gfci.downstreamProven']);
    const judged = evaluateReadings(readings).filter((e) => !unjudged.includes(e.key));
    expect(judged.find((e) => e.key === 'gfci.tripTimeMs')?.status).toBe('outside');
    expect(judged.some((e) => e.key === 'gfci.downstreamProven')).toBe(false);
  });

  it('leaves a trip time without its test current unjudged, and the other groups judged', () => {
    const { readings, unjudged } = readingsToJudge({
      gfci: { tripsOnTest: true, resets: true, downstreamProven: 1, tripTimeMs: 30, testCurrentMa: null },
      receptacle: { polarityCorrect: false, groundPresent: true },
    });
    expect(unjudged.sort()).toEqual(['gfci.testCurrentMa', 'gfci.tripTimeMs']);
    const judged = evaluateReadings(readings);
    expect(judged.some((e) => e.key === 'gfci.tripTimeMs')).toBe(false);
    // NFPA 70 (NEC) 200.11: reversed polarity is outside.
    expect(judged.find((e) => e.key === 'receptacle.polarityCorrect')?.status).toBe('outside');
  });

  it('reads valid readings unchanged and leaves nothing unjudged', () => {
    const input = { groundPath: { impedanceOhms: 0.4, conductorSize: '12' as const, stranding: 'solid' as const, runLengthFt: 50, temperatureC: 20 } };
    expect(readingsToJudge(input)).toEqual({ readings: { gfci: null, receptacle: null, groundPath: input.groundPath, voltageDrop: null }, unjudged: [] });
  });
});
