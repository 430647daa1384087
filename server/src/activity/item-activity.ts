// Timeline entries for changes to a line item: the fields a person sees, before and after.
import { findingCodeInfo, type FindingCode } from '@cc/shared';
import type { Trx } from '../db/knex';
import { changedFields, type ActivityRepository } from './activity.repository';

export interface ItemFacts {
  id: number;
  requestId?: number;
  code: FindingCode;
  room: string;
  location: string | null;
  quantity: number | null;
  status: string;
  severity?: string;
}

const SHOWN = ['code', 'room', 'location', 'quantity', 'severity', 'status'] as const;

function valuesOf(item: Partial<ItemFacts>) {
  return Object.fromEntries(SHOWN.filter((k) => item[k] !== undefined).map((k) => [k, item[k] ?? null])) as Record<string, string | number | null>;
}

const ACTION_WORDS: Record<string, string> = {
  'item-edited': 'Item edited',
  'items-merged': 'Items merged',
  'item-split': 'Item split',
  'item-added': 'Item added by hand',
};

/** Records the change of one item (`before` null for a new item); nothing when no shown field changed. */
export async function recordItemChange(
  activity: ActivityRepository,
  trx: Trx,
  actorUserId: number,
  action: keyof typeof ACTION_WORDS,
  before: (ItemFacts & { requestId: number }) | null,
  after: ItemFacts & { requestId?: number },
  note?: string,
): Promise<void> {
  const requestId = before?.requestId ?? after.requestId;
  if (requestId === undefined) throw new Error('recordItemChange needs the request of the item');
  const diff = before ? changedFields(valuesOf(before), valuesOf(after)) : { before: null, after: valuesOf(after) };
  if (!diff && !note) return;
  const label = findingCodeInfo(after.code).label;
  await activity.record(trx, {
    requestId,
    itemId: after.id,
    actorUserId,
    kind: 'items',
    action,
    summary: `${ACTION_WORDS[action]}: ${label}${note ? ` — ${note}` : ''}`,
    before: diff?.before ?? null,
    after: diff?.after ?? null,
  });
}
