import { ADJUSTABLE_KINDS, kindsForRole, NOTIFICATION_RULES, partiesTold } from './notification-kind';

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

describe('partiesTold', () => {
  const parties = [
    { role: 'seller' as const, userId: 3, name: 'Tomás Garza' },
    { role: 'listing-agent' as const, userId: 4, name: 'Robert Hale' },
    { role: 'buyer-agent' as const, userId: 5, name: 'Maya Chen' },
    { role: 'inspector' as const, userId: 6, name: 'Nora Inspector' },
    // Invited, no account yet: the server has nobody to write to.
    { role: 'seller' as const, userId: null, name: null },
  ];

  it('names the parties with an account whose part the rule sends the message to', () => {
    expect(partiesTold('quote-sent', parties).map((p) => p.name)).toEqual(['Tomás Garza', 'Robert Hale', 'Maya Chen']);
    expect(partiesTold('letter-issued', parties).map((p) => p.role)).toEqual(['seller', 'listing-agent', 'buyer-agent', 'inspector']);
    expect(partiesTold('ready-to-price', parties)).toEqual([]);
  });
});
