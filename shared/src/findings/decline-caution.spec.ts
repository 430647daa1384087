import { declineCaution } from './decline-caution';
import { FINDING_CODE_TABLE } from './finding-code';

describe('declineCaution', () => {
  it('names the life-safety risk of declining smoke and CO alarms and defers to the local rules', () => {
    const line = declineCaution('smoke-co-alarm');
    expect(line).toMatch(/smoke and CO alarms protect lives/i);
    expect(line).toMatch(/local rules/);
  });

  it('gives every other code the finding-code table marks "safety" the general line, and none to the rest', () => {
    for (const [code, info] of Object.entries(FINDING_CODE_TABLE)) {
      if (code === 'smoke-co-alarm') continue;
      if (info.severity === 'safety') expect(declineCaution(code)).toMatch(/safety hazard.*local rules/);
      else expect(declineCaution(code)).toBeNull();
    }
    expect(declineCaution('cover-plate-missing')).toBeNull();
    expect(declineCaution('no-such-code')).toBeNull();
  });

  it('is one short line', () => {
    for (const code of Object.keys(FINDING_CODE_TABLE)) expect((declineCaution(code) ?? '').length).toBeLessThanOrEqual(140);
  });
});
