// Pure rules of the dashboards: the risk to a closing, the pipeline stage of a request, the months a
// revenue chart covers, and conversion. Asked of the shared flow table, never of a second state list.
import { isEnded, movesOnFrom, requestPathTo, type RequestEvent } from '../requests/request-flow';
import type { RequestStatus } from '../requests/request-status';
import type { ClosingRisk, PipelineStage } from './dashboard.schema';

/** Days to closing at or under which a request whose work is still open is at risk. */
export const AT_RISK_DAYS = 7;
/** Days to closing at or under which a request without an approved quote needs watching. */
export const WATCH_DAYS = 21;

/** Whether the seller's approval is behind a request in `status` on the usual path. */
export function isPastApproval(status: RequestStatus): boolean {
  return requestPathTo(status).some((m) => m.event === 'approve');
}

/**
 * The risk to the closing of a request: high when the closing is at most a week away (or passed) and
 * the completion letter is not out; medium within three weeks while no quote is approved yet.
 */
export function closingRisk(status: RequestStatus, daysLeft: number): ClosingRisk {
  if (isEnded(status)) return 'none';
  if (status === 'letter-issued') return 'low';
  if (daysLeft <= AT_RISK_DAYS) return 'high';
  if (daysLeft <= WATCH_DAYS && !isPastApproval(status)) return 'medium';
  return 'low';
}

/** The contractor-side pipeline stage named by the next move the flow makes from a state. */
const STAGE_OF_NEXT_MOVE: Partial<Record<RequestEvent, PipelineStage>> = {
  'send-quote': 'to-price',
  approve: 'awaiting-approval',
  schedule: 'to-schedule',
  'start-work': 'to-correct',
  'finish-work': 'to-correct',
  'resume-work': 'to-correct',
  'issue-letter': 'letters-due',
};

/** The pipeline stage a request in `status` sits in, or null when it is in none (draft, ended ...). */
export function pipelineStage(status: RequestStatus): PipelineStage | null {
  for (const move of movesOnFrom(status)) {
    const stage = STAGE_OF_NEXT_MOVE[move.event];
    if (stage) return stage;
  }
  return null;
}

/** The `count` months ending with the month of `today` (YYYY-MM-DD), oldest first, as YYYY-MM. */
export function monthsEndingAt(today: string, count: number): string[] {
  const year = Number(today.slice(0, 4));
  const month = Number(today.slice(5, 7)) - 1;
  const months: string[] = [];
  for (let i = count - 1; i >= 0; i--) {
    const d = new Date(Date.UTC(year, month - i, 1));
    months.push(`${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, '0')}`);
  }
  return months;
}

/** Whole percent of `part` in `whole`, rounded half up; 0 for nothing. */
export function wholePercent(part: number, whole: number): number {
  return whole === 0 ? 0 : Math.floor((part * 100) / whole + 0.5);
}
