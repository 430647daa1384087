/**
 * Finds, in one pass over a text, which of many lower-case ASCII literals occur in it (an
 * Aho-Corasick automaton). Each literal carries the ids it stands for (the matcher gives a phrase's
 * id to each of its required literals); `scan` returns, for every id, whether one of its literals
 * occurs. Overlapping and nested occurrences are all found ("ground" and "ungrounded").
 */
export class LiteralScanner {
  /** Character code (below 128) to alphabet index; 0 is "a character no literal has". */
  private readonly alphabet = new Uint8Array(128);
  private readonly width: number;
  /** next[state * width + letter]: the state after reading the letter (a complete automaton). */
  private readonly next: Int32Array;
  /**
   * The ids found on reaching each state (its literals and those of its suffixes):
   * foundIds[foundStart[state]] up to foundIds[foundStart[state + 1]], in two flat arrays.
   */
  private readonly foundStart: Int32Array;
  private readonly foundIds: Int32Array;
  /** The answer of the last scan (allocating a typed array per sentence costs more than the scan). */
  private readonly hits: Uint8Array;

  constructor(
    literals: ReadonlyArray<{ readonly text: string; readonly ids: readonly number[] }>,
    idCount: number,
  ) {
    let letters = 1;
    for (const { text } of literals) {
      if (text.length === 0) throw new RangeError('Empty literal');
      for (let i = 0; i < text.length; i++) {
        const code = text.charCodeAt(i);
        if (code >= 128 || text[i] !== text[i].toLowerCase()) throw new RangeError(`Not a lower-case ASCII literal: ${text}`);
        if (this.alphabet[code] === 0) this.alphabet[code] = letters++;
      }
    }
    this.width = letters;

    // The trie of the literals, in the transition table itself (-1: no child yet).
    const maxStates = 1 + literals.reduce((n, { text }) => n + text.length, 0);
    const width = this.width;
    const table = new Int32Array(maxStates * width).fill(-1);
    const output: number[][] = [[]];
    for (const { text, ids } of literals) {
      let state = 0;
      for (let i = 0; i < text.length; i++) {
        const at = state * width + this.alphabet[text.charCodeAt(i)];
        if (table[at] === -1) {
          table[at] = output.length;
          output.push([]);
        }
        state = table[at];
      }
      output[state].push(...ids);
    }

    // Breadth first: failure links, then every missing transition filled from the failure state.
    const next = table.slice(0, output.length * width);
    const fail = new Int32Array(output.length);
    const queue: number[] = [];
    for (let letter = 0; letter < width; letter++) {
      if (next[letter] === -1) next[letter] = 0;
      else queue.push(next[letter]);
    }
    for (let head = 0; head < queue.length; head++) {
      const state = queue[head];
      if (output[fail[state]].length > 0) output[state] = [...new Set([...output[state], ...output[fail[state]]])];
      for (let letter = 0; letter < width; letter++) {
        const at = state * width + letter;
        const viaFail = next[fail[state] * width + letter];
        if (next[at] === -1) {
          next[at] = viaFail;
        } else {
          fail[next[at]] = viaFail;
          queue.push(next[at]);
        }
      }
    }
    this.next = next;
    this.foundStart = new Int32Array(output.length + 1);
    output.forEach((ids, state) => (this.foundStart[state + 1] = this.foundStart[state] + ids.length));
    this.foundIds = Int32Array.from(output.flat());
    this.hits = new Uint8Array(idCount);
  }

  /**
   * For every id, whether one of its literals occurs in `lowerText` (already in lower case). The
   * array is the scanner's own and is overwritten by the next scan: read it before scanning again.
   */
  scan(lowerText: string): Uint8Array {
    const { alphabet, next, foundStart, foundIds, width, hits } = this;
    hits.fill(0);
    let state = 0;
    for (let i = 0; i < lowerText.length; i++) {
      const code = lowerText.charCodeAt(i);
      state = next[state * width + (code < 128 ? alphabet[code] : 0)];
      for (let k = foundStart[state], end = foundStart[state + 1]; k < end; k++) hits[foundIds[k]] = 1;
    }
    return hits;
  }
}
