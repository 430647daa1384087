import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { tokenize, TOKEN } from '../../shared/src/findings/quantity-reader';
import { readWords, WORD_PATTERN } from '../../shared/src/findings/word-tokens';

// The shared word reader (shared/src/findings/word-tokens.ts) reads words character by character;
// on every corpus excerpt it must give exactly the words of the expression it follows, and so must
// the count reader's tokens (quantity-reader.ts) read the same way.
describe('readWords on the corpus', () => {
  it('gives the same words as the word expression on every corpus excerpt', () => {
    const dir = join(__dirname, '../corpus/excerpts');
    const files = readdirSync(dir).filter((f) => f.endsWith('.txt'));
    expect(files.length).toBeGreaterThan(100);
    for (const f of files) {
      const text = readFileSync(join(dir, f), 'utf8');
      const expected = [...text.matchAll(new RegExp(WORD_PATTERN.source, 'g'))].map((m) => `${m.index}-${m.index + m[0].length}:${m[0].toLowerCase()}`);
      const words = readWords(text);
      const read: string[] = [];
      for (let k = 0; k < words.count; k++) read.push(`${words.start[k]}-${words.end[k]}:${words.vocabulary.words[words.id[k]]}`);
      expect([f, ...read]).toEqual([f, ...expected]);
    }
  });

  it('gives the count reader the same tokens as its expression on every corpus excerpt', () => {
    const dir = join(__dirname, '../corpus/excerpts');
    for (const f of readdirSync(dir).filter((name) => name.endsWith('.txt'))) {
      const text = readFileSync(join(dir, f), 'utf8');
      const expected = [...text.matchAll(new RegExp(TOKEN.source, 'g'))].map((m) => `${m.index}:${m[0].toLowerCase()}`);
      expect([f, ...tokenize(text).map((t) => `${t.index}:${t.word}`)]).toEqual([f, ...expected]);
    }
  });
});
