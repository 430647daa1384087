import { randomBytes } from 'node:crypto';
import {
  actorsOf,
  closingProgress,
  lastAtRiskClosingDate,
  PARTY_ROLE_LABELS,
  defaultNecEdition,
  REQUEST_ACTIONS,
  type FlowActor,
  type CreateRepairRequestParsed,
  type CurrentUser,
  type HouseCode,
  type InviteParty,
  type Page,
  type Party,
  type PartyRole,
  type RepairRequestDetail,
  type RepairRequestSummary,
  ROLE_FOR_PARTY,
  type UsState,
  parseRequestReference,
  RepairRequestListQuerySchema,
} from '@cc/shared';
import type { z } from 'zod';
import type { Db, Trx } from '../db/knex';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import { decodeCursor, encodeCursor } from './list-cursor';
import type { RequestRepository } from './request.repository';
import type { UserRepository } from '../auth/user.repository';
import { NotFoundError, ValidationError } from '../errors';
import { JsonText } from '../http/json-text';
import { assertMayAct, assertMayMoveRequest, moverOn, type FlowService } from '../flow/flow.service';
import type { ActivityRepository } from '../activity/activity.repository';
import type { NotificationsService } from '../notifications/notifications.service';
import type { LineItemRepository } from '../intake/line-item.repository';
import type { ItemPricingRepository } from '../pricing/item-pricing.repository';

const INVITE_DAYS = 14;
/** Who invites parties (and so sees the invitation links of those not yet joined). */
const INVITERS: readonly FlowActor[] = REQUEST_ACTIONS['invite-party'].by;


export class RequestsService {
  constructor(
    private readonly db: Db,
    private readonly requests: RequestRepository,
    private readonly users: UserRepository,
    private readonly organisations: OrganisationRepository,
    private readonly flow: FlowService,
    private readonly items: LineItemRepository,
    private readonly itemPricing: ItemPricingRepository,
    private readonly publicUrl: string,
    private readonly notifications: NotificationsService,
    private readonly activity: ActivityRepository,
    /** Open approved work this many business days before closing flags a request as at risk. */
    private readonly atRiskBusinessDays = 3,
  ) {}

  /** The summary with its at-risk flag for today. */
  private withRisk<T extends RepairRequestSummary>(summary: T, today = new Date().toISOString().slice(0, 10)): T {
    const { isAtRisk } = closingProgress({ closingDate: summary.closingDate, today, approvedCount: summary.openWorkCount, resolvedCount: 0, atRiskBusinessDays: this.atRiskBusinessDays });
    return { ...summary, isAtRisk };
  }

  /**
   * A page of the requests `user` may see, as the JSON text of a Page<RepairRequestSummary>: the
   * summaries come written by PostgreSQL (RequestRepository.list) and are sent on as they are.
   */
  async list(user: CurrentUser, query: z.output<typeof RepairRequestListQuerySchema>): Promise<JsonText<Page<RepairRequestSummary>>> {
    const today = new Date().toISOString().slice(0, 10);
    const { itemsJson, total, isTotalCapped, lastKey, hasMore } = await this.requests.list(
      viewerOf(user),
      {
        page: query.page,
        pageSize: query.pageSize,
        sort: query.sort,
        direction: query.direction,
        statuses: query.status,
        text: query.q,
        id: query.q ? parseRequestReference(query.q) : null,
        builtBefore: query.builtBefore ?? null,
        after: query.after ? decodeCursor(query.after, query.sort, query.direction) : null,
      },
      lastAtRiskClosingDate(today, this.atRiskBusinessDays),
    );
    const nextCursor = lastKey && hasMore ? encodeCursor({ ...lastKey, sort: query.sort, direction: query.direction }) : null;
    return new JsonText(
      `{"items":${itemsJson},"total":${total},"isTotalCapped":${isTotalCapped},"page":${query.page},"pageSize":${query.pageSize},"nextCursor":${JSON.stringify(nextCursor)}}`,
    );
  }

