// Small process helpers shared by the orchestration scripts.
import { spawn, spawnSync } from 'node:child_process';

/** Runs a command to completion with inherited output; throws on a non-zero exit. */
export function run(cmd, args, options = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} exited with ${result.status}`);
  }
  return result;
}

/** Runs a command and resolves with its exit code (never throws for a non-zero exit). */
export function runAsync(cmd, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

/** Whether a command exists on PATH. */
export function hasCommand(cmd) {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
}

export function isRoot() {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

/** Installs Debian packages when running as root; otherwise explains what to run. */
export function aptInstall(packages, why) {
  if (!isRoot()) {
    throw new Error(`${why} is missing. Install it with:\n  sudo apt-get update && sudo apt-get install -y ${packages.join(' ')}`);
  }
  console.log(`• Installing ${packages.join(', ')} with apt-get (${why})…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update', '-qq'], { env });
  run('apt-get', ['install', '-y', '-qq', ...packages], { env });
}
