/**
 * Every rounding the pricing engine does lives in this file, and only here. The rules are written
 * down once, in docs/pricing.md ("Rounding rules"); each function below names the rule it applies.
 * All arguments and results are non-negative safe integers (cents, minutes, basis points).
 */

/** 10,000 basis points = 100 % (or a multiplier of ×1). */
export const BASIS_POINTS = 10_000;

function assertWhole(value: number, what: string): void {
  if (!Number.isSafeInteger(value) || value < 0) {
    throw new RangeError(`${what} must be a non-negative safe integer, got ${value}`);
  }
}

/**
 * Exact floor of `numerator / denominator` for safe integers: the floating-point quotient is
 * corrected by its remainder, so a quotient that rounded across an integer is put back.
 */
function floorDivide(numerator: number, denominator: number): number {
  let quotient = Math.floor(numerator / denominator);
  const remainder = numerator - quotient * denominator;
  if (remainder < 0) quotient -= 1;
  else if (remainder >= denominator) quotient += 1;
  return quotient;
}

/** R1: `numerator / denominator` rounded to the nearest integer, halves rounded up. */
export function divideRoundHalfUp(numerator: number, denominator: number): number {
  assertWhole(numerator, 'numerator');
  if (!Number.isSafeInteger(denominator) || denominator <= 0) {
    throw new RangeError(`denominator must be a positive safe integer, got ${denominator}`);
  }
  const quotient = floorDivide(numerator, denominator);
  const remainder = numerator - quotient * denominator;
  return remainder * 2 >= denominator ? quotient + 1 : quotient;
}

/** R1 applied to a share in basis points: `amount × basisPoints / 10,000`, half up. */
export function applyBasisPoints(amount: number, basisPoints: number): number {
  return divideRoundHalfUp(amount * basisPoints, BASIS_POINTS);
}

/**
 * R2: combined labour multiplier. Multipliers compound in the order given; after each step the
 * product is rounded half up to whole basis points. No multipliers gives ×1 (10,000).
 */
export function compoundMultipliers(multipliersBp: readonly number[]): number {
  let combined = BASIS_POINTS;
  for (let i = 0; i < multipliersBp.length; i++) {
    combined = applyBasisPoints(combined, multipliersBp[i]);
  }
  return combined;
}

/** R3: billable minutes are rounded UP to the next whole billing increment (never down). */
export function roundUpToIncrement(minutes: number, incrementMinutes: number): number {
  assertWhole(minutes, 'minutes');
  if (!Number.isSafeInteger(incrementMinutes) || incrementMinutes <= 0) {
    throw new RangeError(`billing increment must be a positive whole number of minutes, got ${incrementMinutes}`);
  }
  return Math.ceil(minutes / incrementMinutes) * incrementMinutes;
}

/** R4: cents for billed minutes at an hourly rate: `minutes × rate / 60`, half up. */
export function centsForMinutes(minutes: number, hourlyRateCents: number): number {
  return divideRoundHalfUp(minutes * hourlyRateCents, 60);
}

/**
 * R5: split `total` over `weights` in proportion (largest remainder). Each share starts as the
 * floor of `total × weight / Σweights`; the cents left over go one each to the largest remainders,
 * ties to the earlier position. The shares always add up to `total` exactly. All-zero weights
 * give all-zero shares except when `total` is not zero, which is an error.
 */
export function allocateByWeight(total: number, weights: readonly number[]): number[] {
  assertWhole(total, 'total');
  let weightSum = 0;
  for (let i = 0; i < weights.length; i++) {
    assertWhole(weights[i], 'weight');
    weightSum += weights[i];
  }
  const shares = new Array<number>(weights.length).fill(0);
  if (weightSum === 0) {
    if (total !== 0) throw new RangeError('cannot allocate a non-zero total over zero weights');
    return shares;
  }
  const remainders = new Array<number>(weights.length);
  let left = total;
  for (let i = 0; i < weights.length; i++) {
    const product = total * weights[i];
    assertWhole(product, 'total × weight');
    const share = floorDivide(product, weightSum);
    shares[i] = share;
    remainders[i] = product - share * weightSum;
    left -= share;
  }
  // Fewer cents are left than there are weights: hand them out one by one to the largest remainder.
  for (; left > 0; left--) {
    let best = 0;
    for (let i = 1; i < remainders.length; i++) if (remainders[i] > remainders[best]) best = i;
    shares[best] += 1;
    remainders[best] = -1;
  }
  return shares;
}

/** R6 (ballpark only): a low figure is rounded DOWN to a whole step, a high figure UP. */
export function roundDownToStep(cents: number, stepCents: number): number {
  assertWhole(cents, 'cents');
  return Math.floor(cents / stepCents) * stepCents;
}

export function roundUpToStep(cents: number, stepCents: number): number {
  assertWhole(cents, 'cents');
  return Math.ceil(cents / stepCents) * stepCents;
}

/**
 * R7: an amount per hour of work, `cents × 60 / minutes`, half up; null for no minutes (nothing
 * was worked, so no rate). The inverse of R4, used for what a visit or a day earned per hour.
 */
export function centsPerHour(cents: number, minutes: number): number | null {
  assertWhole(minutes, 'minutes');
  if (minutes === 0) return null;
  return divideRoundHalfUp(cents * 60, minutes);
}
