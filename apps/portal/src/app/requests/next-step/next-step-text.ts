import {
  actorsOf,
  actorWords,
  FLOW_ACTOR_LABELS,
  isEnded,
  movesOnFrom,
  REQUEST_STATUS_LABELS,
  RequestEvent,
  RequestStatus,
  Role,
  statesAllowing,
  PartyRole,
  whoActsNext,
} from '@cc/shared';

/** Where in the portal a move is made today. Moves not listed here are not in the portal yet. */
export interface PortalPlace {
  /** Router commands, built from the request id. */
  link: (requestId: number) => unknown[];
  /** What the link says. */
  text: string;
  /** Whether it is done on the request page itself (the panel there says "below" instead of linking). */
  isOnRequestPage: boolean;
}

export const PORTAL_PLACES: Partial<Record<RequestEvent, PortalPlace>> = {
  'add-report': { link: (id) => ['/requests', id], text: 'Add the inspection report', isOnRequestPage: true },
  'confirm-items': { link: (id) => ['/requests', id], text: 'Review and confirm the items', isOnRequestPage: true },
  'send-quote': { link: (id) => ['/requests', id, 'pricing'], text: 'Price the items and send the quote', isOnRequestPage: false },
  approve: { link: (id) => ['/requests', id, 'approval'], text: 'Approve or decline the items', isOnRequestPage: false },
  decline: { link: (id) => ['/requests', id, 'approval'], text: 'Approve or decline the items', isOnRequestPage: false },
  'approve-change-order': { link: (id) => ['/requests', id, 'approval'], text: 'Decide on the change order', isOnRequestPage: false },
  schedule: { link: (id) => ['/requests', id, 'work'], text: 'Book the visit', isOnRequestPage: false },
  // Calling off the last booked visit, on the visit's card.
  unschedule: { link: (id) => ['/requests', id, 'work'], text: 'Open visits and proof', isOnRequestPage: false },
  'start-work': { link: (id) => ['/requests', id, 'work'], text: 'Open visits and proof', isOnRequestPage: false },
  'finish-work': { link: (id) => ['/requests', id, 'work'], text: 'Record the outcomes', isOnRequestPage: false },
  'issue-letter': { link: (id) => ['/requests', id, 'work'], text: 'Issue the completion letter', isOnRequestPage: false },
  'resume-work': { link: (id) => ['/requests', id, 'work'], text: 'Open visits and proof', isOnRequestPage: false },
  'accept-proof': { link: (id) => ['/requests', id, 'work'], text: 'Read the letter and record the re-inspection', isOnRequestPage: false },
  'reject-proof': { link: (id) => ['/requests', id, 'work'], text: 'Read the letter and record the re-inspection', isOnRequestPage: false },
};

export interface NextMove {
  label: string;
  /** Who makes it, in words ("the seller or the listing agent"). */
  by: string;
  /** Whether the person looking at the request is one of them. */
  isYours: boolean;
  /** Where to do it in the portal, when the portal has it and it is the viewer's move. */
  place: PortalPlace | null;
  /** The move exists in the flow but not yet in the portal. */
  isOutsidePortal: boolean;
  /** Off the usual course (the flow table's detours), shown after the usual step. */
  isDetour: boolean;
}

export interface NextStep {
  status: RequestStatus;
  isEnded: boolean;
  /** One sentence: what the request waits for and from whom. */
  summary: string;
  moves: NextMove[];
}

/**
 * What is left of an ended request, in one sentence (the request page and the work page say it):
 * where the flow table still lets money be recorded (an invoice paid at closing), that it may be open.
 */
export function endedSummary(status: RequestStatus): string {
  return statesAllowing('record-funds').includes(status)
    ? `${REQUEST_STATUS_LABELS[status]}: the work is done. If money is still open (an invoice paid at closing), the contractor records it on the approval page when it arrives.`
    : `${REQUEST_STATUS_LABELS[status]}: nothing more happens on this request.`;
}

/**
 * What a request in `status` waits for and who acts next, for one viewer: computed from the shared
 * flow table (its moves out of the state and who may make them), never from a list of our own.
 */
export function nextStepOf(status: RequestStatus, viewer: { role: Role; myParts: readonly PartyRole[] }): NextStep {
  if (isEnded(status)) return { status, isEnded: true, summary: endedSummary(status), moves: [] };
  const actors = actorsOf({ role: viewer.role, myParts: viewer.myParts, isAssignedContractor: viewer.role === 'contractor' });
  const onward = movesOnFrom(status);
  const moves = onward
    .map((move): NextMove => {
      const isYours = move.by.some((a) => actors.includes(a));
      const place = PORTAL_PLACES[move.event] ?? null;
      return { label: move.label, by: actorWords(move.by) || FLOW_ACTOR_LABELS.admin, isYours, place: isYours ? place : null, isOutsidePortal: place === null, isDetour: !!move.isDetour };
    })
    .sort((a, b) => Number(a.isDetour) - Number(b.isDetour));
  // The request waits for whoever makes the usual move (the shared next-step rule, which the dashboards
  // also name); detours (a change order) do not make it wait.
  const waitsFor = whoActsNext(status);
  const isYourTurn = waitsFor.some((a) => actors.includes(a));
  const summary = isYourTurn ? `Waits for you (${actorWords(waitsFor)}).` : `Waits for ${actorWords(waitsFor)}.`;
  return { status, isEnded: false, summary, moves };
}
