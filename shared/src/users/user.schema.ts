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
  /** A deactivated account cannot sign in; its sessions were ended. */
  isActive: z.boolean(),
});

/** An administrator's change to an account (the role stays: make a new account for another role). */
export const UpdateUserSchema = CreateUserSchema.pick({ email: true, name: true, organisationId: true });
export type UpdateUser = z.infer<typeof UpdateUserSchema>;

/** Turns an account on or off. */
export const SetUserActiveSchema = z.object({ isActive: z.boolean({ error: 'Say whether the account is active' }) });
export type SetUserActive = z.infer<typeof SetUserActiveSchema>;

/**
 * Answer of a password reset: a temporary password, shown once to the administrator, who passes it
 * on (no e-mail is sent yet). The person's sessions end; they change it under "My account".
 */
export const PasswordResetSchema = z.object({ temporaryPassword: z.string() });
export type PasswordReset = z.infer<typeof PasswordResetSchema>;
export type User = z.infer<typeof UserSchema>;
