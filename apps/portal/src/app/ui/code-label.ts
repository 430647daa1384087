import { FINDING_CODE_TABLE } from '@cc/shared';

/** The plain-words label of a finding code, or the code itself for one the table does not know. */
export function codeLabel(code: string | null): string {
  if (code === null) return 'Custom entry';
  return code in FINDING_CODE_TABLE ? FINDING_CODE_TABLE[code as keyof typeof FINDING_CODE_TABLE].label : code;
}
