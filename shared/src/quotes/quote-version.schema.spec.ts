import { QUOTE_NOTE_MAX, SendQuoteSchema } from './quote-version.schema';

describe('SendQuoteSchema', () => {
  it('takes a note up to the limit the form counts towards, spaces around it not counted', () => {
    expect(SendQuoteSchema.parse({ note: ` ${'x'.repeat(QUOTE_NOTE_MAX)}\n` }).note).toHaveLength(QUOTE_NOTE_MAX);
  });

  it('refuses a longer note in plain words', () => {
    const issue = SendQuoteSchema.safeParse({ note: 'x'.repeat(QUOTE_NOTE_MAX + 1) }).error?.issues[0];
    expect(issue).toMatchObject({ path: ['note'], message: `Use at most ${QUOTE_NOTE_MAX} characters` });
  });
});
