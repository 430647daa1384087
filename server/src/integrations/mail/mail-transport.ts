// Sending e-mail over SMTP with nodemailer. The outbox worker is the only caller.
import nodemailer from 'nodemailer';

export interface OutgoingMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Fixed per outbox row, so a receiving system can tell a message it already has. */
  messageId: string;
  headers?: Record<string, string>;
  attachments?: MailAttachment[];
}

/** A file sent with a message (the invoice PDF to the escrow company). */
export interface MailAttachment {
  fileName: string;
  contentType: string;
  content: Buffer;
}

export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export interface SmtpSettings {
  host: string;
  port: number;
  /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  user: string | null;
  password: string | null;
  /** Only for the local sink on loopback, which offers no TLS. */
  ignoreTls: boolean;
  /** Longest wait for the server at any step; the outbox lease is longer than this. */
  timeoutMs: number;
}

/** An SMTP error whose code says that trying again will not help (5xx). */
export function isPermanentSmtpError(err: unknown): boolean {
  const code = (err as { responseCode?: number }).responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

export function createSmtpTransport(settings: SmtpSettings): MailTransport {
  const transporter = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure,
    ignoreTLS: settings.ignoreTls,
    auth: settings.user ? { user: settings.user, pass: settings.password ?? '' } : undefined,
    connectionTimeout: settings.timeoutMs,
    greetingTimeout: settings.timeoutMs,
    socketTimeout: settings.timeoutMs,
  });
  return {
    async send(mail) {
      await transporter.sendMail({
        from: mail.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        messageId: mail.messageId,
        headers: mail.headers,
        attachments: mail.attachments?.map((a) => ({ filename: a.fileName, contentType: a.contentType, content: a.content })),
      });
    },
    close: () => transporter.close(),
  };
}
