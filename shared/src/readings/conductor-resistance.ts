/**
 * Copper conductor resistance from NFPA 70 (NEC) Chapter 9 Table 8 (DC resistance at 75 °C, ohms per
 * 1,000 ft, uncoated copper), corrected to another temperature with the table note's formula
 * R2 = R1 [1 + α (T2 − 75)], α = 0.00323 for copper.
 */
export const CONDUCTOR_SIZES = ['14', '12', '10'] as const;
export type ConductorSize = (typeof CONDUCTOR_SIZES)[number];
export const STRANDINGS = ['solid', 'stranded'] as const;
export type Stranding = (typeof STRANDINGS)[number];

/** Ohms per 1,000 ft at 75 °C, uncoated copper (NEC Chapter 9 Table 8). */
export const TABLE_8_COPPER_OHMS_PER_KFT: Record<ConductorSize, Record<Stranding, number>> = {
  '14': { solid: 3.07, stranded: 3.14 },
  '12': { solid: 1.93, stranded: 1.98 },
  '10': { solid: 1.21, stranded: 1.24 },
};

/** Conductor area in circular mils (NEC Chapter 9 Table 8). */
export const TABLE_8_CIRCULAR_MILS: Record<ConductorSize, number> = { '14': 4110, '12': 6530, '10': 10380 };

export const COPPER_TEMPERATURE_COEFFICIENT = 0.00323;
export const TABLE_8_SOURCE = 'NFPA 70 (NEC) Chapter 9 Table 8, conductor properties (75 °C, with its temperature-correction note)';

/** Resistance in ohms of `lengthFt` of one copper conductor at `temperatureC`. */
export function copperResistanceOhms(size: ConductorSize, lengthFt: number, temperatureC: number, stranding: Stranding = 'solid'): number {
  const at75 = (lengthFt * TABLE_8_COPPER_OHMS_PER_KFT[size][stranding]) / 1000;
  return at75 * (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperatureC - 75));
}
