import * as z from 'zod';
import { plainText, RecordIdSchema } from '../http/bounds';
import { CurrentUserSchema, NewPasswordSchema } from '../auth/auth.schema';
import { RoleSchema } from '../auth/role';

export const CreateUserSchema = z.object({
  email: z.email('Enter a valid e-mail address').trim().toLowerCase(),
  name: plainText(120).trim().min(2, 'Enter the full name'),
  role: RoleSchema,
  organisationId: RecordIdSchema.nullable(),
  password: NewPasswordSchema,
});
export type CreateUser = z.infer<typeof CreateUserSchema>;

/** A user as an administrator lists them. */
export const UserSchema = CurrentUserSchema.extend({
  createdAt: z.string(),
});
export type User = z.infer<typeof UserSchema>;
