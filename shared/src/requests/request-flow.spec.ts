import { ITEM_STATUSES } from '../items/item-status';
import {
  nextStepLines,
  actorsForRole,
  actorsOf,
  movesThatApply,
  ITEM_FLOW,
  itemPathTo,
  mayAct,
  mayMoveItem,
  mayMoveRequest,
  movesOnFrom,
  REQUEST_ACTIONS,
  REQUEST_FLOW,
  requestMove,
  requestPathTo,
  whoActsNext,
  whoActsNextWords,
  actorWords,
  type FlowActor,
} from './request-flow';
import { FINAL_STATUSES, REQUEST_STATUSES } from './request-status';

const ACTORS: FlowActor[] = ['buyer-agent', 'listing-agent', 'seller', 'inspector', 'contractor', 'admin'];

describe('request flow', () => {
  describe('every move × every actor', () => {
    for (const move of REQUEST_FLOW) {
      for (const from of move.from) {
        for (const actor of ACTORS) {
          const allowed = move.by.includes(actor);
          it(`${move.event} from ${from ?? 'nothing'} by ${actor}: ${allowed ? 'allowed' : 'refused'}`, () => {
            expect(mayMoveRequest([actor], move.event, from)).toBe(allowed);
          });
        }
      }
    }
  });

  it('refuses a move from a state the table does not start it from', () => {
    expect(requestMove('approve', 'pricing')).toBeUndefined();
    expect(mayMoveRequest(['seller'], 'approve', 'pricing')).toBe(false);
    expect(mayMoveRequest(['contractor'], 'issue-letter', 'in-progress')).toBe(false);
  });

  it('leaves no state a request can reach without a way on, except the final ones', () => {
    for (const status of REQUEST_STATUSES) {
      if (FINAL_STATUSES.includes(status)) expect(movesOnFrom(status)).toEqual([]);
      else expect(movesOnFrom(status).length).toBeGreaterThan(0);
    }
  });

  it('reaches every state from nothing', () => {
    for (const status of REQUEST_STATUSES) expect(requestPathTo(status).at(-1)?.to).toBe(status);
  });

  it('follows the usual course to the accepted proof', () => {
    expect(requestPathTo('accepted').map((m) => m.event)).toEqual([
      'open', 'add-report', 'confirm-items', 'send-quote', 'approve', 'schedule', 'start-work', 'finish-work', 'issue-letter', 'accept-proof',
    ]);
  });

  // The permissions below are those of the product's flow (who may do what).
  it('lets only the seller side approve, never the contractor who sent the quote', () => {
    expect(mayMoveRequest(['seller'], 'approve', 'quoted')).toBe(true);
    expect(mayMoveRequest(['listing-agent'], 'approve', 'quoted')).toBe(true);
    expect(mayMoveRequest(['contractor'], 'approve', 'quoted')).toBe(false);
    expect(mayMoveRequest(['buyer-agent'], 'approve', 'quoted')).toBe(false);
  });

  it('names who acts next in each state', () => {
    expect(whoActsNext('intake')).toEqual(['buyer-agent', 'listing-agent']);
    expect(whoActsNext('pricing')).toEqual(['contractor']);
    expect(whoActsNext('quoted')).toEqual(['seller', 'listing-agent']);
    expect(whoActsNext('letter-issued')).toEqual(['inspector', 'buyer-agent']);
    expect(whoActsNext('accepted')).toEqual([]);
  });

  // Review 7, P4-1: the dashboard said "Next: the seller" for a request whose work was finished, the
  // request page "Waits for the contractor": a detour (a change order) does not make the request wait.
  it('leaves detours out of who acts next unless they apply', () => {
    expect(whoActsNext('corrected')).toEqual(['contractor']);
    expect(whoActsNext('corrected', ['approve-change-order'])).toEqual(['seller', 'listing-agent', 'contractor']);
    expect(whoActsNextWords('corrected')).toBe('the contractor');
    expect(whoActsNextWords('quoted')).toBe('the seller or the listing agent');
    expect(whoActsNextWords('letter-issued')).toBe('the inspector or the buyer’s agent');
    expect(whoActsNextWords('accepted')).toBe('');
    expect(actorWords(['buyer-agent', 'listing-agent', 'admin'])).toBe('the buyer’s agent or the listing agent');
  });

  it('names someone next in every state that is not final, and the same people as a usual move out of it', () => {
    for (const status of REQUEST_STATUSES) {
      if (FINAL_STATUSES.includes(status)) continue;
      const next = whoActsNext(status);
      expect(next.length).toBeGreaterThan(0);
      for (const actor of next) expect(movesThatApply(status).some((m) => m.by.includes(actor))).toBe(true);
    }
  });

  it('answers the actions that do not move the request', () => {
    expect(mayAct(['inspector'], 'upload-report', 'intake')).toBe(true);
    expect(mayAct(['seller'], 'upload-report', 'intake')).toBe(false);
    expect(mayAct(['inspector'], 'review-items', 'intake')).toBe(false);
    expect(mayAct(['buyer-agent'], 'change-contractor', 'quoted')).toBe(false);
    expect(mayAct(['contractor'], 'price', 'quoted')).toBe(true);
    expect(mayAct(['buyer-agent'], 'see-access-notes', 'scheduled')).toBe(false);
    expect(mayAct(['contractor'], 'refund', 'in-progress')).toBe(true);
    expect(mayAct(['seller'], 'refund', 'in-progress')).toBe(false);
    expect(mayAct(['contractor'], 'issue-invoice', 'quoted')).toBe(false);
    expect(mayAct(['listing-agent'], 'pay', 'approved')).toBe(true);
    expect(mayAct(['contractor'], 'pay', 'approved')).toBe(false);
    expect(mayAct(['seller'], 'see-access-notes', 'scheduled')).toBe(false);
    expect(mayAct(['listing-agent'], 'see-access-notes', 'scheduled')).toBe(true);
    expect(mayAct(['contractor'], 'see-access-notes', 'in-progress')).toBe(true);
    for (const rule of Object.values(REQUEST_ACTIONS)) {
      expect(rule.in.length).toBeGreaterThan(0);
      expect(rule.by.length).toBeGreaterThan(0);
    }
  });
});

