import { ADJUSTABLE_KINDS, kindsForRole, NOTIFICATION_RULES } from './notification-kind';

describe('kindsForRole', () => {
  it('gives each role only the messages sent to a part it can play', () => {
    expect(kindsForRole('inspector')).toEqual(['letter-issued']);
    expect(kindsForRole('seller')).not.toContain('closing-at-risk');
    expect(kindsForRole('seller')).toContain('quote-sent');
    expect(kindsForRole('contractor')).toContain('ready-to-price');
    expect(kindsForRole('contractor')).not.toContain('quote-sent');
    expect(kindsForRole('admin')).toEqual([]);
  });

  it('leaves no adjustable message without a role that receives it', () => {
    const reached = new Set((['agent', 'seller', 'contractor', 'inspector'] as const).flatMap((role) => kindsForRole(role)));
    expect(ADJUSTABLE_KINDS.filter((kind) => !reached.has(kind))).toEqual([]);
    expect(NOTIFICATION_RULES.invitation.isAdjustable).toBe(false);
  });
});
