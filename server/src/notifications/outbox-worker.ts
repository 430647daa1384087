// Sends what the outbox holds. Each message is claimed alone under a lease (FOR UPDATE SKIP LOCKED,
// committed before the SMTP conversation starts), renewed while the send is under way, sent with its
// fixed Message-ID, then marked sent under the same lease. A worker that stops mid-send leaves its claim to run out; the next worker
// takes the message over and sends it, so a message the mail server never accepted is not lost, and
// one recorded as sent is never sent again. Failures are retried with exponential backoff and every
// attempt is recorded in outbox_attempts.
import { hostname } from 'node:os';
import { isPermanentSmtpError, type MailAttachment, type MailTransport } from '../integrations/mail/mail-transport';
import type { ClaimedMessage, OutboxRepository } from './outbox.repository';

export interface OutboxWorkerOptions {
  /** Names the worker in the attempt records. */
  name?: string;
  from: string;
  /** How long a claim holds without renewal; renewed every third of it while sending. */
  leaseMs: number;
  maxAttempts: number;
  /** First retry after this; each further retry waits twice as long (at most an hour). */
  backoffMs: number;
  /** Pause between looks at an empty outbox. */
  pollMs: number;
  /** The files a message carries, made when it is sent (the invoice PDF named by the row). */
  attachmentsOf?: (row: ClaimedMessage['row']) => Promise<MailAttachment[]>;
  /** Called between sends (the daily digest hangs here). */
  onIdle?: () => Promise<void>;
}

export const MAX_BACKOFF_MS = 3_600_000;

/** When the next try of a message that failed its `attempt`-th try is due. */
export function retryDelayMs(attempt: number, backoffMs: number): number {
  return Math.min(backoffMs * 2 ** (attempt - 1), MAX_BACKOFF_MS);
}

export class OutboxWorker {
  private running = false;
  private timer: NodeJS.Timeout | null = null;
  private current: Promise<unknown> = Promise.resolve();
  readonly name: string;

  constructor(
    private readonly outbox: OutboxRepository,
    private readonly transport: MailTransport,
    private readonly options: OutboxWorkerOptions,
  ) {
    this.name = options.name ?? `${hostname()}:${process.pid}`;
  }

  /** Claims and sends one message; false when nothing is due. */
  async sendOne(): Promise<boolean> {
    const claim = await this.outbox.claimNext(this.name, this.options.leaseMs);
    if (!claim) return false;
    await this.deliver(claim);
    return true;
  }

  private async deliver(claim: ClaimedMessage): Promise<void> {
    const { row } = claim;
    const renewal = setInterval(() => {
      this.outbox.renewLease(claim, this.options.leaseMs).catch((err: Error) => console.error('Outbox worker: could not renew a claim:', err.message));
    }, Math.max(100, Math.floor(this.options.leaseMs / 3)));
    try {
      const attachments = (await this.options.attachmentsOf?.(row)) ?? [];
      await this.transport.send({
        from: this.options.from,
        to: row.recipient_email,
        subject: row.subject,
        text: row.text_body,
        html: row.html_body,
        messageId: row.message_id,
        headers: { 'X-Closing-Circuit-Kind': row.kind },
        ...(attachments.length ? { attachments } : {}),
      });
    } catch (err) {
      const message = (err as Error).message.slice(0, 1000);
      const giveUp = isPermanentSmtpError(err) || claim.attempt >= this.options.maxAttempts;
      clearInterval(renewal);
      await this.outbox.markFailed(claim, message, giveUp ? null : new Date(Date.now() + retryDelayMs(claim.attempt, this.options.backoffMs)));
      return;
    }
    clearInterval(renewal);
    await this.outbox.markSent(claim);
  }

  /** Sends until nothing is due (or `max` messages); returns how many were handled. */
  async drain(max = 10_000): Promise<number> {
    let handled = 0;
    while (handled < max && (await this.sendOne())) handled++;
    return handled;
  }

  start(): void {
    if (this.running) return;
    this.running = true;
    const tick = async () => {
      if (!this.running) return;
      try {
        const handled = await this.drain(100);
        if (handled === 0) await this.options.onIdle?.();
      } catch (err) {
        console.error('Outbox worker:', (err as Error).message);
      }
      if (this.running) this.timer = setTimeout(() => (this.current = tick()), this.options.pollMs);
    };
    this.current = tick();
  }

  /** Stops after the message under way (if any) is recorded. */
  async stop(): Promise<void> {
    this.running = false;
    if (this.timer) clearTimeout(this.timer);
    await this.current;
  }
}
