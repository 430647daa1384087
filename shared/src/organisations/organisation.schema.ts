import * as z from 'zod';
import { UsStateSchema } from '../requests/us-state';

export const ORGANISATION_KINDS = ['brokerage', 'contractor', 'inspection-company', 'platform'] as const;
export const OrganisationKindSchema = z.enum(ORGANISATION_KINDS);
export type OrganisationKind = z.infer<typeof OrganisationKindSchema>;

export const ORGANISATION_KIND_LABELS: Record<OrganisationKind, string> = {
  brokerage: 'Real-estate brokerage',
  contractor: 'Electrical contractor',
  'inspection-company': 'Inspection company',
  platform: 'Closing Circuit staff',
};

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max)
    .transform((v) => (v === '' ? null : v))
    .nullable()
    .optional()
    .transform((v) => v ?? null);

export const CreateOrganisationSchema = z
  .object({
    name: z.string().trim().min(2, 'Enter the organisation name').max(160),
    kind: OrganisationKindSchema,
    phone: optionalText(40),
    address: optionalText(300),
    licenceNumber: optionalText(60),
    licenceState: UsStateSchema.nullable().optional().transform((v) => v ?? null),
    licenceClass: optionalText(80),
  })
  .superRefine((org, ctx) => {
    if (org.kind === 'contractor') {
      if (!org.licenceNumber) {
        ctx.addIssue({ code: 'custom', path: ['licenceNumber'], message: 'A contractor needs its licence number' });
      }
      if (!org.licenceState) {
        ctx.addIssue({ code: 'custom', path: ['licenceState'], message: 'Choose the state that issued the licence' });
      }
    }
  });
export type CreateOrganisation = z.infer<typeof CreateOrganisationSchema>;

export const OrganisationSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  kind: OrganisationKindSchema,
  phone: z.string().nullable(),
  address: z.string().nullable(),
  licenceNumber: z.string().nullable(),
  licenceState: z.string().nullable(),
  licenceClass: z.string().nullable(),
});
export type Organisation = z.infer<typeof OrganisationSchema>;
