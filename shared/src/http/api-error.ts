import * as z from 'zod';

/** Every error the API returns has this shape. `details` lists field problems for 400s. */
export const ApiErrorDetailSchema = z.object({
  path: z.string(),
  message: z.string(),
});
export type ApiErrorDetail = z.infer<typeof ApiErrorDetailSchema>;

export const ApiErrorSchema = z.object({
  error: z.string(),
  details: z.array(ApiErrorDetailSchema),
});
export type ApiError = z.infer<typeof ApiErrorSchema>;
