/** Words as a sentence lists them: "a", "a and b", "a, b and c" (no serial comma). */
export function listWords(words: readonly string[]): string {
  return words.length < 2 ? words.join('') : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
