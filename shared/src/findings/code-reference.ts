// A finding's code references written for reading, in one place (the work page, the intake table, the
// completion letter): NEC sections by number under one "NEC", other published documents by their name,
// and "local code" last. Items keep the references they were read with (older ones in any order).

const LOCAL = 'local code';

/**
 * `['210.8(A)', '406.4(D)(3)']` → `NEC 210.8(A), 406.4(D)(3)`; `['local code', 'NFPA 72']` → `NFPA 72
 * and local code`; an empty list → ''. A reference starting with a digit is an NEC section; one already
 * written "NEC 210.8" keeps its number only once.
 */
export function codeReferenceText(refs: readonly string[]): string {
  const clean = [...new Set(refs.map((r) => r.trim()).filter(Boolean))];
  const sections = clean.filter((r) => /^(NEC\s+)?\d/i.test(r)).map((r) => r.replace(/^NEC\s+/i, ''));
  const documents = clean.filter((r) => !/^(NEC\s+)?\d/i.test(r) && r.toLowerCase() !== LOCAL);
  const parts = [...(sections.length ? [`NEC ${sections.join(', ')}`] : []), ...documents, ...(clean.some((r) => r.toLowerCase() === LOCAL) ? [LOCAL] : [])];
  return parts.length <= 1 ? (parts[0] ?? '') : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}
