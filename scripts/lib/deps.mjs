// Installs npm dependencies when node_modules is missing or older than package-lock.json.
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './run.mjs';

export function ensureDependencies(root) {
  const lock = join(root, 'package-lock.json');
  const marker = join(root, 'node_modules', '.package-lock.json');
  const isFresh = existsSync(marker) && (!existsSync(lock) || statSync(marker).mtimeMs >= statSync(lock).mtimeMs);
  if (isFresh) return;
  console.log('• Installing npm dependencies…');
  const args = existsSync(lock) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  run('npm', args, { cwd: root });
}
