// The proof side told by e-mail (visits, outcomes, letters): each message is written with notify()
// in the caller's transaction, so it commits or rolls back with the change.
import { findingCodeInfo, placeLabel, type FindingCode } from '@cc/shared';
import type { ProofMessages } from '../work/proof-messages';
import type { NotificationsService } from './notifications.service';

export function proofMessagesByMail(notifications: NotificationsService): ProofMessages {
  return {
    async visitScheduled(trx, { requestId, by, visitNumber, date, arrivalFrom, arrivalTo, previous }) {
      await notifications.notify(trx, { kind: 'visit-scheduled', requestId, actorUserId: by ?? null, visitNumber, date, arrivalFrom, arrivalTo, previous: previous ?? null });
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