  /** The build year and adopted edition of a request `user` may see (for code notes); 404 otherwise. */
  async house(user: CurrentUser, id: number): Promise<HouseCode> {
    const house = await this.requests.findVisibleHouse(viewerOf(user), id);
    if (!house) throw new NotFoundError('No such repair request');
    return house;
  }

  /** The request as `user` may see it; 404 when they are not a party to it. */
  async get(user: CurrentUser, id: number): Promise<RepairRequestDetail> {
    const request = await this.requests.findVisible(viewerOf(user), id);
    if (!request) throw new NotFoundError('No such repair request');
    const [parties, history, contractor] = await Promise.all([
      this.requests.parties(id),
      this.requests.history(id),
      request.contractorOrganisationId ? this.organisations.findById(request.contractorOrganisationId) : null,
    ]);
    const myParts = parties.filter((p) => p.userId === user.id).map((p) => p.role);
    // Those who invite see the invitation links.
    const seesInviteLinks = actorsOf({ role: user.role, myParts, isAssignedContractor: false }).some((a) => INVITERS.includes(a));
    const { contractorOrganisationId: _omit, ...summary } = this.withRisk(request);
    return {
      ...summary,
      contractor: contractor && {
        id: contractor.id,
        name: contractor.name,
        licenceNumber: contractor.licenceNumber,
        licenceState: contractor.licenceState,
        licenceClass: contractor.licenceClass,
      },
      parties: parties.map(
        (p): Party => ({
          role: p.role,
          email: p.email,
          name: p.name,
          userId: p.userId,
          isPending: p.userId === null,
          inviteUrl: p.userId === null && seesInviteLinks && p.inviteToken ? this.inviteUrl(p.inviteToken) : null,
        }),
      ),
      history,
      myParts,
    };
  }

  async create(user: CurrentUser, input: CreateRepairRequestParsed): Promise<RepairRequestDetail> {
    // An agent who opens a request is its buyer's agent; an administrator opens it for one.
    const mover = { userId: user.id, actors: actorsOf({ role: user.role, myParts: user.role === 'agent' ? ['buyer-agent'] : [], isAssignedContractor: false }) };
    const opened = { notYours: 'Only an agent opens a repair request', notNow: 'This request cannot be opened' };
    assertMayMoveRequest(mover.actors, 'open', null, opened);
    const id = await this.db.transaction(async (trx) => {
      const buyerAgent = user.role === 'admin' ? await this.adminNamedBuyerAgent(input.buyerAgentEmail, trx) : user;
      if (input.contractorOrganisationId !== null) await this.assertContractor(input.contractorOrganisationId, trx);
      const requestId = await this.flow.openRequest(trx, mover, 'Request opened', opened, (status) => this.requests.create(
        {
          street: input.street,
          city: input.city,
          state: input.state,
          zip: input.zip,
          yearBuilt: input.yearBuilt,
          closingDate: input.closingDate,
          necEdition: input.necEdition ?? defaultNecEdition(input.state as UsState),
          status,
          contractorOrganisationId: input.contractorOrganisationId,
          createdBy: user.id,
        },
        trx,
      ));
      await this.requests.addParty(
        { requestId, role: 'buyer-agent', email: buyerAgent.email, userId: buyerAgent.id, inviteToken: null, inviteExpiresAt: null, invitedBy: user.id },
        trx,
      );
      const invitations: [PartyRole, string | null, string][] = [
        ['listing-agent', input.listingAgentEmail, 'listingAgentEmail'],
        ['seller', input.sellerEmail, 'sellerEmail'],
        ['inspector', input.inspectorEmail, 'inspectorEmail'],
      ];
      for (const [role, email, field] of invitations) {
        if (email) await this.addOrInvite(requestId, role, email, user, field, trx);
      }
      return requestId;
    });
    return this.get(user, id);
  }

