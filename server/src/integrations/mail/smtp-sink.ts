// A local SMTP server on loopback that keeps every message it receives instead of delivering it:
// `npm start` and the tests send mail here unless real SMTP settings are given. Messages are parsed
// with mailparser and handed to `onMessage` (the development mailbox stores them).
import type { AddressObject } from 'mailparser';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface CapturedMessage {
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  /** The files it carried. */
  attachments: { fileName: string; contentType: string; content: Buffer }[];
  /** The raw message as received. */
  raw: Buffer;
}

export interface SmtpSinkOptions {
  port?: number;
  /** Called for each message once it is fully received; the sink answers 250 after it resolves. */
  onMessage(message: CapturedMessage): Promise<void> | void;
  /** Called when a message starts arriving (tests use it to stop a sender half-way). */
  onDataStart?(): void;
  /** Largest message taken, in bytes. */
  maxBytes?: number;
}

export interface SmtpSink {
  host: string;
  port: number;
  close(): Promise<void>;
}

const addresses = (field: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(field) ? field : field ? [field] : []).flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);

export async function parseMessage(raw: Buffer): Promise<CapturedMessage> {
  const parsed = await simpleParser(raw);
  return {
    messageId: parsed.messageId ?? null,
    from: addresses(parsed.from ? [parsed.from] : undefined)[0] ?? '',
    to: addresses(parsed.to),
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : '',
    attachments: parsed.attachments.map((a) => ({ fileName: a.filename ?? 'attachment', contentType: a.contentType, content: a.content })),
    raw,
  };
}

export function startSmtpSink(options: SmtpSinkOptions): Promise<SmtpSink> {
  const maxBytes = options.maxBytes ?? 5 * 1024 * 1024;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: maxBytes,
    logger: false,
    onData(stream, _session, callback) {
      options.onDataStart?.();
      const chunks: Buffer[] = [];
      let size = 0;
      stream.on('data', (chunk: Buffer) => {
        size += chunk.length;
        if (size <= maxBytes) chunks.push(chunk);
      });
      stream.on('end', () => {
        if (stream.sizeExceeded || size > maxBytes) return callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
        const raw = Buffer.concat(chunks);
        parseMessage(raw)
          .then((message) => options.onMessage(message))
          .then(() => callback())
          .catch((err: Error & { responseCode?: number }) =>
            callback(Object.assign(new Error(`Could not keep the message: ${err.message}`), { responseCode: err.responseCode ?? 451 })),
          );
      });
    },
  });
  server.on('error', (err) => console.error('Local mail sink:', err.message));
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => {
      const address = server.server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      resolve({ host: '127.0.0.1', port, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
