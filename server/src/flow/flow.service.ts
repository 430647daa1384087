import {
  actionRefusal,
  actorsOnRequest,
  type CurrentUser,
  type PartyRole,
  itemMove,
  itemMoveRefusal,
  requestMove,
  requestMoveRefusal,
  type FlowActor,
  type FlowRefusal,
  type ItemEvent,
  type ItemMove,
  type ItemStatus,
  type RequestAction,
  type RequestEvent,
  type RequestMove,
  type RequestStatus,
} from '@cc/shared';
import type { Trx } from '../db/knex';
import { ConflictError, ForbiddenError } from '../errors';
import type { LineItemChanges, LineItemRepository, NewLineItem } from '../intake/line-item.repository';
import type { RequestRepository } from '../requests/request.repository';

/** What to say when the table refuses: to someone who never makes the move (403), and when it is not the time (409). */
export interface RefusalMessages {
  notYours: string;
  notNow: string;
}

/** A request moved: written in the transaction `trx` the listeners receive. */
export interface RequestMoveMade {
  requestId: number;
  move: RequestMove;
  from: RequestStatus | null;
  to: RequestStatus;
  /** The user who made it (null: the system), and the part they played. */
  byUserId: number | null;
  actor: FlowActor;
  note: string | null;
  /** When it was made: now, unless demo data backdates its history. */
  at?: Date;
}

export interface ItemMoveMade {
  requestId: number;
  itemId: number;
  move: ItemMove;
  from: ItemStatus | null;
  to: ItemStatus;
  byUserId: number | null;
  actor: FlowActor;
  at?: Date;
}

/**
 * Called inside the transaction of every move, after it is written; a listener that throws undoes
 * the move. (The notification outbox will be a listener.)
 */
export interface FlowListener {
  requestMoved?(trx: Trx, made: RequestMoveMade): Promise<void>;
  itemMoved?(trx: Trx, made: ItemMoveMade): Promise<void>;
}

/** Who makes a move: the user and the parts they play on the request. */
export interface Mover {
  userId: number;
  actors: readonly FlowActor[];
  /** When the move happened: now, unless demo data backdates its history. */
  at?: Date;
}

function refuse(refusal: FlowRefusal, messages: RefusalMessages): never {
  if (refusal === 'not-yours') throw new ForbiddenError(messages.notYours);
  throw new ConflictError(messages.notNow);
}

/** 403 when none of `actors` does `action`, 409 when they do but not in `status`. */
export function assertMayAct(actors: readonly FlowActor[], action: RequestAction, status: RequestStatus, messages: RefusalMessages): void {
  const refusal = actionRefusal(actors, action, status);
  if (refusal) refuse(refusal, messages);
}

/** 403 when none of `actors` ever makes `event`, 409 when they do but not from `from`. */
export function assertMayMoveRequest(actors: readonly FlowActor[], event: RequestEvent, from: RequestStatus | null, messages: RefusalMessages): void {
  const refusal = requestMoveRefusal(actors, event, from);
  if (refusal) refuse(refusal, messages);
}

/** The actor among `actors` the table names first for a move (the one the history credits). */
function actingAs(actors: readonly FlowActor[], by: readonly FlowActor[]): FlowActor {
  return by.find((a) => actors.includes(a))!;
}

/**
 * The one way a request or a line item changes state: the flow table (shared/src/requests/
 * request-flow.ts) decides whether the mover may, the move is written with who made it and why in the
 * caller's transaction, and every listener sees it in that same transaction.
 */
export class FlowService {
  private readonly listeners: FlowListener[] = [];

  constructor(
    private readonly requests: RequestRepository,
    private readonly items: LineItemRepository,
  ) {}

  listen(listener: FlowListener): void {
    this.listeners.push(listener);
  }

