// The server as plain JavaScript for `npm start` and the API bench: dist/server/main.cjs and the
// report worker beside it (report-reader.ts loads `report-worker.cjs` from its own folder). Bundled by
// esbuild with the shared code and the tsconfig paths resolved in; npm packages stay outside, loaded
// from node_modules. Starting it costs about half the CPU of running the sources through tsx (no
// TypeScript compiled at start-up; docs/performance.md); `npm run dev` and the tests keep tsx.
import { rmSync } from 'node:fs';
import { join } from 'node:path';

export const SERVER_ENTRY = join('dist', 'server', 'main.cjs');

/** Builds dist/server from server/src (about a second); answers the entry file's path. */
export async function buildServer(root) {
  const { build } = await import('esbuild');
  const outdir = join(root, 'dist', 'server');
  rmSync(outdir, { recursive: true, force: true });
  await build({
    absWorkingDir: root,
    entryPoints: { main: 'server/src/main.ts', 'report-worker': 'server/src/integrations/report-reader/report-worker.ts' },
    outdir,
    outExtension: { '.js': '.cjs' },
    bundle: true,
    platform: 'node',
    target: 'node20',
    format: 'cjs',
    packages: 'external',
    tsconfig: join(root, 'server', 'tsconfig.json'),
    sourcemap: true,
    logLevel: 'warning',
  });
  return join(root, SERVER_ENTRY);
}
