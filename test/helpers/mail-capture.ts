// E-mail in the API tests: the product's own SMTP sink on a free loopback port, every message read
// back with mailparser, and an outbox worker sending to it.
import { createSmtpTransport, type MailTransport } from '../../server/src/integrations/mail/mail-transport';
import { startSmtpSink, type CapturedMessage, type SmtpSink } from '../../server/src/integrations/mail/smtp-sink';
import { attachmentsFrom } from '../../server/src/notifications/mail-runtime';
import { OutboxWorker } from '../../server/src/notifications/outbox-worker';
import type { TestApp } from './test-app';

export interface MailCapture {
  sink: SmtpSink;
  messages: CapturedMessage[];
  transport: MailTransport;
  /** Messages to `email` (lower case), in the order received. */
  to(email: string): CapturedMessage[];
  clear(): void;
  close(): Promise<void>;
}

export async function startMailCapture(options: { reject?: (m: CapturedMessage) => Error | null } = {}): Promise<MailCapture> {
  const messages: CapturedMessage[] = [];
  const sink = await startSmtpSink({
    onMessage: (m) => {
      const problem = options.reject?.(m);
      if (problem) throw problem;
      messages.push(m);
    },
  });
  const transport = createSmtpTransport({ host: sink.host, port: sink.port, secure: false, user: null, password: null, ignoreTls: true, timeoutMs: 10_000 });
  return {
    sink,
    messages,
    transport,
    to: (email) => messages.filter((m) => m.to.includes(email.toLowerCase())),
    clear: () => void messages.splice(0),
    async close() {
      transport.close();
      await sink.close();
    },
  };
}

export function testWorker(t: TestApp, transport: MailTransport, overrides: Partial<ConstructorParameters<typeof OutboxWorker>[2]> = {}): OutboxWorker {
  return new OutboxWorker(t.services.outbox, transport, {
    name: 'api-test',
    from: 'Closing Circuit <no-reply@closing-circuit.test>',
    leaseMs: 60_000,
    maxAttempts: 3,
    backoffMs: 60_000,
    pollMs: 50,
    attachmentsOf: attachmentsFrom(t.services),
    ...overrides,
  });
}
