import * as z from 'zod';

/** Trimmed text of at most `max` characters with no NUL bytes (PostgreSQL refuses them in text). */
export function plainText(max: number, tooLong = `Use at most ${max} characters`) {
  return z
    .string()
    .trim()
    .max(max, tooLong)
    .refine((s) => !s.includes('\u0000'), 'Remove the NUL characters from this text');
}
