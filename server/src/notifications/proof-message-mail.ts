// The proof side told by e-mail (visits, outcomes, letters): each message is written with notify()
// in the caller's transaction, so it commits or rolls back with the change.
import { findingCodeInfo, placeLabel, type FindingCode } from '@cc/shared';
import type { Trx } from '../db/knex';
import { electricianVisitChanges, type ProofMessages } from '../work/proof-messages';
import type { NotificationsService } from './notifications.service';

/** The change's transaction: each change of a visit is one message to its electrician. */
async function changeRef(trx: Trx): Promise<string> {
  const { rows } = await trx.raw<{ rows: { txid: string }[] }>('SELECT txid_current()::text AS txid');
  return rows[0].txid;
}

export function proofMessagesByMail(notifications: NotificationsService): ProofMessages {
  return {
    async visitScheduled(trx, { requestId, by, visitNumber, date, arrivalFrom, arrivalTo, previous }) {
      await notifications.notify(trx, { kind: 'visit-scheduled', requestId, actorUserId: by ?? null, visitNumber, date, arrivalFrom, arrivalTo, previous: previous ?? null });
    },

    async visitCancelled(trx, { requestId, by, visitId, visitNumber, slot, reason }) {
      const window = { date: slot.date, arrivalFrom: slot.arrivalFrom, arrivalTo: slot.arrivalTo };
      await notifications.notify(trx, { kind: 'visit-cancelled', requestId, actorUserId: by ?? null, visitNumber, ...window, reason });
      await notifications.notify(trx, {
        kind: 'electrician-visit',
        requestId,
        actorUserId: by ?? null,
        electricianUserId: slot.electricianId,
        visitId,
        visitNumber,
        change: 'cancelled',
        ...window,
        previous: null,
        handedTo: null,
        reason,
        changeRef: await changeRef(trx),
      });
    },

    async visitAssigned(trx, { requestId, by, visitId, visitNumber, before, after }) {
      const changes = electricianVisitChanges(before, after);
      if (!changes.length) return;
      // One message per change, even if the visit later comes back to the same person, day and window.
      const txid = await changeRef(trx);
      const names = new Map<number, string>(
        (await trx('users').whereIn('id', [...new Set(changes.map((c) => c.electricianId))]).select('id', 'name')).map((u: { id: number; name: string }) => [u.id, u.name]),
      );
      for (const { electricianId, change, slot } of changes) {
        await notifications.notify(trx, {
          kind: 'electrician-visit',
          requestId,
          actorUserId: by ?? null,
          electricianUserId: electricianId,
          visitId,
          visitNumber,
          change,
          date: slot.date,
          arrivalFrom: slot.arrivalFrom,
          arrivalTo: slot.arrivalTo,
          previous: change === 'moved' && before ? { date: before.date, arrivalFrom: before.arrivalFrom, arrivalTo: before.arrivalTo } : null,
          handedTo: change === 'removed' ? (names.get(after.electricianId) ?? null) : null,
          reason: null,
          changeRef: txid,
        });
      }
    },

    async itemCorrected(trx, { requestId, by, itemId, correctionId, outcome }) {
      const item: { code: string; room: string; location: string | null } = await trx('line_items').where({ id: itemId }).first('code', 'room', 'location');
      const name = findingCodeInfo(item.code as FindingCode)?.label ?? `Item #${itemId}`;
      const itemLabel = `${name} (${placeLabel(item.room, item.location)})`;
      await notifications.notify(trx, { kind: 'item-corrected', requestId, actorUserId: by ?? null, itemId, correctionId, outcome, itemLabel });
    },

    async letterIssued(trx, { requestId, by, letterNumber, revision }) {
      // Outcomes still gathering go first, and say the letter is issued rather than to come.
      await notifications.releaseGathered(requestId, letterNumber, trx);
      await notifications.notify(trx, { kind: 'letter-issued', requestId, actorUserId: by ?? null, letterNumber, revision });
    },
  };
}
