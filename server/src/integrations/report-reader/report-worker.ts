// The body of a report worker thread (piscina calls the default export once per task).
import { readReport, type ReadJob, type ReadLimits, type ReadOutcome } from './read-report';

export default function readInWorker({ job, limits }: { job: ReadJob; limits: ReadLimits }): Promise<ReadOutcome> {
  return readReport(job, limits);
}
