// Exactly-once sending across a crash: a worker process is killed (SIGKILL) while the mail server is
// taking one of its messages; a new worker process takes over and every message arrives exactly once.
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { startSmtpSink, type CapturedMessage, type SmtpSink } from '../../server/src/integrations/mail/smtp-sink';
import { resetDatabase } from '../helpers/fixtures';
import { createPricedRequest, createPricingCast, type PricingCast } from '../helpers/pricing-fixtures';
import { createTestApp, type TestApp } from '../helpers/test-app';

jest.setTimeout(400_000);

const root = join(__dirname, '..', '..');
let t: TestApp;
let cast: PricingCast;
let sink: SmtpSink;
const received: CapturedMessage[] = [];
/** Which message (counted from 1) the sink holds without a reply until released, and the signals. */
let hold: { at: number; taken: number; arrived: () => void; release: Promise<void> } | null = null;

function startWorker(name: string): ChildProcess {
  // node itself with the tsx loader (not the tsx wrapper), so that a kill reaches the worker itself.
  return spawn(process.execPath, ['--import', 'tsx', 'server/src/notifications/worker-main.ts'], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      SESSION_SECRET: 'test-secret-that-is-only-used-by-the-test-suite',
      SMTP_HOST: sink.host,
      SMTP_PORT: String(sink.port),
      OUTBOX_LEASE_MS: '3000',
      PUBLIC_URL: 'http://portal.test',
      OUTBOX_WORKER_NAME: name,
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

const exited = (child: ChildProcess) => new Promise<void>((resolve) => (child.exitCode !== null || child.signalCode !== null ? resolve() : child.once('exit', () => resolve())));

async function waitFor(check: () => Promise<boolean>, what: string, timeoutMs = 180_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`Gave up waiting: ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const statuses = async (ids: string[]) => (await t.db('outbox_messages').whereIn('id', ids).select('status')).map((r) => r.status as string);

beforeAll(async () => {
  t = createTestApp();
  await resetDatabase(t.db);
  cast = await createPricingCast(t.app, t.db);
  sink = await startSmtpSink({
    onMessage: async (m) => {
      if (hold && ++hold.taken === hold.at) {
        hold.arrived();
        await hold.release;
        // The sender went away before the reply: the message was never accepted.
        throw new Error('the sender left before the reply');
      }
      received.push(m);
    },
  });
});
afterAll(async () => {
  await sink.close();
  await t.close();
});

/** Writes `letters` × 4 messages (one per letter to the inspector, both agents and the seller); returns their ids. */
async function queueMessages(letters: number): Promise<string[]> {
  const { requestId } = await createPricedRequest(cast, t.db, { items: [{ code: 'gfci-inoperative', quantity: 1 }] });
  await t.db('outbox_messages').where({ status: 'pending' }).update({ status: 'skipped' });
  await t.db.transaction(async (trx) => {
    for (let revision = 1; revision <= letters; revision++) await t.services.notifications.notify(trx, { kind: 'letter-issued', requestId, actorUserId: null, letterNumber: `CL-${requestId}`, revision });
  });
  return (await t.db('outbox_messages').where({ request_id: requestId, kind: 'letter-issued' }).orderBy('id').select('id')).map((r) => String(r.id));
}

it('a worker killed mid-send is taken over by a restarted one, and each message is sent exactly once', async () => {
  const ids = await queueMessages(4);
  expect(ids).toHaveLength(16);
  received.splice(0);
  // The fourth message the sink takes is held without a reply; the worker is killed meanwhile.
  let letGo!: () => void;
  const release = new Promise<void>((r) => (letGo = r));
  const arrived = new Promise<void>((resolve) => (hold = { at: 4, taken: 0, arrived: resolve, release }));
  const first = startWorker('first');
  await arrived;
  first.kill('SIGKILL');
  await exited(first);
  letGo();
  hold = null;

  const held = await t.db('outbox_messages').whereIn('id', ids).andWhere({ status: 'sending' }).select('id', 'message_id');
  expect(held).toHaveLength(1);
  expect(received.map((m) => m.messageId)).not.toContain(held[0].message_id);
  const sentBefore = received.length;
  expect(sentBefore).toBeGreaterThanOrEqual(3);

  const second = startWorker('second');
  try {
    await waitFor(async () => (await statuses(ids)).every((s) => s === 'sent'), 'every message sent after the restart');
  } finally {
    second.kill('SIGTERM');
    await exited(second);
  }
  const expectedIds = (await t.db('outbox_messages').whereIn('id', ids).select('message_id')).map((r) => r.message_id).sort();
  expect(received.map((m) => m.messageId).sort()).toEqual(expectedIds);
  // The interrupted message: its first attempt is recorded as interrupted, the second as sent.
  const attempts = await t.db('outbox_attempts').where({ message_id: held[0].id }).orderBy('attempt');
  expect(attempts.map((a) => [a.attempt, a.outcome])).toEqual([
    [1, 'interrupted'],
    [2, 'sent'],
  ]);
});

it('two workers at once share the outbox and never send a message twice', async () => {
  const ids = await queueMessages(10);
  received.splice(0);
  const workers = [startWorker('a'), startWorker('b')];
  try {
    await waitFor(async () => (await statuses(ids)).every((s) => s === 'sent'), 'every message sent by the two workers');
  } finally {
    for (const w of workers) w.kill('SIGTERM');
    await Promise.all(workers.map(exited));
  }
  const messageIds = received.map((m) => m.messageId);
  expect(messageIds).toHaveLength(40);
  expect(new Set(messageIds).size).toBe(40);
  const perMessage = await t.db('outbox_attempts').whereIn('message_id', ids).groupBy('message_id').select('message_id').count({ n: '*' });
  expect(perMessage.every((r) => Number(r.n) === 1)).toBe(true);
});
