// Before the browser tests: the real server (built portal + API) on a free loopback port, on the
// database named by DATABASE_URL, which `npm test` seeds with the demo scenario.
import { spawn } from 'node:child_process';
import { createServer } from 'node:net';
import { join } from 'node:path';

const root = join(__dirname, '..', '..');

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

async function waitForHealth(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`The server did not answer ${url}/api/health within ${timeoutMs} ms`);
}

export default async function globalSetup(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('The browser tests need DATABASE_URL (npm test sets it).');
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const server = spawn(join(root, 'node_modules/.bin/tsx'), ['server/src/main.ts'], {
    cwd: root,
    env: { ...process.env, PORT: String(port), PUBLIC_URL: baseUrl, NODE_ENV: 'test', ITEM_MESSAGES_GATHER_MINUTES: '0' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  (globalThis as { __serverProcess?: typeof server }).__serverProcess = server;
  process.env.PORTAL_URL = baseUrl;
  // tsx compiles the server on start; on a busy 2-core machine that takes well over 30 s.
  await waitForHealth(baseUrl, 180_000);
}