  /** Opens a request: `create` inserts it in the state the table opens it in and returns its id. */
  async openRequest(trx: Trx, mover: Mover, note: string, messages: RefusalMessages, create: (status: RequestStatus) => Promise<number>): Promise<number> {
    const refusal = requestMoveRefusal(mover.actors, 'open', null);
    if (refusal) refuse(refusal, messages);
    const move = requestMove('open', null)!;
    const requestId = await create(move.to);
    await this.record(trx, { requestId, move, from: null, to: move.to, byUserId: mover.userId, actor: actingAs(mover.actors, move.by), note, at: mover.at });
    return requestId;
  }

  /**
   * Moves the request by `event` from the state it is in now (read under a row lock). A move that
   * keeps the state (a new quote version) writes no status change but is still announced.
   */
  async moveRequest(trx: Trx, requestId: number, event: RequestEvent, mover: Mover, note: string | null, messages: RefusalMessages): Promise<RequestMoveMade> {
    const from = await this.requests.lockStatus(requestId, trx);
    if (from === null) throw new ConflictError(messages.notNow);
    const refusal = requestMoveRefusal(mover.actors, event, from);
    if (refusal) refuse(refusal, messages);
    const move = requestMove(event, from)!;
    const made: RequestMoveMade = { requestId, move, from, to: move.to, byUserId: mover.userId, actor: actingAs(mover.actors, move.by), note, at: mover.at };
    await this.record(trx, made);
    return made;
  }

  private async record(trx: Trx, made: RequestMoveMade): Promise<void> {
    if (made.from !== made.to) {
      const moved = await this.requests.changeStatus(made.requestId, { from: made.from, to: made.to, by: made.byUserId, actor: made.actor, note: made.note, at: made.at }, trx);
      if (!moved) throw new ConflictError('The request changed meanwhile. Reload and try again.');
    }
    for (const listener of this.listeners) await listener.requestMoved?.(trx, made);
  }

  /** Creates items by `event` (read from a report, added by change order) in the state the table gives them. */
  async createItems(trx: Trx, event: ItemEvent, mover: Mover, items: Omit<NewLineItem, 'status'>[], messages: RefusalMessages): Promise<number[]> {
    const refusal = itemMoveRefusal(mover.actors, event, null);
    if (refusal) refuse(refusal, messages);
    const move = itemMove(event, null)!;
    const ids = await this.items.insert(items.map((i) => ({ ...i, status: move.to })), trx);
    const actor = actingAs(mover.actors, move.by);
    for (const [index, itemId] of ids.entries()) {
      for (const listener of this.listeners) await listener.itemMoved?.(trx, { requestId: items[index].requestId, itemId, move, from: null, to: move.to, byUserId: mover.userId, actor, at: mover.at });
    }
    return ids;
  }

  /**
   * Moves one item by `event`, together with `changes`, only if it is still at `item.version`
   * (409 `stale` otherwise).
   */
  async moveItem(
    trx: Trx,
    item: { id: number; requestId: number; status: ItemStatus; version: number },
    event: ItemEvent,
    mover: Mover,
    messages: RefusalMessages & { stale: string },
    changes: Omit<LineItemChanges, 'status'> = {},
  ): Promise<ItemMoveMade> {
    const refusal = itemMoveRefusal(mover.actors, event, item.status);
    if (refusal) refuse(refusal, messages);
    const move = itemMove(event, item.status)!;
    if (!(await this.items.update(item.id, item.version, { ...changes, status: move.to }, trx))) throw new ConflictError(messages.stale);
    const made: ItemMoveMade = { requestId: item.requestId, itemId: item.id, move, from: item.status, to: move.to, byUserId: mover.userId, actor: actingAs(mover.actors, move.by), at: mover.at };
    for (const listener of this.listeners) await listener.itemMoved?.(trx, made);
    return made;
  }
}

/** `user` as a mover on `request` (its detail as they see it): the parts they play there. */
export function moverOn(user: CurrentUser, request: { myParts: readonly PartyRole[]; contractor: { id: number } | null }): Mover {
  return { userId: user.id, actors: actorsOnRequest(user, request) };
}
