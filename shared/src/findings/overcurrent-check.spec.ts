import { checkOvercurrent, SMALL_CONDUCTOR_LIMITS } from './overcurrent-check';
import { parseText } from './report-parser';

// Expected limits: NFPA 70 (NEC) 2023, 240.4(D) small conductors (unchanged in 2017 and 2020; from
// memory of the text): 14 AWG copper 15 A, 12 AWG copper 20 A, 10 AWG copper 30 A, 12 AWG aluminum
// 15 A, 10 AWG aluminum 25 A.
describe('SMALL_CONDUCTOR_LIMITS', () => {
  it.each([
    ['copper', 14, 15], // NEC 240.4(D)(3)
    ['copper', 12, 20], // NEC 240.4(D)(5)
    ['copper', 10, 30], // NEC 240.4(D)(7)
    ['aluminum', 12, 15], // NEC 240.4(D)(4)
    ['aluminum', 10, 25], // NEC 240.4(D)(6)
  ] as const)('%s %i AWG: at most %i A (NEC 240.4(D))', (metal, awg, amps) => {
    expect(SMALL_CONDUCTOR_LIMITS[metal][awg]).toBe(amps);
  });
});

describe('checkOvercurrent', () => {
  it.each([
    // [sentence, computation shown on the item]
    ['The 40 A double-pole breaker serving the cooktop is connected to 10 AWG copper conductors.', '40 A breaker on 10 AWG copper; NEC 240.4(D) allows 30 A'],
    ['A 30 amp breaker protects 14 AWG wire feeding the dryer receptacle.', '30 A breaker on 14 AWG copper; NEC 240.4(D) allows 15 A'],
    ['Two 20-amp breakers are connected to 12 AWG aluminum conductors.', '20 A breaker on 12 AWG aluminum; NEC 240.4(D) allows 15 A'],
    ['30A fuse on 10 AWG aluminum circuit.', '30 A fuse on 10 AWG aluminum; NEC 240.4(D) allows 25 A'],
  ])('finds a device larger than its conductor allows: %s', (sentence, computation) => {
    expect(checkOvercurrent(sentence).map((c) => c.computation)).toEqual([computation]);
  });

  it.each([
    'The 20 A single-pole breakers for the bathroom circuits are on 12 AWG copper.', // 20 A = 240.4(D) limit for 12 AWG Cu
    '15 A on 14 AWG, 20 A on 12 AWG, 30 A dryer on 10 AWG.', // each pair at its limit
    'Water heater circuit: 30A breaker on 10 AWG Cu, nameplate max 30A.',
  ])('finds nothing when every device is within its limit: %s', (sentence) => {
    expect(checkOvercurrent(sentence)).toEqual([]);
  });

  it('checks a breaker against the appliance nameplate maximum overcurrent rating (NEC 110.3(B))', () => {
    expect(checkOvercurrent('Dryer circuit: 40A 2-pole breaker; dryer nameplate max overcurrent device 30A.').map((c) => c.computation)).toEqual([
      '40 A overcurrent device; the nameplate allows at most 30 A (NEC 110.3(B))',
    ]);
  });

  it('reads shorthand through the parser and shows the computation on the finding', () => {
    const [finding] = parseText('PANEL\n - 30A 2-pole (WH) landed on #12 Cu.').findings;
    expect(finding).toMatchObject({ code: 'overcurrent-mismatch', room: 'panel', quantity: 1, confidence: 'inferred' });
    expect(finding.computation).toBe('30 A breaker on 12 AWG copper; NEC 240.4(D) allows 20 A');
    expect(finding.evidence).toBe('30A 2-pole (WH) landed on #12 Cu.');
  });
});
