// The body of a report worker thread (piscina calls the default export once per task).
import type { MessagePort } from 'node:worker_threads';
import { readReport, type ReadJob, type ReadLimits, type ReadOutcome } from './read-report';

export default function readInWorker({ job, limits, started }: { job: ReadJob; limits: ReadLimits; started?: MessagePort }): Promise<ReadOutcome> {
  // The PDF reader (pdf.js) loads on first use; loading it is not part of the time a read may take.
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  if (job.kind === 'pdf') require('../pdf-text');
  started?.postMessage('started');
  started?.close();
  return readReport(job, limits);
}
