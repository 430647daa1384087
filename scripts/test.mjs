#!/usr/bin/env node
// `npm test`: every check of the project against a throwaway PostgreSQL cluster.
// Order: type check of every TypeScript project → unit + component tests → API tests → portal build →
// browser tests. Ends with one line `N passed, N failed` over all of them; exits non-zero on any failure.
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureChromium } from './lib/chromium.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { buildPortalIfStale } from './lib/portal-build.mjs';
import { freePort } from './lib/ports.mjs';
import { startCluster } from './lib/postgres.mjs';
import { run, runAsync } from './lib/run.mjs';
import { TYPECHECK_PROJECTS } from './lib/typecheck-projects.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
// `npm test -- --only=api,browser [file patterns]` runs some stages (typecheck, unit, portal, api, build,
// browser) on the same throwaway cluster, for a quick look; CI runs them all.
const args = process.argv.slice(2);
const onlyArg = args.find((a) => a.startsWith('--only='));
const only = onlyArg ? new Set(onlyArg.slice('--only='.length).split(',')) : null;
const patterns = args.filter((a) => !a.startsWith('--'));
const stage = (name) => !only || only.has(name);
const bin = (name) => join(root, 'node_modules/.bin', name);

ensureDependencies(root);
const chromium = ensureChromium();

const tally = { passed: 0, failed: 0, problems: [] };
const record = (name, passed, failed) => {
  tally.passed += passed;
  tally.failed += failed;
  if (failed) tally.problems.push(`${name}: ${failed} failed`);
};

async function jest(name, projects, env, extra = []) {
  const out = join(tmpdir(), `cc-jest-${name}-${process.pid}.json`);
  // 20 s per test and hook instead of jest's 5 s: the first test of a component file compiles it, and
  // uploads and bcrypt sign-ins take seconds on a busy 2-core machine (files may set their own).
  const code = await runAsync(bin('jest'), ['--selectProjects', ...projects, '--testTimeout=20000', '--json', `--outputFile=${out}`, ...extra], { cwd: root, env });
  let report;
  try {
    report = JSON.parse(readFileSync(out, 'utf8'));
  } catch {
    record(name, 0, 1);
    return;
  }
  rmSync(out, { force: true });
  const brokenSuites = report.numRuntimeErrorTestSuites ?? 0;
  const failed = report.numFailedTests + brokenSuites + (code !== 0 && report.numFailedTests + brokenSuites === 0 ? 1 : 0);
  record(name, report.numPassedTests, failed);
}

const workDir = mkdtempSync(join(tmpdir(), 'cc-test-'));
chmodSync(workDir, 0o755); // the postgres user must reach the cluster folder inside
const pgPort = await freePort();
console.log(`• Throwaway PostgreSQL on 127.0.0.1:${pgPort}`);
const cluster = startCluster({ dataDir: join(workDir, 'pg'), port: pgPort, throwaway: true });
const cleanUp = () => {
  cluster.stop();
  rmSync(workDir, { recursive: true, force: true });
};
process.on('SIGINT', () => {
  cleanUp();
  process.exit(130);
});

try {
  cluster.createDatabase('cc_api');
  cluster.createDatabase('cc_browser');
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    CHROMIUM_PATH: chromium,
    SESSION_SECRET: 'test-secret-that-is-only-used-by-the-test-suite',
    BCRYPT_ROUNDS: '4',
    STORAGE_DIR: join(workDir, 'files'),
  };
  const apiEnv = { ...env, DATABASE_URL: cluster.url('cc_api') };
  const browserEnv = { ...env, DATABASE_URL: cluster.url('cc_browser') };

  if (stage('typecheck')) console.log('\n## Type check');
  for (const project of stage('typecheck') ? TYPECHECK_PROJECTS : []) {
    const code = await runAsync(bin('tsc'), ['-p', project, '--noEmit'], { cwd: root });
    console.log(`${code === 0 ? '✓' : '✗'} tsc -p ${project}`);
    record(`tsc ${project}`, code === 0 ? 1 : 0, code === 0 ? 0 : 1);
  }

  // Separate runs: pdf.js (unit project) installs globals in its worker that break jsdom's set-up.
  if (stage('unit')) {
    console.log('\n## Unit tests');
    await jest('unit', ['unit'], env, patterns);
  }
  if (stage('portal')) {
    console.log('\n## Component tests (portal)');
    await jest('portal', ['portal'], env, patterns);
  }

  if (stage('api')) {
    console.log('\n## API tests (real PostgreSQL)');
    run(bin('tsx'), ['scripts/db-setup.ts', '--seed=never'], { cwd: root, env: apiEnv });
    await jest('api', ['api'], apiEnv, ['--runInBand', ...patterns]);
  }

  if (stage('build') || stage('browser')) {
    console.log('\n## Portal build');
    try {
      buildPortalIfStale(root);
      record('portal build', 1, 0);
    } catch {
      record('portal build', 0, 1);
    }
  }

  if (stage('browser')) {
    console.log('\n## Browser tests (Debian chromium)');
    run(bin('tsx'), ['scripts/db-setup.ts', '--seed=always'], { cwd: root, env: browserEnv });
    await jest('browser', ['browser'], browserEnv, ['--runInBand', ...patterns]);
  }
} catch (err) {
  console.error(err);
  record('test run', 0, 1);
} finally {
  cleanUp();
}

if (tally.problems.length) console.log(`\nFailures: ${tally.problems.join('; ')}`);
console.log(`\n${tally.passed} passed, ${tally.failed} failed`);
process.exit(tally.failed === 0 ? 0 : 1);
