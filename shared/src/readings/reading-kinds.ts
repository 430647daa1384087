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

/**
 * The readings that prove a correction of an item of `code`: "Corrected" is recorded only with at
 * least one of them taken. A GFCI device is tested once installed, as the instructions of its
 * listing say (UL 943 devices, installed per their instructions: NFPA 70 (NEC) 2023, 110.3(B));
 * a receptacle's polarity and equipment ground are checked with a plug-in tester (common practice).
 * An open ground may be corrected either way: a restored ground, or GFCI protection with labels
 * (NEC 406.4(D)(2)). Other codes are proven by their photos and the description of the work.
 */
const PROOF_BY_CODE: Partial<Record<FindingCode, readonly ReadingKind[]>> = {
  'gfci-missing': ['gfci'],
  'gfci-inoperative': ['gfci'],
  'open-ground': ['receptacle', 'gfci'],
  'false-ground': ['receptacle'],
  'reversed-polarity': ['receptacle'],
  'receptacle-damaged': ['receptacle'],
};

export function proofReadingsFor(code: FindingCode): readonly ReadingKind[] {
  return PROOF_BY_CODE[code] ?? [];
}

/**
 * The readings an item of `code` would need before it is recorded as corrected with `readings`
 * (any one of them will do): empty when one was taken or none applies.
 */
export function missingProof(code: FindingCode, readings: Partial<Record<ReadingKind, unknown>>): readonly ReadingKind[] {
  const kinds = proofReadingsFor(code);
  return kinds.some((kind) => readings[kind] != null) ? [] : kinds;
}

/** What to tell the person recording "Corrected" without the readings `kinds` (one of them is needed). */
export function missingProofMessage(kinds: readonly ReadingKind[]): string {
  return `Take the “${kinds.map((k) => READING_KIND_LABELS[k]).join('” or the “')}” reading: a corrected item of this kind is proven by its test`;
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
