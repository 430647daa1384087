#!/usr/bin/env node
// `npm run typecheck`: tsc --noEmit over every TypeScript project (the same list `npm test` checks).
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runAsync } from './lib/run.mjs';
import { TYPECHECK_PROJECTS } from './lib/typecheck-projects.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

let failed = 0;
for (const project of TYPECHECK_PROJECTS) {
  const code = await runAsync(join(root, 'node_modules/.bin/tsc'), ['-p', project, '--noEmit'], { cwd: root });
  console.log(`${code === 0 ? '✓' : '✗'} tsc -p ${project}`);
  if (code !== 0) failed++;
}
process.exit(failed ? 1 : 0);
