// A private PostgreSQL cluster on 127.0.0.1, from Debian's server binaries.
// initdb and postgres refuse to run as root, so as root the cluster runs as the `postgres` user.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { aptInstall, isRoot } from './run.mjs';

const PG_ROOT = '/usr/lib/postgresql';

/** Finds (or installs, as root) the newest PostgreSQL server binaries. */
export function ensurePostgresBinaries() {
  const find = () =>
    existsSync(PG_ROOT)
      ? readdirSync(PG_ROOT)
          .filter((v) => existsSync(join(PG_ROOT, v, 'bin', 'postgres')))
          .sort((a, b) => Number(b) - Number(a))
          .map((v) => join(PG_ROOT, v, 'bin'))[0]
      : undefined;
  let bin = find();
  if (!bin) {
    aptInstall(['postgresql'], 'The PostgreSQL server (Debian package postgresql)');
    bin = find();
  }
  if (!bin) throw new Error('PostgreSQL server binaries not found under /usr/lib/postgresql after installing.');
  return bin;
}

function serverUser() {
  if (!isRoot()) return {};
  const uid = Number(spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).stdout.trim());
  const gid = Number(spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).stdout.trim());
  if (!Number.isInteger(uid) || uid <= 0) throw new Error('Running as root, but there is no postgres user to run the server as.');
  return { uid, gid };
}

/** Whether the server user can reach and write `dir` (every parent needs the execute bit). */
function isReachable(dir, user) {
  if (!user.uid) return true;
  return spawnSync('test', ['-w', dir], { uid: user.uid, gid: user.gid }).status === 0;
}

function pg(bin, user, cmd, args, { quiet = false } = {}) {
  const result = spawnSync(join(bin, cmd), args, { ...user, encoding: 'utf8', stdio: quiet ? 'pipe' : ['ignore', 'pipe', 'pipe'] });
  if (result.status !== 0) {
    throw new Error(`${cmd} failed (${result.status}):\n${result.stdout ?? ''}${result.stderr ?? ''}`);
  }
  return result.stdout;
}

/**
 * Starts (creating on first use) a cluster in `dataDir` listening on 127.0.0.1:`port`.
 * `throwaway` trades durability for speed (test clusters). Returns the connection URL base and stop().
 */
export function startCluster({ dataDir, port, throwaway = false }) {
  const bin = ensurePostgresBinaries();
  const user = serverUser();
  mkdirSync(dirname(dataDir), { recursive: true });
  if (!existsSync(dataDir)) mkdirSync(dataDir, { mode: 0o700 });
  if (user.uid) chownSync(dataDir, user.uid, user.gid);
  if (!isReachable(dataDir, user)) {
    // The project folder sits under a directory the postgres user cannot enter (e.g. /root):
    // keep the cluster in a folder of its own under the system temp directory instead.
    const alt = join(tmpdir(), `closing-circuit-${createHash('sha256').update(dataDir).digest('hex').slice(0, 10)}`);
    console.log(`• ${dataDir} is not reachable by the postgres user; keeping the cluster in ${alt}`);
    return startCluster({ dataDir: alt, port, throwaway });
  }
  const socketDir = join(tmpdir(), `cc-pg-${port}`);
  mkdirSync(socketDir, { recursive: true });
  if (user.uid) chownSync(socketDir, user.uid, user.gid);

  if (!existsSync(join(dataDir, 'PG_VERSION'))) {
    pg(bin, user, 'initdb', ['-D', dataDir, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8', '--no-sync'], { quiet: true });
  }
  const pidFile = join(dataDir, 'postmaster.pid');
  const isRunning = existsSync(pidFile) && spawnSync(join(bin, 'pg_ctl'), ['-D', dataDir, 'status'], { ...user, stdio: 'ignore' }).status === 0;
  if (isRunning) {
    // Another command of this project (e.g. a running `npm start`) owns this cluster: share it, leave it running.
    const port = Number(readFileSync(pidFile, 'utf8').split('\n')[3]);
    console.log(`• Using the PostgreSQL already running on 127.0.0.1:${port}`);
    return clusterHandle({ bin, user, dataDir, port, isOwned: false });
  }
  if (existsSync(pidFile)) rmSync(pidFile); // left behind by a killed run
  const options = [`-c listen_addresses=127.0.0.1`, `-p ${port}`, `-c unix_socket_directories=${socketDir}`];
  if (throwaway) options.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
  pg(bin, user, 'pg_ctl', ['-D', dataDir, '-l', join(dataDir, 'server.log'), '-w', '-t', '60', 'start', '-o', options.join(' ')]);

  return clusterHandle({ bin, user, dataDir, port, isOwned: true });
}

function clusterHandle({ bin, user, dataDir, port, isOwned }) {
  const psql = (args) => pg(bin, user, 'psql', ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', ...args], { quiet: true });
  let isStopped = !isOwned;
  return {
    dataDir,
    url: (database) => `postgres://postgres@127.0.0.1:${port}/${database}`,
    createDatabase(name) {
      const exists = psql(['-tAc', `SELECT 1 FROM pg_database WHERE datname = '${name}'`]);
      if (exists.trim() !== '1') psql(['-c', `CREATE DATABASE "${name}"`]);
    },
    /** Stops the cluster if this handle started it. */
    stop() {
      if (isStopped) return;
      isStopped = true;
      spawnSync(join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop'], { ...user, stdio: 'ignore' });
    },
  };
}
