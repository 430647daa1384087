import * as z from 'zod';
import { CurrentUserSchema, NewPasswordSchema } from '../auth/auth.schema';
import { RoleSchema } from '../auth/role';

export const CreateUserSchema = z.object({
  email: z.email('Enter a valid e-mail address').trim().toLowerCase(),
  name: z.string().trim().min(2, 'Enter the full name').max(120),
  role: RoleSchema,
  organisationId: z.number().int().positive().nullable(),
  password: NewPasswordSchema,
});
export type CreateUser = z.infer<typeof CreateUserSchema>;

/** A user as an administrator lists them. */
export const UserSchema = CurrentUserSchema.extend({
  createdAt: z.string(),
});
export type User = z.infer<typeof UserSchema>;
