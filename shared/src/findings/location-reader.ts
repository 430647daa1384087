import type { RoomMention } from './room-lexicon';
import { scanAll } from './regex-scan';

/**
 * The place as the report wrote it, starting at the room word and running on over the words that
 * narrow it down ("living room receptacle left of the fireplace", "attic above the garage"), up to
 * punctuation, a verb or a conjunction, at most six words.
 */
const STOP_WORDS = new Set([
  'is', 'are', 'was', 'were', 'has', 'have', 'had', 'and', 'or', 'but', 'which', 'that', 'lacks',
  'lack', 'lacking', 'do', 'does', 'did', 'not', 'should', 'needs', 'need', 'tested', 'shows', 'appears',
  'appear', 'feeding', 'feeds', 'when', 'where', 'so', 'due', 'missing', 'no', 'with', 'failed', 'would',
  'will', 'wobbles', 'predates', 'also', 'there', 'it', 'at', 'to', 'for', 'from',
]);
const MAX_WORDS = 6;
const WORD_AFTER_SPACE = /\s+([\w'/-]+)/g;

export function readLocation(sentence: string, mention: RoomMention): string {
  const rest = sentence.slice(mention.end);
  const words = rest.match(/^(?:\s+[\w'/-]+)*/)?.[0] ?? '';
  let taken = '';
  let count = 0;
  for (const m of scanAll(WORD_AFTER_SPACE, words)) {
    const word = m[1].toLowerCase();
    if (STOP_WORDS.has(word) || /\w{2}ed$/.test(word) || count >= MAX_WORDS) break;
    taken += m[0];
    count++;
  }
  return (mention.text + taken).replace(/\s+/g, ' ').trim();
}
