import { ApiErrorDetail } from '@cc/shared';
import type { z } from 'zod';

/** A zod error as the `{path, message}` list the API also answers with. */
export function issuesOf(error: z.ZodError): ApiErrorDetail[] {
  return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}
