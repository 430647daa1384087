import type { ChildProcess } from 'node:child_process';

export default async function globalTeardown(): Promise<void> {
  const server = (globalThis as { __serverProcess?: ChildProcess }).__serverProcess;
  if (!server || server.exitCode !== null) return;
  await new Promise<void>((resolve) => {
    server.once('exit', () => resolve());
    server.kill('SIGTERM');
    setTimeout(() => server.kill('SIGKILL'), 5000).unref();
  });
}
