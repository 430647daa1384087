import { changeOrderDecidedBy, signedByText } from './signed-by';

describe('signedByText', () => {
  it('names the signer once when the typed name is the account name', () => {
    expect(signedByText('Ellen Brooks', 'Ellen Brooks', 'seller')).toBe('Ellen Brooks, the seller');
  });

  it('ignores case and extra spaces when comparing', () => {
    expect(signedByText(' ellen  brooks', 'Ellen Brooks', 'seller')).toBe(' ellen  brooks, the seller');
  });

  it('adds the account name in brackets when it differs', () => {
    expect(signedByText('E. Brooks', 'Ellen Brooks', 'seller')).toBe('E. Brooks (Ellen Brooks), the seller');
  });

  // Review 7, P2-1: the listing agent's signature read as if the seller had signed.
  it('says the listing agent signed for the seller', () => {
    expect(signedByText('Robert Hale', 'Robert Hale', 'listing-agent')).toBe('Robert Hale, listing agent, for the seller');
  });
});

describe('changeOrderDecidedBy', () => {
  // A change order's decision says its signer's capacity as the quote's approval does.
  it('names who decided with the capacity kept with the decision', () => {
    expect(changeOrderDecidedBy({ signerName: 'Robert Hale', signerCapacity: 'listing-agent' })).toBe('Robert Hale, listing agent, for the seller');
    expect(changeOrderDecidedBy({ signerName: 'Ellen Brooks', signerCapacity: 'seller' })).toBe('Ellen Brooks, the seller');
  });

  it('says nothing while the change order waits', () => {
    expect(changeOrderDecidedBy({ signerName: null, signerCapacity: null })).toBe('');
  });
});
