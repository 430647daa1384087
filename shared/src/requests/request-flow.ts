// The flow of a repair request and of its line items, in one table each: every move as
// (event, from, to, who may make it). The server moves a request or an item only through these
// tables; the portal asks them which actions to show and who acts next; the seeds build their demo
// history from them. Nothing else lists states or who may move them.
import type { Role } from '../auth/role';
import type { PartyRole } from './repair-request.schema';
import type { ItemStatus } from '../items/item-status';
import { FINAL_STATUSES, REQUEST_STATUSES, type RequestStatus } from './request-status';
import { eitherWords } from '../text/list-words';

/**
 * Who acts on a request: the parts a person plays on it (named parties), the assigned contractor's
 * organisation, or an administrator.
 */
export type FlowActor = PartyRole | 'contractor' | 'admin';

/** The account role a person needs to take each part on a request. */
export const ROLE_FOR_PARTY: Readonly<Record<PartyRole, Role>> = {
  'buyer-agent': 'agent',
  'listing-agent': 'agent',
  seller: 'seller',
  inspector: 'inspector',
};

/** The parts an account of `role` can play on some request (a contractor's people act as `contractor`). */
export function actorsForRole(role: Role): FlowActor[] {
  if (role === 'contractor' || role === 'admin') return [role];
  return (Object.keys(ROLE_FOR_PARTY) as PartyRole[]).filter((part) => ROLE_FOR_PARTY[part] === role);
}

export const FLOW_ACTOR_LABELS: Record<FlowActor, string> = {
  'buyer-agent': 'the buyer’s agent',
  'listing-agent': 'the listing agent',
  seller: 'the seller',
  inspector: 'the inspector',
  contractor: 'the contractor',
  admin: 'an administrator',
};

const AGENTS: readonly FlowActor[] = ['buyer-agent', 'listing-agent'];
const SELLER_SIDE: readonly FlowActor[] = ['seller', 'listing-agent'];
const PROOF_READERS: readonly FlowActor[] = ['inspector', 'buyer-agent'];

export interface FlowMove<S extends string, E extends string> {
  readonly event: E;
  /** States the move starts from (`null` only for the move that creates the record). */
  readonly from: readonly (S | null)[];
  /** The state after the move; equal to a `from` for moves that keep the state (a new quote version). */
  readonly to: S;
  /** Who may make the move. The first is who makes it in the usual course (demo history names them). */
  readonly by: readonly FlowActor[];
  /** What the move is called on a button or in the history, in the product's words. */
  readonly label: string;
  /** Whether the move is off the usual course (demo histories avoid it unless nothing else leads there). */
  readonly isDetour?: boolean;
}

// ---------------------------------------------------------------------------------------------
// The request

export const REQUEST_EVENTS = [
  'open',
  'add-report',
  'confirm-items',
  'send-quote',
  'approve',
  'decline',
  'schedule',
  'start-work',
  'unschedule',
  'approve-change-order',
  'finish-work',
  'issue-letter',
  'accept-proof',
  'reject-proof',
  'resume-work',
  'withdraw',
] as const;
export type RequestEvent = (typeof REQUEST_EVENTS)[number];
export type RequestMove = FlowMove<RequestStatus, RequestEvent> & {
  /** The move each item the request carries makes with it in the usual course (e.g. confirming the items). */
  readonly itemEvent?: ItemEvent;
};

/** Who books site visits and when; a booked visit is cancelled by the same people in the same states. */
const VISIT_BOOKING = { in: ['approved', 'scheduled', 'in-progress', 'reopened'], by: ['contractor'] } as const satisfies { in: readonly RequestStatus[]; by: readonly FlowActor[] };

const BEFORE_LETTER: readonly RequestStatus[] = ['draft', 'intake', 'pricing', 'quoted', 'approved', 'scheduled', 'in-progress', 'corrected', 'reopened'];
/** States in which the seller's scope is signed and money may move. */
const AFTER_APPROVAL: readonly RequestStatus[] = ['approved', 'scheduled', 'in-progress', 'corrected', 'letter-issued', 'accepted', 'reopened'];