describe('item flow', () => {
  for (const move of ITEM_FLOW) {
    for (const from of move.from) {
      for (const actor of ACTORS) {
        const allowed = move.by.includes(actor);
        it(`${move.event} from ${from ?? 'nothing'} by ${actor}: ${allowed ? 'allowed' : 'refused'}`, () => {
          expect(mayMoveItem([actor], move.event, from)).toBe(allowed);
        });
      }
    }
  }

  it('reaches every item state', () => {
    for (const status of ITEM_STATUSES) expect(itemPathTo(status).at(-1)?.to).toBe(status);
  });

  it('takes the parser’s proposal through to a corrected item on the usual course', () => {
    expect(itemPathTo('done').map((m) => m.event)).toEqual(['propose', 'confirm', 'price', 'approve', 'correct']);
  });
});

describe('actorsOf', () => {
  it('gives a person every part they play, the contractor only when assigned, and admin', () => {
    expect(actorsOf({ role: 'agent', myParts: ['buyer-agent', 'listing-agent'], isAssignedContractor: false })).toEqual(['buyer-agent', 'listing-agent']);
    expect(actorsOf({ role: 'contractor', myParts: [], isAssignedContractor: true })).toEqual(['contractor']);
    expect(actorsOf({ role: 'contractor', myParts: [], isAssignedContractor: false })).toEqual([]);
    expect(actorsOf({ role: 'admin', myParts: [], isAssignedContractor: false })).toEqual(['admin']);
  });
});

describe('actorsForRole', () => {
  it('lets an agent account act for either side, the others only as themselves', () => {
    expect(actorsForRole('agent')).toEqual(['buyer-agent', 'listing-agent']);
    expect(actorsForRole('seller')).toEqual(['seller']);
    expect(actorsForRole('inspector')).toEqual(['inspector']);
    expect(actorsForRole('contractor')).toEqual(['contractor']);
    expect(actorsForRole('admin')).toEqual(['admin']);
  });
});

describe('movesThatApply', () => {
  it('leaves out a detour (approving a change order) unless it applies', () => {
    expect(movesThatApply('corrected').map((m) => m.event)).toEqual(['issue-letter']);
    expect(movesThatApply('corrected', ['approve-change-order']).map((m) => m.event).sort()).toEqual(['approve-change-order', 'issue-letter']);
  });
});

describe('nextStepLines', () => {
  it('calls the last outcome so only when one item is left, and counts the items done before', () => {
    expect(nextStepLines('in-progress', { resolved: 0, approved: 3 })).toEqual(['Record the outcome of each item left (0 of 3 done): the contractor']);
    expect(nextStepLines('in-progress', { resolved: 2, approved: 3 })).toEqual(['Record the last outcome: the contractor']);
  });

  it('joins the choices open to the same people into one step', () => {
    const [line, ...rest] = nextStepLines('letter-issued');
    expect(line).toMatch(/^Accept the corrections or list items not accepted: /);
    expect(rest.every((l) => !l.startsWith('List items not accepted'))).toBe(true);
  });
});


describe('calling off a booked visit', () => {
  it('is the booking right: the assigned contractor, in the states a visit may be booked', () => {
    expect(REQUEST_ACTIONS['cancel-visit']).toBe(REQUEST_ACTIONS['book-visit']);
    for (const status of REQUEST_STATUSES) {
      for (const actor of ACTORS) expect(mayAct([actor], 'cancel-visit', status)).toBe(mayAct([actor], 'book-visit', status));
    }
  });

  it('takes a scheduled request back to approved, by the contractor only', () => {
    expect(requestMove('unschedule', 'scheduled')).toMatchObject({ to: 'approved', by: ['contractor'], isDetour: true });
    expect(requestMove('unschedule', 'in-progress')).toBeUndefined();
    for (const actor of ACTORS) expect(mayMoveRequest([actor], 'unschedule', 'scheduled')).toBe(actor === 'contractor');
  });

  it('changes neither who acts next nor the next step of a scheduled request (it is a detour), nor the usual path', () => {
    expect(whoActsNext('scheduled')).toEqual(['contractor']);
    expect(nextStepLines('scheduled')).toEqual(['Start the visit: the contractor']);
    expect(nextStepLines('approved')).toEqual(['Book a visit: the contractor']);
    expect(requestPathTo('scheduled').map((m) => m.event)).not.toContain('unschedule');
    expect(requestPathTo('approved').map((m) => m.event)).not.toContain('unschedule');
  });
});
