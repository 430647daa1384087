import { codeReferenceText } from './code-reference';
import { FINDING_CODE_TABLE } from './finding-code';

describe('codeReferenceText', () => {
  it.each([
    // The finding-code table's smoke-alarm row, and the order items read before it was changed kept.
    [['NFPA 72', 'local code'], 'NFPA 72 and local code'],
    [['local code', 'NFPA 72'], 'NFPA 72 and local code'],
    [['210.8(A)', '406.4(D)(3)'], 'NEC 210.8(A), 406.4(D)(3)'],
    [['NEC 210.12'], 'NEC 210.12'],
    [['250.50', 'NFPA 72', 'local code'], 'NEC 250.50, NFPA 72 and local code'],
    [['local code'], 'local code'],
    [[' 110.12 ', '110.12', ''], 'NEC 110.12'],
    [[], ''],
  ])('%j → %s', (refs, text) => {
    expect(codeReferenceText(refs)).toBe(text);
  });

  it('never writes "NEC" before a reference that is not an NEC section (every row of the code table)', () => {
    for (const info of Object.values(FINDING_CODE_TABLE)) {
      expect(codeReferenceText(info.necRefs)).not.toMatch(/NEC (local|NFPA|IRC)/);
    }
  });
});
