import type { Knex } from 'knex';
import { ActivityRepository } from '../../server/src/activity/activity.repository';
import type { FlowService } from '../../server/src/flow/flow.service';
import { createFlowListener } from '../../server/src/notifications/flow-listener';
import { NotificationsService } from '../../server/src/notifications/notifications.service';
import { OutboxRepository } from '../../server/src/notifications/outbox.repository';
import { PreferencesRepository } from '../../server/src/notifications/preferences.repository';
import { sellerNoticesByMail } from '../../server/src/notifications/seller-notice-mail';

/**
 * The services that write a request's history besides its moves, as the server builds them: the
 * activity timeline and the messages each step calls for. The seeds' history goes through them, so
 * the demo's Activity panels and dashboards read what the real steps would have written.
 */
export function historyWriters(knex: Knex) {
  const activity = new ActivityRepository(knex);
  const notifications = new NotificationsService(knex, new OutboxRepository(knex), new PreferencesRepository(knex), activity, {
    publicUrl: process.env.PUBLIC_URL ?? 'http://127.0.0.1:4300',
    from: 'Closing Circuit <no-reply@closingcircuit.test>',
    // Signs the unsubscribe links of messages that are never sent (see markHistoryDelivered).
    secret: 'demo-history-is-never-sent',
    // Demo history tells each outcome in its own (never sent) message.
    gatherItemMessagesMs: 0,
  });
  return {
    activity,
    notifications,
    sellerNotices: sellerNoticesByMail(notifications),
    /** Hangs the server's own flow listener (timeline entries and messages of each move) on `flow`. */
    listenOn(flow: FlowService): FlowService {
      flow.listen(createFlowListener(activity, notifications));
      return flow;
    },
  };
}

/**
 * The demo's history happened before today: its messages count as delivered when they were written,
 * so the outbox worker does not e-mail old news when the server starts.
 */
export async function markHistoryDelivered(knex: Knex): Promise<void> {
  await knex('outbox_messages').whereIn('status', ['pending', 'held']).update({ status: 'sent', sent_at: knex.ref('created_at') });
}