export const REQUEST_FLOW: readonly RequestMove[] = [
  { event: 'open', from: [null], to: 'draft', by: [...AGENTS, 'admin'], label: 'Open the request' },
  { event: 'add-report', from: ['draft'], to: 'intake', by: [...AGENTS, 'inspector', 'admin'], label: 'Add the inspection report' },
  { event: 'confirm-items', from: ['intake'], to: 'pricing', by: [...AGENTS, 'admin'], label: 'Confirm the items', itemEvent: 'confirm' },
  { event: 'send-quote', from: ['pricing', 'quoted'], to: 'quoted', by: ['contractor'], label: 'Send the quote', itemEvent: 'price' },
  { event: 'approve', from: ['quoted'], to: 'approved', by: SELLER_SIDE, label: 'Approve and sign', itemEvent: 'approve' },
  { event: 'decline', from: ['quoted'], to: 'declined', by: SELLER_SIDE, label: 'Decline every item', itemEvent: 'decline' },
  { event: 'schedule', from: ['approved'], to: 'scheduled', by: ['contractor'], label: 'Book a visit' },
  { event: 'start-work', from: ['scheduled'], to: 'in-progress', by: ['contractor'], label: 'Start the visit' },
  // The request's last booked visit is cancelled before any work started: its items wait for a visit again.
  { event: 'unschedule', from: ['scheduled'], to: 'approved', by: ['contractor'], label: 'Cancel the last booked visit', isDetour: true },
  // An approved change order brings new work: a request whose work was finished is under way again.
  { event: 'approve-change-order', from: ['corrected'], to: 'in-progress', by: SELLER_SIDE, label: 'Approve the change order', isDetour: true },
  { event: 'finish-work', from: ['in-progress'], to: 'corrected', by: ['contractor'], label: 'Record the last outcome', itemEvent: 'correct' },
  { event: 'issue-letter', from: ['corrected'], to: 'letter-issued', by: ['contractor'], label: 'Issue the completion letter' },
  { event: 'accept-proof', from: ['letter-issued'], to: 'accepted', by: PROOF_READERS, label: 'Accept the corrections', itemEvent: 'accept' },
  { event: 'reject-proof', from: ['letter-issued'], to: 'reopened', by: PROOF_READERS, label: 'List items not accepted' },
  { event: 'resume-work', from: ['reopened'], to: 'in-progress', by: ['contractor'], label: 'Take the items back in hand' },
  { event: 'withdraw', from: BEFORE_LETTER, to: 'withdrawn', by: [...AGENTS, 'admin'], label: 'Withdraw (the sale fell through)', isDetour: true },
];

/**
 * Things a party does on a request that do not move it, and the states in which they may.
 * (Moves are in REQUEST_FLOW; these are the permissions the screens and routes also ask about.)
 */
export const REQUEST_ACTIONS = {
  'invite-party': { in: BEFORE_LETTER, by: [...AGENTS, 'admin'] },
  'change-contractor': { in: ['draft', 'intake', 'pricing'], by: [...AGENTS, 'admin'] },
  'upload-report': { in: ['draft', 'intake'], by: [...AGENTS, 'inspector', 'admin'] },
  'review-items': { in: ['draft', 'intake'], by: [...AGENTS, 'admin'] },
  price: { in: ['pricing', 'quoted'], by: ['contractor'] },
  'send-change-order': { in: ['approved', 'scheduled', 'in-progress', 'corrected', 'reopened'], by: ['contractor'] },
  'decide-change-order': { in: ['approved', 'scheduled', 'in-progress', 'corrected', 'reopened'], by: SELLER_SIDE },
  pay: { in: AFTER_APPROVAL, by: SELLER_SIDE },
  'record-funds': { in: AFTER_APPROVAL, by: ['contractor'] },
  // Money goes back (an approved item taken out by a change order, an overpayment) and invoices are issued by the contractor.
  refund: { in: AFTER_APPROVAL, by: ['contractor'] },
  'issue-invoice': { in: AFTER_APPROVAL, by: ['contractor'] },
  // The invoice payable at closing went to a wrong or old address: whoever chose it, or the contractor, sends it again.
  'send-closing-invoice': { in: AFTER_APPROVAL, by: [...SELLER_SIDE, 'contractor'] },
  'book-visit': VISIT_BOOKING,
  // Calling off a booked visit (the seller cancelled a showing, the occupant is ill, a part is late) is the booking right.
  'cancel-visit': VISIT_BOOKING,
  'record-correction': { in: ['scheduled', 'in-progress', 'reopened'], by: ['contractor'] },
  // A started visit is finished when the electrician leaves, also after its last item's outcome moved the request on.
  'finish-visit': { in: ['scheduled', 'in-progress', 'corrected', 'letter-issued', 'accepted', 'reopened'], by: ['contractor'] },
  // Lockbox codes and occupant contacts: only the assigned contractor and the listing agent (who gave them).
  'see-access-notes': { in: BEFORE_LETTER, by: ['listing-agent', 'contractor'] },
  // Photos for the electrician (a box behind tile, a panel cover): from the seller's side and the
  // agents, as long as a visit may still come (not once the work is done or the request ended).
  'add-intake-photo': { in: ['draft', 'intake', 'pricing', 'quoted', 'approved', 'scheduled', 'in-progress', 'reopened'], by: [...AGENTS, 'seller'] },
  /** The contractor's pricing page (read only unless `price` is allowed too). */
  'read-pricing': { in: REQUEST_STATUSES, by: ['contractor', 'admin'] },
  /** The ballpark range from the assigned contractor's rate book, and the site conditions flagged for it. */
  'read-ballpark': { in: REQUEST_STATUSES, by: [...AGENTS, 'seller', 'contractor', 'admin'] },
  'flag-site-conditions': { in: REQUEST_STATUSES, by: [...AGENTS, 'contractor', 'admin'] },
  /** When the request page offers the ballpark range: once there are items, until the first quote. */
  estimate: { in: ['intake', 'pricing'], by: [...AGENTS, 'contractor', 'admin'] },
} as const satisfies Record<string, { in: readonly RequestStatus[]; by: readonly FlowActor[] }>;
export type RequestAction = keyof typeof REQUEST_ACTIONS;

