import { join } from 'node:path';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { MAX_FINDINGS_PER_REPORT, MAX_REPORT_PAGES, MAX_REPORT_TEXT_CHARS } from '@cc/shared';
import type { ReadJob, ReadLimits, ReadOutcome } from './read-report';

export const DEFAULT_READ_LIMITS: ReadLimits = {
  maxPages: MAX_REPORT_PAGES,
  maxChars: MAX_REPORT_TEXT_CHARS,
  maxFindings: MAX_FINDINGS_PER_REPORT,
  maxInflatedBytes: 64 * 1024 * 1024,
};

export interface ReportReaderOptions {
  /** Worker threads reading at once (the rest of the server keeps the main thread). */
  maxThreads: number;
  /** A task still running after this long is stopped and its worker ended. */
  timeoutMs: number;
  /** V8 heap of each worker; a report that needs more ends its worker, not the server. */
  maxHeapMb: number;
  /** Reads waiting for a thread; beyond this the server answers "busy" at once. */
  maxQueue: number;
  limits?: ReadLimits;
}

/** A read that was refused because of the pool itself: too slow, too big for memory, or too busy. */
export type PoolRefusal = { status: 422 | 503; message: string; hint: string };

const WORKER_FILE = join(__dirname, 'report-worker.cjs');

/**
 * Reads and parses reports in a pool of worker threads (piscina), each with a memory limit, and
 * stops any read that runs past the time limit. The request thread only waits for the answer, so
 * one hostile upload cannot stall health checks or other people's requests.
 */
export class ReportReader {
  private readonly pool: Piscina;
  private readonly limits: ReadLimits;

  constructor(private readonly options: ReportReaderOptions) {
    this.limits = options.limits ?? DEFAULT_READ_LIMITS;
    this.pool = new Piscina({
      filename: WORKER_FILE,
      minThreads: 0,
      maxThreads: options.maxThreads,
      maxQueue: options.maxQueue,
      idleTimeout: 5 * 60_000,
      resourceLimits: {
        maxOldGenerationSizeMb: options.maxHeapMb,
        maxYoungGenerationSizeMb: Math.min(64, Math.ceil(options.maxHeapMb / 4)),
        stackSizeMb: 4,
      },
    });
  }

  /** Pages and findings of a report, or why it was refused. Other failures are thrown. */
  async read(job: ReadJob): Promise<ReadOutcome | { ok: false; refusal: PoolRefusal }> {
    // The time limit runs from the moment a worker starts on the task (it says so through the
    // port), so neither waiting in the queue nor a worker's start-up counts against the report;
    // a longer overall bound covers those.
    const controller = new AbortController();
    const { port1, port2 } = new MessageChannel();
    let timer: NodeJS.Timeout | undefined;
    port1.once('message', () => {
      timer = setTimeout(() => controller.abort(), this.options.timeoutMs);
    });
    const overall = setTimeout(() => controller.abort(), this.options.timeoutMs + 120_000);
    try {
      return await this.pool.run({ job, limits: this.limits, started: port2 }, { signal: controller.signal, transferList: [port2] });
    } catch (err) {
      const { name, message, code } = err as { name?: string; message?: string; code?: string };
      if (name === 'AbortError' || controller.signal.aborted) {
        return { ok: false, refusal: { status: 422, message: 'Reading this report took too long', hint: 'Upload only the electrical pages, or paste their text' } };
      }
      if (code === 'ERR_WORKER_OUT_OF_MEMORY') {
        return { ok: false, refusal: { status: 422, message: 'This report needs more memory to read than is allowed', hint: 'Upload only the electrical pages, or paste their text' } };
      }
      if (message === 'Task queue is at limit') {
        return { ok: false, refusal: { status: 503, message: 'Many reports are being read right now', hint: 'Try again in a minute' } };
      }
      throw err;
    } finally {
      clearTimeout(timer);
      clearTimeout(overall);
      port1.close();
    }
  }

  /** Ends the worker threads (at shutdown and after tests). */
  close(): Promise<void> {
    return this.pool.destroy();
  }
}
