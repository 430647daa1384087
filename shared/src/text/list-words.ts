/** Words as a sentence lists them: "a", "a and b", "a, b and c" (no serial comma). */
export function listWords(words: readonly string[]): string {
  return joinLast(words, 'and');
}

/** Words as a sentence offers them as a choice: "a", "a or b", "a, b or c" (no serial comma). */
export function eitherWords(words: readonly string[]): string {
  return joinLast(words, 'or');
}

function joinLast(words: readonly string[], last: string): string {
  return words.length < 2 ? words.join('') : `${words.slice(0, -1).join(', ')} ${last} ${words[words.length - 1]}`;
}