// ---------------------------------------------------------------------------------------------
// A line item

export const ITEM_EVENTS = [
  'propose',
  'add',
  'confirm',
  'remove',
  'price',
  'clear-price',
  'leave-out',
  'take-back-in',
  'approve',
  'decline',
  'add-by-change-order',
  'correct',
  'not-correct',
  'accept',
  'not-accept',
  'rework',
] as const;
export type ItemEvent = (typeof ITEM_EVENTS)[number];
export type ItemMove = FlowMove<ItemStatus, ItemEvent>;

export const ITEM_FLOW: readonly ItemMove[] = [
  { event: 'propose', from: [null], to: 'proposed', by: [...AGENTS, 'inspector', 'admin'], label: 'Read from the report' },
  { event: 'add', from: [null], to: 'open', by: [...AGENTS, 'admin'], label: 'Add an item by hand', isDetour: true },
  { event: 'confirm', from: ['proposed'], to: 'open', by: [...AGENTS, 'admin'], label: 'Confirm' },
  { event: 'remove', from: ['proposed', 'open'], to: 'removed', by: [...AGENTS, 'admin'], label: 'Remove' },
  { event: 'price', from: ['open', 'priced'], to: 'priced', by: ['contractor'], label: 'Price' },
  { event: 'clear-price', from: ['priced'], to: 'open', by: ['contractor'], label: 'Clear the price', isDetour: true },
  { event: 'leave-out', from: ['open', 'priced'], to: 'out-of-scope', by: ['contractor'], label: 'Leave out (not our scope)' },
  { event: 'take-back-in', from: ['out-of-scope'], to: 'open', by: ['contractor'], label: 'Take back into the quote', isDetour: true },
  { event: 'approve', from: ['priced'], to: 'approved', by: SELLER_SIDE, label: 'Approve' },
  { event: 'decline', from: ['priced', 'approved'], to: 'declined', by: SELLER_SIDE, label: 'Decline' },
  { event: 'add-by-change-order', from: [null], to: 'priced', by: ['contractor'], label: 'Add by change order', isDetour: true },
  { event: 'correct', from: ['approved'], to: 'done', by: ['contractor'], label: 'Record as corrected' },
  { event: 'not-correct', from: ['approved'], to: 'not-done', by: ['contractor'], label: 'Record as not corrected' },
  { event: 'accept', from: ['done'], to: 'accepted', by: PROOF_READERS, label: 'Accept the correction' },
  { event: 'not-accept', from: ['done'], to: 'not-accepted', by: PROOF_READERS, label: 'Do not accept' },
  // The seller approved and paid for this scope once: an item whose correction was not accepted goes
  // back to the contractor as approved work, not back to pricing.
  { event: 'rework', from: ['not-accepted'], to: 'approved', by: ['contractor'], label: 'Take back for rework', isDetour: true },
];

// ---------------------------------------------------------------------------------------------
// Who a person is on one request

export interface ActorFacts {
  readonly role: Role;
  /** The parts the person plays on the request (named parties). */
  readonly myParts: readonly PartyRole[];
  /** Whether the person belongs to the contractor organisation assigned to the request. */
  readonly isAssignedContractor: boolean;
}

/** The actors a person is on one request (several when one person plays several parts). */
export function actorsOf(facts: ActorFacts): FlowActor[] {
  const actors: FlowActor[] = [...facts.myParts];
  if (facts.role === 'contractor' && facts.isAssignedContractor) actors.push('contractor');
  if (facts.role === 'admin') actors.push('admin');
  return actors;
}

