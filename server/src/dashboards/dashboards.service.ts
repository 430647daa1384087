import {
  closingRisk,
  daysToClosing,
  isEnded,
  monthsEndingAt,
  PIPELINE_STAGES,
  pipelineStage,
  REQUEST_STATUSES,
  requestMove,
  requestReference,
  whoActsNextWords,
  wholePercent,
  type AgentDashboard,
  type ContractorDashboard,
  type CurrentUser,
  type PipelineStage,
} from '@cc/shared';
import { ForbiddenError } from '../errors';
import type { DashboardsRepository, MonthAmount } from './dashboards.repository';

const OPEN_STATUSES = REQUEST_STATUSES.filter((s) => !isEnded(s));
/** The state the seller's approval leads to, from the flow table. */
const APPROVED = requestMove('approve', 'quoted')!.to;

const byMonth = (amounts: MonthAmount[]) => new Map(amounts.map((a) => [a.month, a.cents]));

export class DashboardsService {
  constructor(
    private readonly figures: DashboardsRepository,
    private readonly today: () => string = () => new Date().toISOString().slice(0, 10),
  ) {}

  /** An agent's open requests by closing date, with days left and risk, and their items by status. */
  async agent(user: CurrentUser): Promise<AgentDashboard> {
    if (user.role !== 'agent' && user.role !== 'admin') throw new ForbiddenError('The agent dashboard is for agents');
    const today = this.today();
    const rows = await this.figures.agentRequests(user.role === 'admin' ? null : user.id, OPEN_STATUSES);
    const requests = rows.map((r) => {
      const daysLeft = daysToClosing(r.closing_date, today);
      return {
        id: r.id,
        reference: requestReference(r.id),
        address: `${r.street}, ${r.city}, ${r.state} ${r.zip}`,
        status: r.status,
        closingDate: r.closing_date,
        daysLeft,
        risk: closingRisk(r.status, daysLeft),
        // The shared next-step rule, as the request page says it ("Waits for the contractor").
        nextActor: whoActsNextWords(r.status) || null,
      };
    });
    return { today, requests, itemsByStatus: await this.figures.itemsByStatus(rows.map((r) => r.id)) };
  }

  /** The contractor's pipeline, revenue quoted / approved / paid by month, and the agents who send work. */
  async contractor(user: CurrentUser, months: number): Promise<ContractorDashboard> {
    if (user.role !== 'contractor' || user.organisationId === null) throw new ForbiddenError('The contractor dashboard is for contractors');
    const org = user.organisationId;
    const monthList = monthsEndingAt(this.today(), months);
    const [statuses, quoted, approved, paid, agents] = await Promise.all([
      this.figures.statusCounts(org),
      this.figures.quotedByMonth(org, monthList[0]),
      this.figures.entryAmountsByMonth(org, 'items-decided', monthList[0]),
      this.figures.entryAmountsByMonth(org, 'payment-received', monthList[0]),
      this.figures.workByAgent(org, APPROVED),
    ]);
    const stageCounts = new Map<PipelineStage, number>(PIPELINE_STAGES.map((s) => [s, 0]));
    for (const { status, count } of statuses) {
      const stage = pipelineStage(status);
      if (stage) stageCounts.set(stage, stageCounts.get(stage)! + count);
    }
    const [q, a, p] = [byMonth(quoted), byMonth(approved), byMonth(paid)];
    return {
      pipeline: PIPELINE_STAGES.map((stage) => ({ stage, count: stageCounts.get(stage)! })),
      revenue: monthList.map((month) => ({ month, quotedCents: q.get(month) ?? 0, approvedCents: a.get(month) ?? 0, paidCents: p.get(month) ?? 0 })),
      agents: agents.map((r) => ({
        name: r.name,
        email: r.email,
        requests: r.requests,
        converted: r.converted,
        conversionPercent: wholePercent(r.converted, r.requests),
        quotedCents: r.quoted_cents,
      })),
    };
  }
}
