import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { itemMove, requestMove, type FlowActor, type FlowMove } from '@cc/shared';
import { FlowService, type Mover } from '../server/src/flow/flow.service';
import { LineItemRepository } from '../server/src/intake/line-item.repository';
import { RequestRepository } from '../server/src/requests/request.repository';
import { ORGANISATIONS, PEOPLE, REQUESTS, type DemoRequest } from './data/demo-scenario';
import { historyWriters, markHistoryDelivered } from './data/history';

const DAY = 86_400_000;
const REFUSED = { notYours: 'The demo scenario names someone the flow does not let make this move', notNow: 'The demo path leaves the flow', stale: 'Item changed meanwhile' };

function isoDateIn(days: number): string {
  const d = new Date();
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** What the server writes beside a move, for the moves that carry a note. */
function noteFor(event: string, itemCount: number): string | null {
  if (event === 'open') return 'Request opened';
  // The demo keeps no report file: its items were typed in from the inspector's report, and the
  // completion letter says no file was uploaded. The history says the same.
  if (event === 'add-report') return 'Items entered from the inspection report (no file uploaded)';
  if (event === 'confirm-items') return `${itemCount} ${itemCount === 1 ? 'item' : 'items'} confirmed`;
  if (event === 'send-quote') return 'Quote version 1 sent';
  return null;
}

interface Seeding {
  users: Map<string, { id: number; email: string }>;
  orgs: Map<string, number>;
  /** The first contractor user of each contractor organisation (who sends its quotes and books its visits). */
  contractorUser: Map<number, number>;
  adminId: number;
  flow: FlowService;
  requests: RequestRepository;
  items: LineItemRepository;
}

// Resets the requests and creates the dozen demo requests with their parties, history and items.
// Every request and item moves through the flow service, made by the party who would make the move
// (the first the flow table names who is on the request), so the history credits the right person,
// and the Activity panel shows each move at the day it was made.
export async function seed(knex: Knex): Promise<void> {
  await knex.raw('TRUNCATE request_status_changes, request_parties, line_items, repair_requests RESTART IDENTITY CASCADE');
  const users = new Map<string, { id: number; email: string }>();
  for (const p of PEOPLE) users.set(p.key, await knex('users').where({ email: p.email }).first('id', 'email'));
  const orgs = new Map<string, number>();
  for (const o of ORGANISATIONS) orgs.set(o.key, (await knex('organisations').where({ name: o.name }).first('id')).id);
  const contractorUser = new Map<number, number>();
  for (const row of await knex('users').where({ role: 'contractor' }).orderBy('id').select('id', 'organisation_id')) {
    if (!contractorUser.has(row.organisation_id)) contractorUser.set(row.organisation_id, row.id);
  }
  const requests = new RequestRepository(knex);
  const items = new LineItemRepository(knex);
  // The moves write their timeline entries and messages through the server's own listener.
  const flow = historyWriters(knex).listenOn(new FlowService(requests, items));
  const seeding: Seeding = { users, orgs, contractorUser, adminId: users.get('admin')!.id, flow, requests, items };
  for (const [index, r] of REQUESTS.entries()) {
    await knex.transaction((trx) => seedRequest(trx, r, index, seeding));
  }
  await markHistoryDelivered(knex);
}

async function seedRequest(trx: Knex.Transaction, r: DemoRequest, index: number, s: Seeding): Promise<void> {
  const person = (key: string | null) => (key ? s.users.get(key)!.id : null);
  const contractorOrg = r.contractor ? s.orgs.get(r.contractor)! : null;
  // Who plays each part on this request.
  const playedBy: Record<FlowActor, number | null> = {
    'buyer-agent': person(r.buyerAgent),
    'listing-agent': person(r.listingAgent),
    seller: person(r.seller),
    inspector: person(r.inspector),
    contractor: contractorOrg === null ? null : (s.contractorUser.get(contractorOrg) ?? null),
    admin: s.adminId,
  };
  // Requests were opened some days before closing; each later move came a day after the one before.
  const openedAt = new Date(Date.now() - (r.path.length + 2 + index) * DAY);
  const moverFor = (move: FlowMove<string, string>, step: number): Mover => {
    const actor = move.by.find((a) => playedBy[a] !== null);
    if (!actor) throw new Error(`${r.street}: nobody on the request may ${move.event}`);
    return { userId: playedBy[actor]!, actors: [actor], at: new Date(openedAt.getTime() + step * DAY) };
  };

  const [first, ...rest] = r.path;
  if (first !== 'open') throw new Error(`${r.street}: a demo path starts by opening the request`);
  const requestId = await s.flow.openRequest(trx, moverFor(requestMove('open', null)!, 0), noteFor('open', 0)!, REFUSED, (status) =>
    s.requests.create(
      {
        street: r.street,
        city: r.city,
        state: 'CO',
        zip: r.zip,
        yearBuilt: r.yearBuilt,
        closingDate: isoDateIn(r.closingInDays),
        necEdition: r.necEdition,
        status,
        contractorOrganisationId: contractorOrg,
        createdBy: playedBy['buyer-agent']!,
        createdAt: openedAt,
      },
      trx,
    ),
  );

  const parties = [
    ['buyer-agent', r.buyerAgent],
    ['listing-agent', r.listingAgent],
    ['seller', r.seller],
    ['inspector', r.inspector],
  ] as const;
  for (const [role, key] of parties) {
    if (!key) continue;
    const user = s.users.get(key)!;
    await s.requests.addParty({ requestId, role, email: user.email, userId: user.id, inviteToken: null, inviteExpiresAt: null, invitedBy: playedBy['buyer-agent'] }, trx);
  }
  if (r.invitedSellerEmail) {
    await s.requests.addParty(
      {
        requestId,
        role: 'seller',
        email: r.invitedSellerEmail,
        userId: null,
        inviteToken: randomBytes(24).toString('base64url'),
        inviteExpiresAt: new Date(Date.now() + 14 * DAY),
        invitedBy: playedBy['buyer-agent'],
      },
      trx,
    );
  }

  for (const [i, event] of rest.entries()) {
    const step = i + 1;
    const from = await s.requests.lockStatus(requestId, trx);
    const move = requestMove(event, from);
    if (!move) throw new Error(`${r.street}: the flow has no move ${event} from ${from}`);
    const mover = moverFor(move, step);
    await s.flow.moveRequest(trx, requestId, event, mover, noteFor(event, r.items.length), REFUSED);
    // The report brings the items (read from it); later moves carry each item along (confirmed, priced, approved…).
    if (event === 'add-report' && r.items.length) {
      await s.flow.createItems(
        trx,
        'propose',
        mover,
        r.items.map((item) => ({
          requestId,
          code: item.code,
          room: item.room,
          location: item.location,
          quantity: item.quantity,
          evidence: null,
          page: null,
          severity: item.severity,
          necRefs: item.necRefs,
          isEdited: false,
          reportFileId: null,
          evidenceStart: null,
          evidenceEnd: null,
        })),
        REFUSED,
      );
    }
    const itemEvent = move.itemEvent;
    if (!itemEvent) continue;
    for (const item of await s.items.listForRequest(requestId, trx)) {
      const itemStep = itemMove(itemEvent, item.status);
      if (itemStep) await s.flow.moveItem(trx, item, itemEvent, moverFor(itemStep, step), REFUSED);
    }
  }
}
