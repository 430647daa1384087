// List endpoints at scale: a throwaway PostgreSQL cluster is filled with 10,015 repair requests and
// 200,045 line items (generated in SQL), the real server runs in its own process on it, and
// autocannon loads each list endpoint in turn, each run between two runs of /api/health in the same
// session. Reported per endpoint: requests/s and p99 latency, and both as ratios against the health
// endpoint's figures measured around it. Target: every list >= 50 % of health's throughput and
// p99 <= 2x health's p99. Ratios, not absolute figures, because the machine is shared.
//   npx tsx bench/run.ts api            (BENCH_SECONDS=5 by default per run)
// BENCH_DATABASE_URL=postgres://... uses that database instead of a throwaway cluster and keeps it:
// filled on the first run (when it has no requests), then read as it is, so that two builds of the
// server can be measured in turn on the same data (each run of the bench from its own tree).
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync, chmodSync } from 'node:fs';
import { createServer } from 'node:net';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import bcrypt from 'bcryptjs';
import knex, { type Knex } from 'knex';
import { ITEM_STATUSES, REQUEST_STATUSES } from '@cc/shared';

const root = join(__dirname, '..');
const REQUESTS = 10_015;
const ITEMS = 200_045;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = 50;
const PASSWORD = 'bench-password';
const TARGET_THROUGHPUT = 0.5;
const TARGET_P99 = 2;

