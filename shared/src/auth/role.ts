import * as z from 'zod';

/** Every person who signs in has exactly one role. */
export const ROLES = ['agent', 'seller', 'contractor', 'inspector', 'admin'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  agent: 'Real-estate agent',
  seller: 'Seller',
  contractor: 'Electrical contractor',
  inspector: 'Home inspector',
  admin: 'Administrator',
};