  /** Adds a party: linked at once when an account with that e-mail exists, else invited by link. */
  async inviteParty(user: CurrentUser, requestId: number, input: InviteParty): Promise<RepairRequestDetail> {
    const request = await this.get(user, requestId);
    assertMayAct(moverOn(user, request).actors, 'invite-party', request.status, {
      notYours: "Only the request's agents can do this",
      notNow: 'This request is finished; nobody more can be invited',
    });
    await this.db.transaction((trx) => this.addOrInvite(requestId, input.role, input.email, user, 'email', trx));
    return this.get(user, requestId);
  }

  async assignContractor(user: CurrentUser, requestId: number, contractorOrganisationId: number): Promise<RepairRequestDetail> {
    const request = await this.get(user, requestId);
    assertMayAct(moverOn(user, request).actors, 'change-contractor', request.status, {
      notYours: "Only the request's agents can do this",
      notNow: 'A quote was sent already; the contractor cannot be changed now',
    });
    await this.assertContractor(contractorOrganisationId);
    await this.db.transaction(async (trx) => {
      // What the previous contractor set while pricing refers to its own rate book: it is cleared.
      if (await this.requests.setContractor(requestId, contractorOrganisationId, trx)) {
        await this.itemPricing.clearVisits(requestId, trx);
        await this.items.clearPricing(requestId, trx);
        const chosen = await this.organisations.findById(contractorOrganisationId, trx);
        await this.activity.record(trx, {
          requestId,
          actorUserId: user.id,
          kind: 'parties',
          action: 'contractor-changed',
          summary: request.contractor ? `Contractor changed from ${request.contractor.name} to ${chosen!.name}` : `Contractor chosen: ${chosen!.name}`,
          before: { contractor: request.contractor?.name ?? null },
          after: { contractor: chosen!.name },
        });
      }
    });
    return this.get(user, requestId);
  }

  private async addOrInvite(requestId: number, role: PartyRole, email: string, by: CurrentUser, _field: string, trx: Trx): Promise<void> {
    // An account of another role is invited by link like an unknown e-mail, so the answer does not
    // tell the inviter which accounts exist; accepting then refuses the role mismatch.
    const found = await this.users.findByEmail(email, trx);
    const existing = found && found.role === ROLE_FOR_PARTY[role] ? found : null;
    const inviteToken = existing ? null : randomBytes(24).toString('base64url');
    const added = await this.requests.addParty(
      {
        requestId,
        role,
        email,
        userId: existing?.id ?? null,
        inviteToken,
        inviteExpiresAt: existing ? null : new Date(Date.now() + INVITE_DAYS * 86_400_000),
        invitedBy: by.id,
      },
      trx,
    );
    if (!added) return;
    if (inviteToken) {
      // The invitation goes out by e-mail (the link is also shown to the agents to pass on).
      await this.notifications.notify(trx, { kind: 'invitation', requestId, actorUserId: by.id, email, role, inviteToken });
    } else if (role !== 'buyer-agent' || existing!.id !== by.id) {
      await this.activity.record(trx, {
        requestId,
        actorUserId: by.id,
        kind: 'parties',
        action: 'party-added',
        summary: `${existing!.name} added as ${PARTY_ROLE_LABELS[role].toLowerCase()}`,
        after: { role, email },
      });
    }
  }

  private async adminNamedBuyerAgent(email: string | null, trx: Trx): Promise<CurrentUser> {
    const agent = email ? await this.users.findByEmail(email, trx) : null;
    if (!agent || agent.role !== 'agent') {
      throw new ValidationError("Name the buyer's agent", [
        { path: 'buyerAgentEmail', message: "Enter the e-mail of an existing agent's account" },
      ]);
    }
    return agent;
  }

  private async assertContractor(organisationId: number, trx?: Trx): Promise<void> {
    const org = await this.organisations.findById(organisationId, trx);
    if (!org || org.kind !== 'contractor') {
      throw new ValidationError('No such contractor', [
        { path: 'contractorOrganisationId', message: 'Choose one of the listed electrical contractors' },
      ]);
    }
  }

  inviteUrl(token: string): string {
    return `${this.publicUrl}/invite/${token}`;
  }
}

export function viewerOf(user: CurrentUser) {
  return { id: user.id, role: user.role, organisationId: user.organisationId };
}
