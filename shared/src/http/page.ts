import * as z from 'zod';

export const PageQuerySchema = z.object({
  page: z.coerce.number().int().min(0).max(100_000).default(0),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

/** One page of a server-side paged list. */
export interface Page<T> {
  items: T[];
  total: number;
  /** Whether `total` stops at a cap (the list has more rows than it counted: show "1,000+" or "100+"). */
  isTotalCapped?: boolean;
  page: number;
  pageSize: number;
  /**
   * Lists paged by key: what to send as `after` for the page that follows this one; null when no
   * row follows this page (so a list whose total is capped still ends where its rows end).
   */
  nextCursor?: string | null;
}
