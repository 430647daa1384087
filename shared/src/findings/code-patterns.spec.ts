import { CODE_RULES } from './code-patterns';
import { FINDING_CODES } from './finding-code';

describe('CODE_RULES', () => {
  it('has exactly one rule per finding code, in table order', () => {
    expect(CODE_RULES.map((r) => r.code)).toEqual(FINDING_CODES);
  });

  it('gives every code at least one global, case-insensitive phrase', () => {
    for (const rule of CODE_RULES) {
      expect(rule.patterns.length).toBeGreaterThan(0);
      for (const p of rule.patterns) expect(p.re.flags).toEqual(expect.stringContaining('gi'));
    }
  });

  it('puts the panel defects at the panel', () => {
    const fixed = CODE_RULES.filter((r) => r.fixedRoom === 'panel').map((r) => r.code);
    expect(fixed).toEqual(['double-tap', 'overcurrent-mismatch', 'panel-deficiency', 'subpanel-bonding']);
  });

  it('keeps the general evaluation as the only fallback-only code', () => {
    expect(CODE_RULES.filter((r) => r.isFallbackOnly).map((r) => r.code)).toEqual(['evaluate-general']);
  });
});
