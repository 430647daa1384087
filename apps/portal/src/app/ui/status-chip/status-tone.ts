import { RequestStatus } from '@cc/shared';

/** Groups of states that share one look: getting ready, waiting on someone, work, finished, stopped. */
export type StatusTone = 'setup' | 'waiting' | 'work' | 'finished' | 'stopped';

const TONES: Record<RequestStatus, StatusTone> = {
  draft: 'setup',
  intake: 'setup',
  pricing: 'waiting',
  quoted: 'waiting',
  approved: 'work',
  scheduled: 'work',
  'in-progress': 'work',
  reopened: 'work',
  corrected: 'finished',
  'letter-issued': 'finished',
  accepted: 'finished',
  declined: 'stopped',
  withdrawn: 'stopped',
};

export function statusTone(status: RequestStatus): StatusTone {
  return TONES[status];
}
