/**
 * Scores parser output against hand labels. Findings are matched as a multiset of (code, room)
 * pairs: each expected pair can be matched by one predicted pair at most. Quantity accuracy is
 * measured on the matched pairs only (pairs with equal quantities are matched first).
 */
export interface LabelledFinding {
  readonly code: string;
  readonly room: string;
  readonly quantity: number | null;
}

export interface Tally {
  readonly truePositives: number;
  readonly falsePositives: number;
  readonly falseNegatives: number;
  readonly quantityCorrect: number;
}

export interface FileScore extends Tally {
  readonly file: string;
  /** Expected pairs the parser did not give, as "code@room". */
  readonly missed: string[];
  /** Pairs the parser gave that were not expected, as "code@room". */
  readonly extra: string[];
}

export interface CorpusScore extends Tally {
  readonly precision: number;
  readonly recall: number;
  readonly f1: number;
  /** Share of matched pairs whose quantity is also right (1 when nothing matched). */
  readonly quantityAccuracy: number;
  readonly files: FileScore[];
}

const keyOf = (f: LabelledFinding) => `${f.code}@${f.room}`;

export function scoreFile(file: string, expected: readonly LabelledFinding[], predicted: readonly LabelledFinding[]): FileScore {
  const open = [...predicted];
  const missed: string[] = [];
  let truePositives = 0;
  let quantityCorrect = 0;
  const unmatched: LabelledFinding[] = [];
  for (const want of expected) {
    const exact = open.findIndex((p) => keyOf(p) === keyOf(want) && p.quantity === want.quantity);
    if (exact === -1) {
      unmatched.push(want);
      continue;
    }
    open.splice(exact, 1);
    truePositives++;
    quantityCorrect++;
  }
  for (const want of unmatched) {
    const loose = open.findIndex((p) => keyOf(p) === keyOf(want));
    if (loose === -1) {
      missed.push(keyOf(want));
      continue;
    }
    open.splice(loose, 1);
    truePositives++;
  }
  return {
    file,
    truePositives,
    falsePositives: open.length,
    falseNegatives: missed.length,
    quantityCorrect,
    missed,
    extra: open.map(keyOf),
  };
}

function ratio(numerator: number, denominator: number): number {
  return denominator === 0 ? 1 : numerator / denominator;
}

export function scoreCorpus(files: readonly FileScore[]): CorpusScore {
  const sum = (pick: (f: FileScore) => number) => files.reduce((n, f) => n + pick(f), 0);
  const truePositives = sum((f) => f.truePositives);
  const falsePositives = sum((f) => f.falsePositives);
  const falseNegatives = sum((f) => f.falseNegatives);
  const quantityCorrect = sum((f) => f.quantityCorrect);
  const precision = ratio(truePositives, truePositives + falsePositives);
  const recall = ratio(truePositives, truePositives + falseNegatives);
  const f1 = precision + recall === 0 ? 0 : (2 * precision * recall) / (precision + recall);
  return {
    truePositives,
    falsePositives,
    falseNegatives,
    quantityCorrect,
    precision,
    recall,
    f1,
    quantityAccuracy: ratio(quantityCorrect, truePositives),
    files: [...files],
  };
}

export interface CodeScore {
  readonly truePositives: number;
  readonly falsePositives: number;
  readonly falseNegatives: number;
  readonly precision: number;
  readonly recall: number;
  readonly f1: number;
}

/** Scores on codes alone (rooms ignored), matched as a multiset per file. */
export function scoreCodes(files: ReadonlyArray<{ expected: readonly LabelledFinding[]; predicted: readonly LabelledFinding[] }>): CodeScore {
  const noRoom = (f: LabelledFinding): LabelledFinding => ({ code: f.code, room: '', quantity: f.quantity });
  const total = scoreCorpus(files.map((f, i) => scoreFile(String(i), f.expected.map(noRoom), f.predicted.map(noRoom))));
  const { truePositives, falsePositives, falseNegatives, precision, recall, f1 } = total;
  return { truePositives, falsePositives, falseNegatives, precision, recall, f1 };
}
