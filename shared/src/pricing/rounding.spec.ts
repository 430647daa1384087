// Expected values follow from the definitions of the rounding rules in docs/pricing.md, section 2
// (round half up, round up to a step, largest-remainder apportionment), worked by hand per row.
import {
  allocateByWeight,
  applyBasisPoints,
  centsForMinutes,
  centsPerHour,
  compoundMultipliers,
  divideRoundHalfUp,
  roundDownToStep,
  roundUpToStep,
  roundUpToIncrement,
} from './rounding';

describe('rounding', () => {
  describe('divideRoundHalfUp (R1)', () => {
    it.each([
      [0, 7, 0],
      [14, 7, 2], //      exact
      [15, 10, 2], //     1.5 → 2 (half up)
      [25, 10, 3], //     2.5 → 3 (half up, not to even)
      [24, 10, 2], //     2.4 → 2
      [26, 10, 3], //     2.6 → 3
      [1, 3, 0], //       0.333 → 0
      [2, 3, 1], //       0.667 → 1
      [Number.MAX_SAFE_INTEGER, 2, 4_503_599_627_370_496], // 4,503,599,627,370,495.5 → …496
      [Number.MAX_SAFE_INTEGER, 3, 3_002_399_751_580_330], // 2^53 − 1 = 3 × 3,002,399,751,580,330 + 1
    ])('%d / %d = %d', (n, d, q) => {
      expect(divideRoundHalfUp(n, d)).toBe(q);
    });

    it.each([
      [-1, 2],
      [1.5, 2],
      [1, 0],
      [Number.MAX_SAFE_INTEGER + 1, 2],
    ])('refuses %d / %d', (n, d) => {
      expect(() => divideRoundHalfUp(n, d)).toThrow(RangeError);
    });
  });

  it.each([
    [2_400, 3_500, 840], // 35 % of $24.00
    [3_240, 600, 194], //   6 % of $32.40 = 194.4
    [87_843, 5_000, 43_922], // 50 % of 87,843 = 43,921.5 → half up
  ])('applyBasisPoints(%d, %d bp) = %d', (amount, bp, result) => {
    expect(applyBasisPoints(amount, bp)).toBe(result);
  });

  it.each([
    [[], 10_000],
    [[13_000], 13_000],
    [[13_000, 14_000], 18_200], //        1.3 × 1.4 = 1.82
    [[12_000, 13_000, 14_000], 21_840], // 1.2 × 1.3 × 1.4 = 2.184
    [[10_001, 10_001], 10_002], //        1.0001² = 1.00020001 → 10,002.0001 bp → 10,002
  ])('compoundMultipliers(%j) = %d bp (R2)', (multipliers, combined) => {
    expect(compoundMultipliers(multipliers)).toBe(combined);
  });

  it.each([
    [0, 15, 0],
    [1, 15, 15],
    [15, 15, 15],
    [16, 15, 30],
    [40, 30, 60],
  ])('roundUpToIncrement(%d, %d) = %d (R3)', (minutes, increment, billed) => {
    expect(roundUpToIncrement(minutes, increment)).toBe(billed);
  });

  it.each([
    [45, 13_500, 10_125], // 0.75 h × $135
    [1, 13_500, 225],
    [1, 9_999, 167], //      166.65 → 167
    [7, 10_050, 1_173], //   1,172.5 → 1,173 (half up)
  ])('centsForMinutes(%d min, %d/h) = %d (R4)', (minutes, rate, cents) => {
    expect(centsForMinutes(minutes, rate)).toBe(cents);
  });

  describe('allocateByWeight (R5)', () => {
    it.each([
      [100, [1, 1, 1], [34, 33, 33]], //        33.33 each, the cent left goes to the earliest tie
      [28_625, [50, 50, 0], [14_313, 14_312, 0]],
      [35_375, [82, 20, 0, 20], [23_777, 5_799, 0, 5_799]],
      [10, [1, 0, 2], [3, 0, 7]], //            3.33 / 6.67: remainder .67 wins
      [0, [0, 0], [0, 0]],
      [0, [], []],
    ])('splits %d over %j as %j', (total, weights, shares) => {
      const result = allocateByWeight(total as number, weights as number[]);
      expect(result).toEqual(shares);
      expect(result.reduce((a, b) => a + b, 0)).toBe(total);
    });

    it('refuses a non-zero total over zero weights', () => {
      expect(() => allocateByWeight(5, [0, 0])).toThrow(RangeError);
    });
  });

  it.each([
    [46_178, 46_000, 47_000],
    [46_000, 46_000, 46_000],
    [0, 0, 0],
  ])('ballpark step of %d: down %d, up %d (R6)', (cents, down, up) => {
    expect(roundDownToStep(cents, 1_000)).toBe(down);
    expect(roundUpToStep(cents, 1_000)).toBe(up);
  });
});

describe('centsPerHour (R7)', () => {
  // Worked by hand from the definition in docs/pricing.md: cents × 60 / minutes, half up.
  it.each([
    [18_500, 60, 18_500], //   $185 in an hour
    [28_100, 45, 37_467], //   28,100 × 60 / 45 = 37,466.67 → 37,467
    [100, 120, 50], //         exact
    [1, 120, 1], //            0.5 → 1 (half up)
    [0, 30, 0],
  ])('%d cents over %d minutes = %d cents per hour', (cents, minutes, rate) => {
    expect(centsPerHour(cents, minutes)).toBe(rate);
  });

  it('has no rate for no minutes', () => {
    expect(centsPerHour(5_000, 0)).toBeNull();
  });
});
