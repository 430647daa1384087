// The parser each tuning batch met on arrival, for the leave-one-batch-out trials (the veto's and the
// place ranker's): shared/src of that commit, exported once with `git archive` into
// node_modules/.cache/veto/parsers and loaded from there.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { parseReport } from '@cc/shared';
import type { Parse } from './veto-data';

/**
 * The parser each batch met before it joined the tuning set: the commit at which it was imported (the
 * parser of that commit had never been tuned on it; docs/parser.md, the "before" row of each round).
 * The project excerpts 01-46 were written beside the parser and have no such parser.
 */
export const ARRIVAL_PARSER: ReadonlyArray<string | null> = [null, 'f59713b', 'd15c94f', '4b0c070', '31d90c0', '1775bbe', '7b1703f', '9a7da0d', '6c977b5', '5520ef6', 'f7659ed'];
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