interface Cluster {
  url(db: string): string;
  createDatabase(name: string): void;
  stop(): void;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/**
 * The data set: one brokerage with 50 agents, 20 contractor organisations with one user each, and
 * requests whose buyer's agent is the first agent one time in four (2,504 requests) and whose
 * contractor is the first organisation one time in three (3,339 requests). The states come from the
 * flow's own lists, mixed so that the first agent and the first contractor each have requests in every
 * state (the contractor's "awaiting prices" page has rows to show). Every request has ~20 line items
 * in mixed states.
 */
export async function fill(db: Knex): Promise<void> {
  const hash = await bcrypt.hash(PASSWORD, 4);
  await db.raw(`INSERT INTO organisations (name, kind) VALUES ('Bench Realty', 'brokerage')`);
  await db.raw(`INSERT INTO organisations (name, kind) SELECT 'Bench Electric ' || g, 'contractor' FROM generate_series(1, 20) g`);
  await db.raw(
    `INSERT INTO users (email, name, password_hash, role, organisation_id)
     SELECT 'agent' || g || '@bench.test', 'Agent ' || g, ?, 'agent', (SELECT id FROM organisations WHERE kind = 'brokerage') FROM generate_series(1, 50) g`,
    [hash],
  );
  await db.raw(
    `INSERT INTO users (email, name, password_hash, role, organisation_id)
     SELECT 'contractor' || o.rn || '@bench.test', 'Contractor ' || o.rn, ?, 'contractor', o.id
     FROM (SELECT id, row_number() OVER (ORDER BY id) AS rn FROM organisations WHERE kind = 'contractor') o`,
    [hash],
  );
  await db.raw(`INSERT INTO users (email, name, password_hash, role) VALUES ('admin@bench.test', 'Bench Admin', ?, 'admin')`, [hash]);
  await db.raw(
    `WITH c AS (SELECT array_agg(id ORDER BY id) AS ids FROM organisations WHERE kind = 'contractor'),
          a AS (SELECT array_agg(id ORDER BY id) AS ids FROM users WHERE role = 'agent'),
          s AS (SELECT ?::text[] AS names)
     INSERT INTO repair_requests (street, city, state, zip, year_built, closing_date, nec_edition, status, contractor_organisation_id, created_by, created_at)
     SELECT g || ' Bench Street', 'Marlow Springs', 'CO', lpad((80900 + g % 90)::text, 5, '0'), 1940 + g % 80,
            date '2027-01-01' + (g * 7919) % 365, 2020, s.names[1 + (g + g / ${REQUEST_STATUSES.length}) % ${REQUEST_STATUSES.length}],
            CASE WHEN g % 3 = 0 THEN c.ids[1] ELSE c.ids[2 + g % 19] END,
            CASE WHEN g % 4 = 0 THEN a.ids[1] ELSE a.ids[2 + g % 49] END,
            now() - (g || ' minutes')::interval
     FROM generate_series(1, ${REQUESTS}) g, c, a, s`,
    [[...REQUEST_STATUSES]],
  );
  await db.raw(
    `INSERT INTO request_parties (request_id, role, email, user_id, joined_at)
     SELECT r.id, 'buyer-agent', u.email, u.id, now() FROM repair_requests r JOIN users u ON u.id = r.created_by`,
  );
  await db.raw(
    `WITH i AS (SELECT ?::text[] AS names)
     INSERT INTO line_items (request_id, code, room, quantity, severity, status)
     SELECT r.id, 'gfci-missing', 'kitchen', 1 + k % 3, 'safety', i.names[1 + (r.id + k) % ${ITEM_STATUSES.length}]
     FROM repair_requests r, generate_series(1, 20) k, i`,
    [[...ITEM_STATUSES]],
  );
  const extra = ITEMS - REQUESTS * 20;
  await db.raw(
    `INSERT INTO line_items (request_id, code, room, quantity, severity, status)
     SELECT (SELECT min(id) FROM repair_requests) + g - 1, 'open-ground', 'bedroom', 1, 'safety', 'open' FROM generate_series(1, ${extra}) g`,
  );
  // As autovacuum leaves a table some time after a bulk load: statistics, and the visibility map
  // that lets index-only scans skip the table.
  await db.raw('VACUUM ANALYZE');
}

async function waitForHealth(url: string): Promise<void> {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('The server did not start');
}

async function signIn(url: string, email: string): Promise<string> {
  const first = await fetch(`${url}/api/auth/csrf`);
  const cookie = (first.headers.get('set-cookie') ?? '').split(';')[0];
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`Sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  return (res.headers.get('set-cookie') ?? cookie).split(';')[0];
}

interface Figures {
  rps: number;
  p99: number;
  errors: number;
}

async function load(url: string, cookie: string | null): Promise<Figures> {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers: cookie ? { cookie } : {} });
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx };
}

export async function run(): Promise<void> {
  const work = mkdtempSync(join(tmpdir(), 'cc-bench-api-'));
  chmodSync(work, 0o755);
  const kept = process.env.BENCH_DATABASE_URL;
  let cluster: Cluster | null = null;
  if (!kept) {
    const pgPort = await freePort();
    const { startCluster } = (await import(join(root, 'scripts/lib/postgres.mjs'))) as {
      startCluster(o: { dataDir: string; port: number; throwaway: boolean }): Cluster;
    };
    cluster = startCluster({ dataDir: join(work, 'pg'), port: pgPort, throwaway: true });
  }
  let server: ChildProcess | null = null;
  try {
    if (cluster) cluster.createDatabase('cc_bench');
    const databaseUrl = kept ?? cluster!.url('cc_bench');
    const db = knex({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 2 } });
    const started = Date.now();
    const { default: config } = await import('../server/src/db/knexfile');
    const migrator = knex({ ...config, connection: databaseUrl });
    await migrator.migrate.latest();
    await migrator.destroy();
    const [{ n }] = (await db.raw('SELECT count(*)::int AS n FROM repair_requests')).rows as { n: number }[];
    if (n === 0) await fill(db);
    else if (n !== REQUESTS) throw new Error(`BENCH_DATABASE_URL holds ${n} requests, not the bench's ${REQUESTS}: give it an empty database`);
    const [{ id: sampleRequest }] = await db('request_parties as p').join('users as u', 'u.id', 'p.user_id').where('u.email', 'agent1@bench.test').orderBy('p.request_id').limit(1).select('p.request_id as id');
    await db.destroy();
    console.log(`Data: ${REQUESTS} requests, ${ITEMS} line items, ${kept ? 'kept in BENCH_DATABASE_URL, ready' : 'built'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);

    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    // The server as `npm start` runs it: built as JavaScript, run by node.
    const { buildServer } = (await import(join(root, 'scripts/lib/server-build.mjs'))) as { buildServer(root: string): Promise<string> };
    const entry = await buildServer(root);
    server = spawn(process.execPath, [entry], {
      cwd: root,
      env: { ...process.env, NODE_ENV: 'production', DATABASE_URL: databaseUrl, PORT: String(port), PUBLIC_URL: url, SESSION_SECRET: 'bench-secret-bench-secret-bench-secret', STORAGE_DIR: join(work, 'files') },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    await waitForHealth(url);
    const agent = await signIn(url, 'agent1@bench.test');
    const contractor = await signIn(url, 'contractor1@bench.test');
    const admin = await signIn(url, 'admin@bench.test');

    // The portal reaches page 101 through the cursor page 100 gave it (keyset paging): so does the bench.
    const deep = '/api/requests?pageSize=25&sort=closingDate&direction=asc';
    const page100 = (await (await fetch(`${url}${deep}&page=99`, { headers: { cookie: agent } })).json()) as { nextCursor: string };
    const endpoints: { name: string; path: string; cookie: string }[] = [
      { name: 'agent: my requests, page 1', path: '/api/requests?page=0&pageSize=25', cookie: agent },
      { name: 'agent: page 101 by closing date', path: `${deep}&page=100&after=${page100.nextCursor}`, cookie: agent },
      { name: 'contractor: assigned requests', path: '/api/requests?page=0&pageSize=25', cookie: contractor },
      { name: 'contractor: awaiting prices', path: '/api/requests?page=0&pageSize=25&status=pricing&sort=closingDate', cookie: contractor },
      { name: 'admin: every request by street', path: '/api/requests?page=0&pageSize=25&sort=street', cookie: admin },
      { name: 'agent: search "Bench Street"', path: '/api/requests?page=0&pageSize=25&q=4%20Bench', cookie: agent },
      { name: 'a request’s items', path: `/api/requests/${sampleRequest}/items`, cookie: agent },
    ];

    // Each endpoint must answer with rows: a benchmark of an empty page measures nothing but the session.
    for (const e of endpoints) {
      const body = (await (await fetch(`${url}${e.path}`, { headers: { cookie: e.cookie } })).json()) as { items?: unknown[] } | unknown[];
      const count = Array.isArray(body) ? body.length : (body.items?.length ?? 0);
      if (count === 0) throw new Error(`${e.name}: the data set gives this endpoint no rows`);
    }

    const load1 = () => loadavg().map((l) => l.toFixed(2)).join(' ');
    console.log(`Load average before the runs: ${load1()}`);
    const health = `${url}/api/health`;
    await load(health, null); // warm-up
    const rows: string[] = [];
    let met = 0;
    for (const e of endpoints) {
      await load(`${url}${e.path}`, e.cookie); // warm-up of this query
      const before = await load(health, null);
      const list = await load(`${url}${e.path}`, e.cookie);
      const after = await load(health, null);
      const base = { rps: (before.rps + after.rps) / 2, p99: (before.p99 + after.p99) / 2 };
      const throughput = list.rps / base.rps;
      const p99 = list.p99 / Math.max(base.p99, 1);
      const ok = throughput >= TARGET_THROUGHPUT && p99 <= TARGET_P99 && list.errors === 0;
      if (ok) met++;
      rows.push(
        `  ${e.name.padEnd(34)} ${list.rps.toFixed(0).padStart(6)} req/s  p99 ${String(list.p99).padStart(5)} ms | health ${base.rps.toFixed(0).padStart(6)} req/s p99 ${base.p99.toFixed(0).padStart(4)} ms | ${(100 * throughput).toFixed(0).padStart(3)} % of health, p99 ${p99.toFixed(2)}x${list.errors ? `  ERRORS ${list.errors}` : ''} ${ok ? '✓' : '✗'}`,
      );
    }
    console.log(`Each run ${SECONDS} s, ${CONNECTIONS} connections; target >= ${100 * TARGET_THROUGHPUT} % of health's req/s and p99 <= ${TARGET_P99}x health's`);
    for (const r of rows) console.log(r);
    console.log(`${met} of ${endpoints.length} endpoints meet the target (load average after the runs: ${load1()})`);
  } finally {
    // The server ends before its database does (else its read pool reports every dropped connection).
    if (server && server.exitCode === null) {
      const exited = new Promise((resolve) => server!.once('exit', resolve));
      server.kill('SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 10_000))]);
    }
    cluster?.stop();
    rmSync(work, { recursive: true, force: true });
  }
}
