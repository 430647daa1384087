/**
 * The longest time a Class A GFCI may take to trip at a given ground-fault current, from the
 * UL 943 inverse-time curve T = (20 / I)^1.43 seconds (I in milliamperes), stated for 6–264 mA.
 * A Class A device trips at 6 mA and must not trip below 4 mA; between 4 and 6 mA it may or may not.
 */
export const GFCI_CURVE_MIN_MA = 6;
export const GFCI_CURVE_MAX_MA = 264;
export const GFCI_NO_TRIP_BELOW_MA = 4;
export const GFCI_CURVE_SOURCE = 'UL 943 (Class A GFCI trip-time curve T = (20/I)^1.43 s, 6–264 mA)';

/** The maximum trip time in seconds at `currentMa`, or null outside the range the curve is stated for. */
export function maxGfciTripSeconds(currentMa: number): number | null {
  if (!Number.isFinite(currentMa) || currentMa < GFCI_CURVE_MIN_MA || currentMa > GFCI_CURVE_MAX_MA) return null;
  return Math.pow(20 / currentMa, 1.43);
}
