// The parser each tuning batch met on arrival, for the leave-one-batch-out trials (the veto's and the
// place ranker's): shared/src of that commit, exported once with `git archive` into
// node_modules/.cache/veto/parsers and loaded from there.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { parseReport } from '@cc/shared';
import { BATCHES } from '../corpus-runner';
import type { Parse } from './veto-data';

/**
 * The parser each batch met before it joined the tuning set: the commit at which it was imported (the
 * parser of that commit had never been tuned on it; docs/parser.md, the "before" row of each round).
 * The project excerpts 01-46 were written beside the parser and have no such parser.
 */
const ARRIVAL: ReadonlyArray<readonly [batch: string, commit: string | null]> = [
  ['project 01-46', null],
  ['A+B 101-160', 'f59713b'],
  ['tuning 201-255', 'd15c94f'],
  ['C 301-360', '4b0c070'],
  ['D 401-460', '31d90c0'],
  ['E 501-566', '1775bbe'],
  ['F 601-666', '7b1703f'],
  ['G 701-766', '9a7da0d'],
  ['H 801-866', '6c977b5'],
  ['I 901-966', '5520ef6'],
  ['J 1001-1066', 'f7659ed'],
  // K-P: the commit that moved the batch into test/corpus/batches/ (`git log` of its folder); for M its
  // parent, because that commit also widened a trigger after reading an M sentence.
  ['K 1101-1166', '9b3ade4'],
  ['L 1201-1288', '41289b7'],
  ['M 1301-1377', '3eb83ac'],
  ['N 1401-1466', '1f31bad'],
  ['O 1501-1566', 'b09366c'],
  ['P 1601-1666', '6e55365'],
];
const names = (xs: ReadonlyArray<string>) => xs.join(', ');
if (names(ARRIVAL.map(([b]) => b)) !== names(BATCHES.map((b) => b.name))) {
  throw new Error(`arrival-parsers.ts: its batches (${names(ARRIVAL.map(([b]) => b))}) are not corpus-runner.ts's BATCHES (${names(BATCHES.map((b) => b.name))})`);
}
/** The arrival parser's commit per batch, in the order of `BATCHES` (null: today's parser). */
export const ARRIVAL_PARSER: ReadonlyArray<string | null> = ARRIVAL.map(([, commit]) => commit);
const PARSERS_DIR = join(__dirname, '..', '..', '..', 'node_modules', '.cache', 'veto', 'parsers');

/** The parser of `commit` (null: today's). */
export async function parserAt(commit: string | null): Promise<Parse> {
  if (commit === null) return parseReport;
  const dir = join(PARSERS_DIR, commit);
  if (!existsSync(join(dir, 'shared'))) {
    mkdirSync(dir, { recursive: true });
    const tar = execFileSync('git', ['archive', commit, 'shared/src'], { maxBuffer: 1 << 28 });
    execFileSync('tar', ['-x', '-C', dir], { input: tar });
  }
  return ((await import(join(dir, 'shared', 'src', 'findings', 'report-parser.ts'))) as { parseReport: Parse }).parseReport;
}
