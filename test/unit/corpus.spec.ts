import { FindingSchema, joinPages } from '@cc/shared';
import { splitBlocks } from '../../shared/src/findings/block-splitter';
import { matchCodes } from '../../shared/src/findings/code-matcher';
import { splitSentences } from '../../shared/src/findings/sentence-splitter';
import type { BatchRun } from '../corpus/batch';
import { formatScoreTable, runCorpus } from '../corpus/corpus-runner';

// The corpus: hand-written, hand-labelled report excerpts (test/corpus/excerpts, labels in
// test/corpus/expected.json). Excerpts 39-46 were written and labelled after the parser existed,
// as a held-out check; 101 onwards were written and labelled by independent writers who never saw
// the parser (scored untuned on arrival, see docs/parser.md). Each excerpt is shown to the parser
// as test/corpus/manifest.json says: as text, or laid out in a real PDF (running header and footer,
// or two columns) and read back through the project's PDF text extraction.
// Scores match findings by (code, room) as a multiset.
// A ratchet, not the goal (0.95 on each). Every batch from 101 on joined the tuning set only after its
// untuned score was recorded in docs/parser.md, which keeps the history of these floors. Last reset
// 2026-12-04 when batch I (901-966) joined: precision 90.2 %, recall 91.0 %, F1 90.6 %, quantity
// 96.3 % (2852/2961), rounded down; reset because the corpus changed, not the parser. Raised after the
// eighth round (two branches merged: G and H's remaining misses, and batch I tuned on) to the exact
// figures rounded down: precision 92.30 %, recall 92.07 %, F1 92.18 %, quantity 96.36 % (2887/2996).
// Reset when batch J (1001-1066) joined after sealed K was scored: precision 91.21 %, recall
// 90.37 %, F1 90.79 %, quantity 95.56 % (3075/3218), rounded down; the corpus changed, not the parser.
// Raised after the ninth round (batch J tuned on) to the exact figures rounded down: precision
// 91.77 %, recall 91.12 %, F1 91.44 %, quantity 95.62 % (3103/3245).
// Raised after device and condition composition joined the ninth round's parser to the exact
// figures rounded down: precision 91.75 %, recall 91.54 %, F1 91.65 %, quantity 95.61 % (3117/3260).
// The precision floor went 0.02 points down for recall +0.4 and F1 +0.2 on the same corpus: the lead's
// decision (F1 is the goal; sealed K moved 74.8 -> 75.5 % with no extra finding), not a precedent.
// Reset 2026-12-05 when batch K (1101-1166) joined after sealed L was scored: precision 90.31 %,
// recall 89.92 %, F1 90.11 %, quantity 95.36 % (3378/3542), rounded down; the corpus changed, not the parser.
// Raised after the document-level merge (document-merge.ts) to the exact figures rounded down: precision
// 91.78 %, recall 89.92 %, F1 90.84 %, quantity 95.39 % (3379/3542); 63 extra findings removed, none correct lost.
// Reset 2026-12-05 when batch L (1201-1288) joined after sealed M was scored: precision 90.76 %,
// recall 89.51 %, F1 90.13 %, quantity 95.16 % (3601/3784), rounded down; the corpus changed, not the parser.
// Raised after the tenth round (teaching sentences, and a summary table with the numbered items after it
// read as two lists) to the exact figures rounded down: precision 91.04 %, recall 89.51 %, F1 90.27 %,
// quantity 95.16 % (3601/3784); 13 extra findings removed, none correct lost.
// Reset 2026-12-05 when batch M (1301-1377) joined after its untuned score was recorded and sealed N
// took its place: precision 89.10 %, recall 86.38 %, F1 87.72 %, quantity 93.83 % (3869/4123),
// rounded down; the corpus changed, not the parser.
// Reset 2026-12-05 when batch N (1401-1466) joined after its untuned score was recorded and sealed O
// took its place: precision 88.31 %, recall 85.49 %, F1 86.88 %, quantity 93.39 % (4184/4480), rounded
// down; the corpus changed, not the parser (which had moved the corpus with M from 87.72 to 88.3 % F1).
// Raised after the eleventh round's rules for N to the exact figures rounded down: precision 88.38 %,
// recall 85.51 %, F1 86.92 %, quantity 93.39 % (4185/4481).
// Reset 2026-12-05 when batch O (1501-1566) joined after its untuned score was recorded and sealed P
// took its place: precision 86.96 %, recall 84.38 %, F1 85.65 %, quantity 92.46 % (4428/4789), rounded
// down; the corpus changed, not the parser.
// Raised after the twelfth round's rules for O to the exact figures rounded down: precision 87.23 %,
// recall 84.68 %, F1 85.94 %, quantity 92.61 % (4451/4806).
// Reset 2026-12-05 when batch P (1601-1666) joined after its untuned score was recorded and sealed Q
// took its place: precision 85.92 %, recall 82.77 %, F1 84.31 %, quantity 91.89 % (4739/5157), rounded
// down; the corpus changed, not the parser.
// Raise them as the parser gets better; never lower them for the same corpus.
const MIN_PRECISION = 0.8592;
const MIN_RECALL = 0.8277;
const MIN_F1 = 0.8431;
const MIN_QUANTITY = 0.9189;

describe('report parser corpus', () => {
  let run: BatchRun;
  beforeAll(async () => {
    run = await runCorpus();
  }, 240_000);

  it('has a label entry for every excerpt and an excerpt for every label', () => {
    expect(run.results.length).toBeGreaterThanOrEqual(32);
    expect(run.unlabelled).toEqual([]);
    expect(run.orphanLabels).toEqual([]);
  });

  it('gives evidence that is an exact substring of the excerpt, at its offsets', () => {
    for (const { text, render, pages, result } of run.results) {
      const joined = joinPages(pages);
      for (const f of result.findings) {
        expect(FindingSchema.safeParse(f).success).toBe(true);
        if (render === 'text') expect(text.includes(f.evidence)).toBe(true);
        expect(joined.slice(f.start, f.end)).toBe(f.evidence);
      }
    }
  });

  it(`reaches precision and recall >= ${MIN_PRECISION}, F1 >= ${MIN_F1} and quantity accuracy >= ${MIN_QUANTITY}`, () => {
    console.log(formatScoreTable(run.score));
    expect(run.score.precision).toBeGreaterThanOrEqual(MIN_PRECISION);
    expect(run.score.recall).toBeGreaterThanOrEqual(MIN_RECALL);
    expect(run.score.f1).toBeGreaterThanOrEqual(MIN_F1);
    expect(run.score.quantityAccuracy).toBeGreaterThanOrEqual(MIN_QUANTITY);
  });

  // Each code's trigger words let the matcher skip sentences that cannot hold its phrases; on
  // every corpus sentence, skipping must change no result.
  it('finds the same phrases with and without the trigger-word shortcut', () => {
    const sentences = run.results.flatMap(({ pages }) => splitBlocks(joinPages(pages)).flatMap((b) => splitSentences(b.text)));
    expect(sentences.length).toBeGreaterThan(200);
    const summary = (s: string, ignoreTriggers: boolean) =>
      matchCodes(s, { ignoreTriggers }).map((m) => `${m.rule.code}@${m.start}-${m.end}`);
    for (const { text } of sentences) expect([text, ...summary(text, false)]).toEqual([text, ...summary(text, true)]);
  });
});
