import { TABLE_8_CIRCULAR_MILS, type ConductorSize } from './conductor-resistance';

/**
 * Voltage drop of a single-phase two-wire circuit, VD = 2 · K · I · L / CM, with K ≈ 12.9 Ω·cmil/ft for
 * copper (common practice; it is Table 8's stranded copper 1.98 Ω/kft × 6,530 cmil / 1,000), L the
 * one-way length in feet and CM the conductor's circular mils. The NEC informational note to 210.19(A)
 * suggests at most 3 % on a branch circuit and 5 % on feeder and branch together (guidance, not a rule).
 */
export const COPPER_K = 12.9;
export const BRANCH_DROP_PERCENT = 3;
export const TOTAL_DROP_PERCENT = 5;
export const NOMINAL_VOLTS = 120;
export const VOLTAGE_DROP_SOURCE = 'NFPA 70 (NEC) 210.19(A) Informational Note (3 % branch, 5 % feeder and branch); VD = 2·K·I·L/CM';

export function voltageDropVolts(size: ConductorSize, currentA: number, lengthFt: number, k = COPPER_K): number {
  return (2 * k * currentA * lengthFt) / TABLE_8_CIRCULAR_MILS[size];
}

export function voltageDropPercent(size: ConductorSize, currentA: number, lengthFt: number, volts = NOMINAL_VOLTS): number {
  return (voltageDropVolts(size, currentA, lengthFt) / volts) * 100;
}