/** The actors a signed-in person is on a request as the API shows it (its detail: parts and contractor). */
export function actorsOnRequest(
  user: { readonly role: Role; readonly organisationId: number | null },
  request: { readonly myParts: readonly PartyRole[]; readonly contractor: { readonly id: number } | null },
): FlowActor[] {
  return actorsOf({ role: user.role, myParts: request.myParts, isAssignedContractor: request.contractor !== null && request.contractor.id === user.organisationId });
}

// ---------------------------------------------------------------------------------------------
// Questions asked of the tables

function findMove<S extends string, E extends string>(flow: readonly FlowMove<S, E>[], event: E, from: S | null): FlowMove<S, E> | undefined {
  return flow.find((m) => m.event === event && m.from.includes(from));
}

/** The move `event` makes from `from`, or undefined when the flow has no such move. */
export function requestMove(event: RequestEvent, from: RequestStatus | null): RequestMove | undefined {
  return findMove(REQUEST_FLOW, event, from);
}

export function itemMove(event: ItemEvent, from: ItemStatus | null): ItemMove | undefined {
  return findMove(ITEM_FLOW, event, from);
}

const shares = (a: readonly FlowActor[], b: readonly FlowActor[]) => a.some((x) => b.includes(x));

/** Whether any of `actors` may make `event` on a request in state `from`. */
export function mayMoveRequest(actors: readonly FlowActor[], event: RequestEvent, from: RequestStatus | null): boolean {
  const move = requestMove(event, from);
  return !!move && shares(actors, move.by);
}

/** Whether any of `actors` may make `event` on an item in state `from`. */
export function mayMoveItem(actors: readonly FlowActor[], event: ItemEvent, from: ItemStatus | null): boolean {
  const move = itemMove(event, from);
  return !!move && shares(actors, move.by);
}

/** Whether any of `actors` may do `action` on a request in state `status`. */
export function mayAct(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus): boolean {
  const rule = REQUEST_ACTIONS[action];
  return (rule.in as readonly RequestStatus[]).includes(status) && shares(actors, rule.by);
}

/** The states in which `action` is allowed (for the screens that show a feature only then). */
export function statesAllowing(action: RequestAction): readonly RequestStatus[] {
  return REQUEST_ACTIONS[action].in;
}

/** The moves that carry a request on from `status` (withdrawal left out: it ends the request). */
export function movesOnFrom(status: RequestStatus): RequestMove[] {
  return REQUEST_FLOW.filter((m) => m.from.includes(status) && m.event !== 'withdraw' && m.to !== status);
}

/**
 * The moves on from `status` that apply now: the usual ones, and a detour (approving a change order…)
 * only when the caller knows it applies, e.g. a change order is waiting for the seller.
 */
export function movesThatApply(status: RequestStatus, detoursThatApply: readonly RequestEvent[] = []): RequestMove[] {
  return movesOnFrom(status).filter((m) => !m.isDetour || detoursThatApply.includes(m.event));
}

/**
 * Who a request in `status` waits for, in the order the table names them (empty when final): the
 * parties of its usual moves on. A detour (approving a change order) makes it wait only when the
 * caller knows it applies (a change order is with the seller), or when the state has no usual move.
 * This is the one next-step rule: the request page, the work page, the dashboards and the approval
 * page all name these people, never a list or an order of their own.
 */
export function whoActsNext(status: RequestStatus, detoursThatApply: readonly RequestEvent[] = []): FlowActor[] {
  const onward = movesOnFrom(status);
  const usual = onward.some((m) => !m.isDetour) ? movesThatApply(status, detoursThatApply) : onward;
  const actors: FlowActor[] = [];
  for (const move of usual) for (const a of move.by) if (a !== 'admin' && !actors.includes(a)) actors.push(a);
  return actors;
}

/** Actors in words, as a choice: "the seller or the listing agent" (administrators left out). */
export function actorWords(actors: readonly FlowActor[]): string {
  return eitherWords(actors.filter((a) => a !== 'admin').map((a) => FLOW_ACTOR_LABELS[a]));
}

/**
 * The next steps of a request in `status` as lines of "what: who": moves open to the same people are
 * one choice ("Accept the corrections or list items not accepted: the inspector or the buyer's agent"),
 * and the last outcome is called so only when one item is left (`progress`: items with an outcome of
 * the approved ones).
 */
