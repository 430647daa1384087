import type { FindingCode } from '../findings/finding-code';

/** The groups of test readings a correction can carry. */
export const READING_KINDS = ['gfci', 'receptacle', 'groundPath', 'voltageDrop'] as const;
export type ReadingKind = (typeof READING_KINDS)[number];

export const READING_KIND_LABELS: Record<ReadingKind, string> = {
  gfci: 'GFCI test',
  receptacle: 'Polarity and ground',
  groundPath: 'Ground-path impedance',
  voltageDrop: 'Voltage drop under load',
};

const RECEPTACLE: readonly ReadingKind[] = ['receptacle', 'groundPath', 'voltageDrop'];
const GFCI: readonly ReadingKind[] = ['gfci', ...RECEPTACLE];

/** Which readings the correction form asks for, by the item's finding code (common practice). */
const KINDS_BY_CODE: Partial<Record<FindingCode, readonly ReadingKind[]>> = {
  'gfci-missing': GFCI,
  'gfci-inoperative': GFCI,
  // An open ground is often corrected by GFCI protection and labels (NEC 406.4(D)(2)).
  'open-ground': GFCI,
  'false-ground': GFCI,
  'reversed-polarity': RECEPTACLE,
  'receptacle-damaged': RECEPTACLE,
  'weather-cover-missing': GFCI,
  'aluminum-branch-wiring': RECEPTACLE,
  'double-tap': ['voltageDrop'],
};

export function readingKindsFor(code: FindingCode): readonly ReadingKind[] {
  return KINDS_BY_CODE[code] ?? [];
}

/** Labels a contractor commonly applies at a corrected device. */
export const CORRECTION_LABELS = ['No Equipment Ground', 'GFCI Protected'] as const;
export type CorrectionLabel = (typeof CORRECTION_LABELS)[number];

/**
 * Whether the labels apply to an item of `code`: they mark receptacles on GFCI protection (NFPA 70
 * (NEC) 406.4(D)(2)), so only the receptacle items whose correction takes a GFCI test carry them.
 */
export function labelsApplyTo(code: FindingCode): boolean {
  return readingKindsFor(code).includes('gfci');
}
