import { isEnded, REQUEST_FLOW, REQUEST_STATUSES, Role, PartyRole, whoActsNextWords } from '@cc/shared';
import { nextStepOf } from './next-step-text';

const SELLER = { role: 'seller' as Role, myParts: ['seller'] as PartyRole[] };
const AGENT = { role: 'agent' as Role, myParts: ['buyer-agent'] as PartyRole[] };
const CONTRACTOR = { role: 'contractor' as Role, myParts: [] as PartyRole[] };
const INSPECTOR = { role: 'inspector' as Role, myParts: ['inspector'] as PartyRole[] };
const VIEWERS = [SELLER, AGENT, CONTRACTOR, INSPECTOR, { role: 'admin' as Role, myParts: [] as PartyRole[] }];

describe('nextStepOf', () => {
  it('never leaves a reachable state silent: every role sees what it waits for and who acts, or that it has ended', () => {
    for (const status of REQUEST_STATUSES) {
      for (const viewer of VIEWERS) {
        const step = nextStepOf(status, viewer);
        expect(step.summary.length).toBeGreaterThan(10);
        if (step.isEnded) {
          // After accepted work, money may still come in (the flow table's record-funds): the page does
          // not say that nothing more happens while the seller may still owe (review 7, P3-2).
          if (status === 'accepted') {
            expect(step.summary).toContain('the contractor records it on the approval page when it arrives');
            expect(step.summary).not.toContain('nothing more happens');
          } else {
            expect(step.summary).toContain('nothing more happens');
            expect(step.summary).not.toContain('approval page');
          }
          expect(step.moves).toEqual([]);
        } else {
          // Every move named comes from the shared table, with who makes it.
          expect(step.moves.length).toBeGreaterThan(0);
          for (const move of step.moves) {
            expect(REQUEST_FLOW.some((m) => m.label === move.label && m.from.includes(status))).toBe(true);
            expect(move.by).toMatch(/^the /);
          }
        }
      }
    }
  });

  it('tells the seller that a quote waits for them, with the link to the approval page', () => {
    const step = nextStepOf('quoted', SELLER);
    expect(step.summary).toBe('Waits for you (the seller or the listing agent).');
    const approve = step.moves.find((m) => m.label === 'Approve and sign')!;
    expect(approve).toMatchObject({ isYours: true, isOutsidePortal: false });
    expect(approve.place?.link(5)).toEqual(['/requests', 5, 'approval']);
  });

  it('leads the contractor to visits and proof and the inspector to the letter; only withdrawing stays outside the portal', () => {
    expect(nextStepOf('approved', CONTRACTOR).moves[0].place?.link(5)).toEqual(['/requests', 5, 'work']);
    expect(nextStepOf('corrected', CONTRACTOR).moves[0]).toMatchObject({ label: 'Issue the completion letter', isOutsidePortal: false });
    expect(nextStepOf('letter-issued', INSPECTOR).moves.every((m) => m.place?.link(5).includes('work'))).toBe(true);
    const outside = REQUEST_STATUSES.flatMap((status) =>
      VIEWERS.flatMap((viewer) => nextStepOf(status, viewer).moves.filter((m) => m.isOutsidePortal).map((m) => m.label)),
    );
    expect(outside.filter((label) => label !== 'Withdraw (the sale fell through)')).toEqual([]);
  });

  it('tells the agent the quote waits for the seller side, not for them', () => {
    expect(nextStepOf('quoted', AGENT).summary).toBe('Waits for the seller or the listing agent.');
  });

  it('gives the contractor the link to price a request that awaits prices', () => {
    const step = nextStepOf('pricing', CONTRACTOR);
    expect(step.summary).toContain('Waits for you (the contractor)');
    expect(step.moves[0].place?.link(7)).toEqual(['/requests', 7, 'pricing']);
    // The agent sees who acts, without a link to a page that is not theirs.
    expect(nextStepOf('pricing', AGENT).moves[0]).toMatchObject({ isYours: false, place: null, by: 'the contractor' });
  });

  it('names the contractor for a booked visit and a finished job, and the inspector or agent for an issued letter', () => {
    expect(nextStepOf('scheduled', SELLER).summary).toBe('Waits for the contractor.');
    // A finished job waits for the letter; a change order is a detour, listed after it.
    const finished = nextStepOf('corrected', SELLER);
    expect(finished.summary).toBe('Waits for the contractor.');
    expect(finished.moves.map((m) => [m.label, m.isDetour])).toEqual([
      ['Issue the completion letter', false],
      ['Approve the change order', true],
    ]);
    expect(nextStepOf('letter-issued', INSPECTOR).summary).toBe('Waits for you (the inspector or the buyer’s agent).');
    expect(nextStepOf('withdrawn', SELLER).isEnded).toBe(true);
  });

  // Review 7, P4-1: the agent's dashboard ("Next: …", from the server) and this panel named different
  // people; both now say the shared rule's words.
  it('names the same people as the dashboard’s "Next:" in every state', () => {
    for (const status of REQUEST_STATUSES) {
      if (isEnded(status)) continue;
      // Someone who plays no part on it, so that the panel speaks of the others in the third person.
      expect(nextStepOf(status, { role: 'admin', myParts: [] }).summary).toBe(`Waits for ${whoActsNextWords(status)}.`);
    }
  });
});
