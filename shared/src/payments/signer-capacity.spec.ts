import { signedInCapacity, signerCapacityOf } from './signer-capacity';

// Review 7, P2-1: Robert Hale, the listing agent, signed for the seller and the record read "Approved by seller".
describe('signer capacity', () => {
  it.each([
    [['seller'], 'seller'],
    [['listing-agent'], 'listing-agent'],
    [['listing-agent', 'seller'], 'seller'],
    [['admin'], 'admin'],
  ] as const)('a person who is %j signs as %s', (actors, capacity) => {
    expect(signerCapacityOf(actors)).toBe(capacity);
  });

  it('names the signer with the capacity', () => {
    expect(signedInCapacity('Ellen Brooks', 'seller')).toBe('Ellen Brooks, the seller');
    expect(signedInCapacity('Robert Hale', 'listing-agent')).toBe('Robert Hale, listing agent, for the seller');
    expect(signedInCapacity('Ada Admin', 'admin')).toBe('Ada Admin, administrator, for the seller');
  });
});
