// The flow service against in-memory repositories: every move of the request table × every actor
// (allowed, 403 or 409 as the table says), the history row it writes, and the listeners.
// The permissions are those of the product's flow (docs/architecture.md, "States").
import { ITEM_FLOW, REQUEST_FLOW, type FlowActor, type ItemStatus, type RequestStatus } from '@cc/shared';
import type { Trx } from '../db/knex';
import { ConflictError, ForbiddenError } from '../errors';
import type { LineItemChanges, LineItemRepository, NewLineItem } from '../intake/line-item.repository';
import type { RequestRepository } from '../requests/request.repository';
import { FlowService, type FlowListener } from './flow.service';

const ACTORS: FlowActor[] = ['buyer-agent', 'listing-agent', 'seller', 'inspector', 'contractor', 'admin'];
const MESSAGES = { notYours: 'not yours', notNow: 'not now', stale: 'stale' };
const trx = {} as Trx;

interface Change {
  from: RequestStatus | null;
  to: RequestStatus;
  by: number | null;
  actor: string | null;
  note?: string | null;
}

/** One request and its items, kept in memory. */
function fakes(status: RequestStatus | null, items: { id: number; status: ItemStatus; version: number }[] = []) {
  const state = { status, history: [] as Change[], items: new Map(items.map((i) => [i.id, { ...i }])) };
  const requests = {
    async lockStatus() {
      return state.status;
    },
    async changeStatus(_id: number, change: Change) {
      if (change.from !== null && state.status !== change.from) return false;
      state.status = change.to;
      state.history.push(change);
      return true;
    },
  } as unknown as RequestRepository;
  const lineItems = {
    async update(id: number, version: number, changes: LineItemChanges) {
      const item = state.items.get(id);
      if (!item || item.version !== version) return false;
      Object.assign(item, { status: changes.status ?? item.status, version: version + 1 });
      return true;
    },
    async insert(rows: NewLineItem[]) {
      return rows.map((row) => {
        const id = state.items.size + 100;
        state.items.set(id, { id, status: row.status, version: 1 });
        return id;
      });
    },
  } as unknown as LineItemRepository;
  return { state, flow: new FlowService(requests, lineItems) };
}

describe('FlowService.moveRequest: every move of the table × every actor', () => {
  for (const move of REQUEST_FLOW.filter((m) => m.event !== 'open')) {
    for (const from of move.from) {
      for (const actor of ACTORS) {
        const allowed = move.by.includes(actor);
        it(`${move.event} from ${from} by ${actor}: ${allowed ? 'moves' : 'refused'}`, async () => {
          const { state, flow } = fakes(from);
          const attempt = flow.moveRequest(trx, 1, move.event, { userId: 7, actors: [actor] }, 'why', MESSAGES);
          if (allowed) {
            await expect(attempt).resolves.toMatchObject({ from, to: move.to, actor, byUserId: 7 });
            expect(state.status).toBe(move.to);
            // A move that keeps the state (another quote version) writes no status change.
            expect(state.history).toEqual(from === move.to ? [] : [{ from, to: move.to, by: 7, actor, note: 'why', at: undefined }]);
          } else {
            await expect(attempt).rejects.toBeInstanceOf(ForbiddenError);
            expect(state.status).toBe(from);
            expect(state.history).toEqual([]);
          }
        });
      }
    }
  }

  it('answers 409 (not 403) to a party who makes the move, from a state the move does not start from', async () => {
    const { state, flow } = fakes('pricing');
    await expect(flow.moveRequest(trx, 1, 'approve', { userId: 3, actors: ['seller'] }, null, MESSAGES)).rejects.toBeInstanceOf(ConflictError);
    expect(state.status).toBe('pricing');
  });

  it('credits the part the table names first among those the person plays', async () => {
    const { state, flow } = fakes('quoted');
    await flow.moveRequest(trx, 1, 'approve', { userId: 3, actors: ['listing-agent', 'seller'] }, null, MESSAGES);
    expect(state.history[0].actor).toBe('seller');
  });

  it('tells every listener of the move inside the transaction; a listener that fails makes the move fail (its transaction rolls back)', async () => {
    const { flow } = fakes('intake');
    const seen: string[] = [];
    const listener: FlowListener = {
      requestMoved: async (t, made) => {
        expect(t).toBe(trx);
        seen.push(`${made.from}→${made.to} by ${made.actor}`);
      },
    };
    flow.listen(listener);
    await flow.moveRequest(trx, 1, 'confirm-items', { userId: 1, actors: ['buyer-agent'] }, null, MESSAGES);
    expect(seen).toEqual(['intake→pricing by buyer-agent']);
    flow.listen({ requestMoved: async () => Promise.reject(new Error('outbox down')) });
    await expect(flow.moveRequest(trx, 1, 'send-quote', { userId: 2, actors: ['contractor'] }, null, MESSAGES)).rejects.toThrow('outbox down');
  });
});

describe('FlowService.moveItem', () => {
  for (const move of ITEM_FLOW) {
    for (const from of move.from.filter((f): f is ItemStatus => f !== null)) {
      it(`${move.event} from ${from} by ${move.by[0]} moves the item to ${move.to}`, async () => {
        const { state, flow } = fakes('pricing', [{ id: 5, status: from, version: 2 }]);
        await flow.moveItem(trx, { id: 5, requestId: 1, status: from, version: 2 }, move.event, { userId: 1, actors: [move.by[0]] }, MESSAGES);
        expect(state.items.get(5)).toEqual({ id: 5, status: move.to, version: 3 });
      });
    }
  }

  it('refuses a stale version with 409 and leaves the item as it was', async () => {
    const { state, flow } = fakes('pricing', [{ id: 5, status: 'open', version: 4 }]);
    const attempt = flow.moveItem(trx, { id: 5, requestId: 1, status: 'open', version: 3 }, 'price', { userId: 1, actors: ['contractor'] }, MESSAGES);
    await expect(attempt).rejects.toThrow('stale');
    expect(state.items.get(5)).toEqual({ id: 5, status: 'open', version: 4 });
  });

  it('refuses the seller pricing an item (403)', async () => {
    const { flow } = fakes('pricing', [{ id: 5, status: 'open', version: 1 }]);
    await expect(flow.moveItem(trx, { id: 5, requestId: 1, status: 'open', version: 1 }, 'price', { userId: 1, actors: ['seller'] }, MESSAGES)).rejects.toBeInstanceOf(ForbiddenError);
  });

  it('creates items read from a report in the state the table gives them', async () => {
    const { state, flow } = fakes('intake');
    const [id] = await flow.createItems(trx, 'propose', { userId: 1, actors: ['inspector'] }, [{ requestId: 1 } as Omit<NewLineItem, 'status'>], MESSAGES);
    expect(state.items.get(id)?.status).toBe('proposed');
  });
});
