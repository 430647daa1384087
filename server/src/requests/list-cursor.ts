import type { RequestSort } from '@cc/shared';
import { ValidationError } from '../errors';
import type { ListKey } from './request.repository';

/**
 * The `after` cursor of a request list page (keyset paging): the last row's sort key and id, with
 * the sort it belongs to, as one opaque URL-safe string. A cursor of another sort or direction, or
 * one that is not ours, is refused with 400 on `after` (the portal then starts at the first page).
 */
interface Cursor extends ListKey {
  sort: RequestSort;
  direction: 'asc' | 'desc';
}

/** What each sort's key looks like as the database writes it (a date, a UTC time, text). */
const KEY_SHAPES: Record<RequestSort, RegExp> = {
  closingDate: /^\d{4}-\d{2}-\d{2}$/,
  createdAt: /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2}(\.\d{1,6})?[+-]\d{2}(:\d{2})?$/,
  status: /^[a-z-]{1,20}$/,
  street: /^[^\0]{1,200}$/,
};

const STALE = 'This page link is out of date: start again from the first page';

/** Whether a key of the right shape also names a real day or moment ("2027-13-45" does not). */
function isRealKey(sort: RequestSort, key: string): boolean {
  if (sort === 'closingDate') {
    const day = new Date(`${key}T00:00:00Z`);
    return !Number.isNaN(day.getTime()) && day.toISOString().slice(0, 10) === key;
  }
  if (sort === 'createdAt') {
    const day = key.slice(0, 10);
    const [h, m, sec] = key.slice(11, 19).split(':').map(Number);
    return isRealKey('closingDate', day) && h < 24 && m < 60 && sec < 60;
  }
  return true;
}

export function encodeCursor(cursor: Cursor): string {
  return Buffer.from(JSON.stringify([cursor.sort, cursor.direction, cursor.sortKey, cursor.id])).toString('base64url');
}

/** The row a page starts after, if `token` is a cursor of this sort and direction; else a 400. */
export function decodeCursor(token: string, sort: RequestSort, direction: 'asc' | 'desc'): ListKey {
  let parts: unknown;
  try {
    parts = JSON.parse(Buffer.from(token, 'base64url').toString('utf8'));
  } catch {
    parts = null;
  }
  if (!Array.isArray(parts) || parts.length !== 4) throw new ValidationError('Invalid page cursor', [{ path: 'after', message: STALE }]);
  const [cursorSort, cursorDirection, sortKey, id] = parts as unknown[];
  const isOurs =
    cursorSort === sort &&
    cursorDirection === direction &&
    typeof sortKey === 'string' &&
    KEY_SHAPES[sort].test(sortKey) &&
    isRealKey(sort, sortKey) &&
    Number.isInteger(id) &&
    (id as number) > 0 &&
    (id as number) < 2 ** 31;
  if (!isOurs) throw new ValidationError('Invalid page cursor', [{ path: 'after', message: STALE }]);
  return { sortKey: sortKey as string, id: id as number };
}
