import { signedByText } from './signed-by';

describe('signedByText', () => {
  it('names the signer once when the typed name is the account name', () => {
    expect(signedByText('Ellen Brooks', 'Ellen Brooks')).toBe('Ellen Brooks');
  });

  it('ignores case and extra spaces when comparing', () => {
    expect(signedByText(' ellen  brooks', 'Ellen Brooks')).toBe(' ellen  brooks');
  });

  it('adds the account name in brackets when it differs', () => {
    expect(signedByText('E. Brooks', 'Ellen Brooks')).toBe('E. Brooks (Ellen Brooks)');
  });
});