export function nextStepLines(status: RequestStatus, progress?: { resolved: number; approved: number }): string[] {
  const groups: { by: readonly FlowActor[]; labels: string[] }[] = [];
  for (const move of movesThatApply(status)) {
    const left = progress ? progress.approved - progress.resolved : 1;
    const label = move.event === 'finish-work' && progress && left > 1 ? `Record the outcome of each item left (${progress.resolved} of ${progress.approved} done)` : move.label;
    const same = groups.find((g) => g.by.length === move.by.length && g.by.every((a) => move.by.includes(a)));
    if (same) same.labels.push(label.charAt(0).toLowerCase() + label.slice(1));
    else groups.push({ by: move.by, labels: [label] });
  }
  return groups.map((g) => `${g.labels.join(' or ')}: ${actorWords(g.by)}`);
}

/** Who a request in `status` waits for, in words ("the seller or the listing agent"; '' when final). */
export function whoActsNextWords(status: RequestStatus, detoursThatApply: readonly RequestEvent[] = []): string {
  return actorWords(whoActsNext(status, detoursThatApply));
}

/** The moves `actors` may make on a request in `status` right now. */
export function movesFor(actors: readonly FlowActor[], status: RequestStatus): RequestMove[] {
  return REQUEST_FLOW.filter((m) => m.from.includes(status) && shares(actors, m.by));
}

/** Whether nothing more happens on a request in `status`. */
export function isEnded(status: RequestStatus): boolean {
  return FINAL_STATUSES.includes(status);
}

/**
 * The usual path of moves from nothing to `target` (shortest by number of moves, preferring the
 * table's order), each with the actor who would make it. Seeds build demo histories from it.
 */
export function pathTo<S extends string, E extends string>(flow: readonly FlowMove<S, E>[], target: S): FlowMove<S, E>[] {
  return shortestPath(flow.filter((m) => !m.isDetour), target) ?? shortestPath(flow, target) ?? fail(target);
}

function fail(target: string): never {
  throw new Error(`No path in the flow reaches ${target}`);
}

function shortestPath<S extends string, E extends string>(flow: readonly FlowMove<S, E>[], target: S): FlowMove<S, E>[] | null {
  type Node = { state: S | null; path: FlowMove<S, E>[] };
  const seen = new Set<S | null>([null]);
  const queue: Node[] = [{ state: null, path: [] }];
  while (queue.length) {
    const { state, path } = queue.shift()!;
    if (state === target) return path;
    for (const move of flow) {
      if (!move.from.includes(state) || seen.has(move.to)) continue;
      seen.add(move.to);
      queue.push({ state: move.to, path: [...path, move] });
    }
  }
  return null;
}

export function requestPathTo(target: RequestStatus): RequestMove[] {
  return pathTo(REQUEST_FLOW, target);
}

export function itemPathTo(target: ItemStatus): ItemMove[] {
  return pathTo(ITEM_FLOW, target);
}

// ---------------------------------------------------------------------------------------------
// Why a move or an action is refused (the server answers 403 for the one, 409 for the other)

/**
 * `not-yours`: none of `actors` ever makes this move or does this action (403);
 * `not-now`: they do, but not from the state the record is in (409); null: allowed.
 */
export type FlowRefusal = 'not-yours' | 'not-now';

function refusal<S extends string, E extends string>(flow: readonly FlowMove<S, E>[], actors: readonly FlowActor[], event: E, from: S | null): FlowRefusal | null {
  const moves = flow.filter((m) => m.event === event && shares(actors, m.by));
  if (moves.length === 0) return 'not-yours';
  return moves.some((m) => m.from.includes(from)) ? null : 'not-now';
}

export function requestMoveRefusal(actors: readonly FlowActor[], event: RequestEvent, from: RequestStatus | null): FlowRefusal | null {
  return refusal(REQUEST_FLOW, actors, event, from);
}

export function itemMoveRefusal(actors: readonly FlowActor[], event: ItemEvent, from: ItemStatus | null): FlowRefusal | null {
  return refusal(ITEM_FLOW, actors, event, from);
}

export function actionRefusal(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus): FlowRefusal | null {
  const rule = REQUEST_ACTIONS[action];
  if (!shares(actors, rule.by)) return 'not-yours';
  return (rule.in as readonly RequestStatus[]).includes(status) ? null : 'not-now';
}

/** The item states from which any of `events` starts (e.g. the items a contractor works on while pricing). */
export function itemStatesFrom(events: readonly ItemEvent[]): ItemStatus[] {
  const states: ItemStatus[] = [];
  for (const move of ITEM_FLOW) {
    if (!events.includes(move.event)) continue;
    for (const from of move.from) if (from !== null && !states.includes(from)) states.push(from);
  }
  return states;
}

/** The state an item event leads to (for events that lead to one state whatever the start). */
export function itemStateAfter(event: ItemEvent): ItemStatus {
  return ITEM_FLOW.find((m) => m.event === event)!.to;
}
