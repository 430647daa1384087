import * as z from 'zod';

/**
 * Bounds every request body and query is held to, shared by the server (which refuses what falls
 * outside with a 400) and the portal (whose forms show the same messages). PostgreSQL `integer`
 * columns hold up to 2^31 − 1, so ids, versions and counts stop there.
 */
export const INT4_MAX = 2_147_483_647;

/** Text fields may hold any character but NUL, which PostgreSQL text cannot store. */
export const NO_NUL_MESSAGE = 'Remove the NUL characters from this text';
export const hasNoNul = (value: string): boolean => !value.includes('\u0000');

/** A string without NUL characters, at most `max` characters long (said in plain words when longer). */
export function plainText(max: number, maxMessage = `Use at most ${max} characters`) {
  return z.string().max(max, maxMessage).refine(hasNoNul, { error: NO_NUL_MESSAGE });
}

/** The same, trimmed first: free text a person types into a form. */
export function trimmedText(max: number, maxMessage = `Use at most ${max} characters`) {
  return z.string().trim().max(max, maxMessage).refine(hasNoNul, { error: NO_NUL_MESSAGE });
}

/**
 * A whole number a person types (a quantity, minutes, spare units) from `min` to `max`, with every
 * message in plain words: zod's own ("Invalid input: expected int, received number", "Too big:
 * expected number to be <=999") are not for people. `what` names the value when it is missing.
 */
export function wholeNumber(min: number, max: number, what = 'a whole number') {
  return z
    .number({ error: `Enter ${what}` })
    .int('Use a whole number, without decimals')
    .min(min, `Use a whole number of ${min} or more`)
    .max(max, `Use at most ${max}`);
}

/** How many of a thing an item is priced at: 1 to 999. */
export const QUANTITY_MAX = 999;
export const QuantitySchema = wholeNumber(1, QUANTITY_MAX, 'a quantity');

/** The id of a stored record, as a client sends it in a body. */
export const RecordIdSchema = z.number().int().positive().max(INT4_MAX, 'No record has this id');

/** An optimistic-concurrency version, as a client sends it back. */
export const VersionSchema = z.number().int().min(1).max(INT4_MAX, 'No record has this version');

/** The same, from a query string (`?version=3`). */
export const VersionQuerySchema = z.object({ version: z.coerce.number().int().min(1).max(INT4_MAX, 'No record has this version') });

/** Earliest and latest dates a closing or other calendar date may name. */
export const MIN_DATE = '2000-01-01';
export const MAX_DATE = '2099-12-31';

/** A calendar date as YYYY-MM-DD between MIN_DATE and MAX_DATE (ISO strings of that form sort as dates). */
export const BoundedDateSchema = z.iso
  .date({ error: 'Enter a date as YYYY-MM-DD' })
  // Only a well-formed date is compared, so a malformed one gets one message, not two.
  .refine((d) => !/^\d{4}-\d{2}-\d{2}$/.test(d) || (d >= MIN_DATE && d <= MAX_DATE), { error: `Enter a date between ${MIN_DATE} and ${MAX_DATE}` });

/** Deepest nesting a request body may have. */
export const MAX_BODY_DEPTH = 32;

/**
 * Walks a parsed JSON value, query or path (without recursion) and returns the first problem: the
 * path of a string or key holding NUL, or of a value nested deeper than MAX_BODY_DEPTH.
 */
export function findInputProblem(value: unknown): { path: string; message: string } | null {
  const stack: { value: unknown; path: string[] }[] = [{ value, path: [] }];
  while (stack.length) {
    const { value: current, path } = stack.pop()!;
    if (typeof current === 'string') {
      if (!hasNoNul(current)) return { path: path.join('.'), message: NO_NUL_MESSAGE };
    } else if (current !== null && typeof current === 'object') {
      if (path.length >= MAX_BODY_DEPTH) return { path: path.join('.'), message: 'This value is nested too deeply' };
      for (const [key, inner] of Object.entries(current)) {
        if (!hasNoNul(key)) return { path: [...path, key].join('.'), message: NO_NUL_MESSAGE };
        stack.push({ value: inner, path: [...path, key] });
      }
    }
  }
  return null;
}

/**
 * Largest total a quote may have: $10,000,000.00. Quote figures are kept in integer columns (up to
 * 2^31 − 1 cents, about $21.4M); a total above this is a slip in the rate book or the quantities.
 */
export const MAX_QUOTE_TOTAL_CENTS = 1_000_000_000;
