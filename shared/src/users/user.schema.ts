import * as z from 'zod';
import { NewPasswordSchema } from '../auth/auth.schema';
import { RoleSchema } from '../auth/role';

export const CreateUserSchema = z.object({
  email: z.email('Enter a valid e-mail address').trim().toLowerCase(),
  name: z.string().trim().min(2, 'Enter the full name').max(120),
  role: RoleSchema,
  organisationId: z.number().int().positive().nullable(),
  password: NewPasswordSchema,
});
export type CreateUser = z.infer<typeof CreateUserSchema>;

export const UserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  organisationId: z.number().int().nullable(),
  organisationName: z.string().nullable(),
  createdAt: z.string(),
});
export type User = z.infer<typeof UserSchema>;
