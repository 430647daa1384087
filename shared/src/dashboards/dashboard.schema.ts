import * as z from 'zod';
import { ItemStatusSchema } from '../items/item-status';
import { RequestStatusSchema } from '../requests/request-status.schema';

export const CLOSING_RISKS = ['high', 'medium', 'low', 'none'] as const;
export const ClosingRiskSchema = z.enum(CLOSING_RISKS);
export type ClosingRisk = z.infer<typeof ClosingRiskSchema>;

export const CLOSING_RISK_LABELS: Record<ClosingRisk, string> = {
  high: 'At risk',
  medium: 'Watch',
  low: 'On track',
  none: 'Finished',
};

export const PIPELINE_STAGES = ['to-price', 'awaiting-approval', 'to-schedule', 'to-correct', 'letters-due'] as const;
export const PipelineStageSchema = z.enum(PIPELINE_STAGES);
export type PipelineStage = z.infer<typeof PipelineStageSchema>;

export const PIPELINE_STAGE_LABELS: Record<PipelineStage, string> = {
  'to-price': 'To price',
  'awaiting-approval': 'Awaiting approval',
  'to-schedule': 'To schedule',
  'to-correct': 'To correct',
  'letters-due': 'Letters due',
};

export const AgentDashboardSchema = z.object({
  today: z.string(),
  requests: z.array(
    z.object({
      id: z.number().int(),
      reference: z.string(),
      address: z.string(),
      status: RequestStatusSchema,
      closingDate: z.string(),
      daysLeft: z.number().int(),
      risk: ClosingRiskSchema,
      nextActor: z.string().nullable(),
    }),
  ),
  itemsByStatus: z.array(z.object({ status: ItemStatusSchema, count: z.number().int() })),
});
export type AgentDashboard = z.infer<typeof AgentDashboardSchema>;

export const RevenueMonthSchema = z.object({
  /** YYYY-MM */
  month: z.string(),
  quotedCents: z.number().int(),
  approvedCents: z.number().int(),
  paidCents: z.number().int(),
});
export type RevenueMonth = z.infer<typeof RevenueMonthSchema>;

export const ReferringAgentSchema = z.object({
  name: z.string(),
  email: z.string(),
  requests: z.number().int(),
  converted: z.number().int(),
  /** Whole percent of the agent's requests that reached an approved quote. */
  conversionPercent: z.number().int(),
  quotedCents: z.number().int(),
});
export type ReferringAgent = z.infer<typeof ReferringAgentSchema>;

export const ContractorDashboardSchema = z.object({
  pipeline: z.array(z.object({ stage: PipelineStageSchema, count: z.number().int() })),
  revenue: z.array(RevenueMonthSchema),
  agents: z.array(ReferringAgentSchema),
});
export type ContractorDashboard = z.infer<typeof ContractorDashboardSchema>;

export const DashboardQuerySchema = z.object({
  /** How many months of revenue, ending with the current one. */
  months: z.coerce.number().int().min(1).max(24).default(6),
});
