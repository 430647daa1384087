import * as z from 'zod';
import { RoleSchema } from './role';

export const SignInSchema = z.object({
  email: z.email('Enter a valid e-mail address').trim().toLowerCase(),
  password: z.string().min(1, 'Enter your password'),
});
export type SignIn = z.infer<typeof SignInSchema>;

/** Password rule used everywhere a password is chosen. */
export const NewPasswordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

export const ChangePasswordSchema = z.object({
  currentPassword: z.string().min(1, 'Enter your current password'),
  newPassword: NewPasswordSchema,
});
export type ChangePassword = z.infer<typeof ChangePasswordSchema>;

export const CurrentUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  organisationId: z.number().int().nullable(),
  organisationName: z.string().nullable(),
});
export type CurrentUser = z.infer<typeof CurrentUserSchema>;

/** Answer of sign-in and of GET /api/auth/me: the user and the CSRF token bound to this session. */
export const SessionSchema = z.object({
  user: CurrentUserSchema,
  csrfToken: z.string(),
});
export type Session = z.infer<typeof SessionSchema>;

/**
 * Answer of GET /api/auth/session: who is signed in (null for a visitor) and the CSRF token of this
 * session. Always 200, so a signed-out page load logs no failed request in the browser.
 */
export const SessionStateSchema = z.object({
  user: CurrentUserSchema.nullable(),
  csrfToken: z.string(),
});
export type SessionState = z.infer<typeof SessionStateSchema>;
