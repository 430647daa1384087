// Builds the Angular portal unless dist/ is newer than every source it is built from.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './run.mjs';

function newestMtime(path) {
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(path).reduce((max, name) => Math.max(max, newestMtime(join(path, name))), stat.mtimeMs);
}

export function buildPortalIfStale(root, { force = false } = {}) {
  const index = join(root, 'dist/portal/browser/index.html');
  const sources = ['apps/portal/src', 'shared/src', 'fonts', 'angular.json', 'package-lock.json'].map((p) => join(root, p)).filter(existsSync);
  const isStale = force || !existsSync(index) || sources.some((s) => newestMtime(s) > statSync(index).mtimeMs);
  if (!isStale) {
    console.log('• Portal build is up to date');
    return;
  }
  console.log('• Building the portal…');
  run(join(root, 'node_modules/.bin/ng'), ['build', 'portal'], { cwd: root, env: { ...process.env, NG_CLI_ANALYTICS: 'false' } });
}
