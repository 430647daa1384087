// E-mail for a running server: the transport (real SMTP from the environment, else the local sink
// on loopback, whose messages fill the development mailbox), and the outbox worker with the daily
// digest hung on its idle moments.
import type { Config } from '../config/config';
import { createSmtpTransport, type MailAttachment, type SmtpSettings } from '../integrations/mail/mail-transport';
import type { OutboxRow } from './outbox.repository';
import { startSmtpSink, type SmtpSink } from '../integrations/mail/smtp-sink';
import type { Services } from '../services';
import { digestDayDue } from './daily-digest';
import { OutboxWorker } from './outbox-worker';

export interface MailRuntime {
  sink: SmtpSink | null;
  worker: OutboxWorker | null;
  stop(): Promise<void>;
}

/** The files an outbox row carries: the PDF of the invoice it names, rendered when the worker sends it. */
export function attachmentsFrom(services: Pick<Services, 'sellerSide'>): (row: OutboxRow) => Promise<MailAttachment[]> {
  return async (row) => (row.attachment_invoice_id === null ? [] : [await services.sellerSide.invoices.attachment(row.attachment_invoice_id)]);
}

export async function startMail(config: Config, services: Services): Promise<MailRuntime> {
  // The worker renews its claim while a send is under way, so a slow server is waited for.
  const TRANSPORT_TIMEOUT_MS = 30_000;
  let sink: SmtpSink | null = null;
  let smtp: SmtpSettings;
  if (config.mail.smtp) {
    smtp = { ...config.mail.smtp, ignoreTls: false, timeoutMs: TRANSPORT_TIMEOUT_MS };
  } else {
    const mailbox = services.mailbox!;
    sink = await startSmtpSink({ port: config.mail.sinkPort, onMessage: (m) => mailbox.keep(m) });
    smtp = { host: sink.host, port: sink.port, secure: false, user: null, password: null, ignoreTls: true, timeoutMs: TRANSPORT_TIMEOUT_MS };
    console.log(`E-mail goes to the local sink on ${sink.host}:${sink.port}; read it in the portal under Development mailbox (administrators).`);
  }
  const transport = createSmtpTransport(smtp);
  let lastDigestCheck = 0;
  const worker = config.mail.runWorker
    ? new OutboxWorker(services.outbox, transport, {
        name: config.mail.workerName ?? undefined,
        from: config.mail.from,
        leaseMs: config.mail.leaseMs,
        maxAttempts: 8,
        backoffMs: 30_000,
        pollMs: 1_000,
        attachmentsOf: attachmentsFrom(services),
        onIdle: async () => {
          if (Date.now() - lastDigestCheck < 60_000) return;
          lastDigestCheck = Date.now();
          const day = digestDayDue(new Date(), config.mail.digestHourUtc);
          if (day) await services.digest.run(day);
        },
      })
    : null;
  worker?.start();
  return {
    sink,
    worker,
    async stop() {
      await worker?.stop();
      transport.close();
      await sink?.close();
    },
  };
}
