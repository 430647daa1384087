import { requestReference, ROLE_FOR_PARTY, type AcceptInvitation, type CurrentUser, type Invitation } from '@cc/shared';
import type { Db } from '../db/knex';
import { inTransaction } from '../db/transaction';
import type { RequestRepository } from '../requests/request.repository';
import type { UserRepository } from '../auth/user.repository';
import { ConflictError, ForbiddenError, NotFoundError } from '../errors';
import type { Passwords } from '../auth/passwords';

const ACCEPTED_ALREADY = 'This invitation was accepted already. Sign in to open the request.';

export class InvitationsService {
  constructor(
    private readonly db: Db,
    private readonly requests: RequestRepository,
    private readonly users: UserRepository,
    private readonly passwords: Passwords,
  ) {}

  private async openInvitation(token: string) {
    const party = await this.requests.findInvitation(token);
    if (!party || !party.invite_expires_at || party.invite_expires_at.getTime() < Date.now()) {
      throw new NotFoundError('This invitation link is not valid any more. Ask the agent for a new one.');
    }
    if (party.user_id !== null) throw new ConflictError(ACCEPTED_ALREADY);
    return party;
  }

  async lookup(token: string): Promise<Invitation> {
    const party = await this.openInvitation(token);
    const request = await this.db('repair_requests').where({ id: party.request_id }).first('street', 'city', 'state', 'zip');
    return {
      email: party.email,
      role: party.role,
      requestReference: requestReference(party.request_id),
      propertyAddress: `${request.street}, ${request.city}, ${request.state} ${request.zip}`,
      invitedByName: party.inviter_name ?? 'An agent',
      hasAccount: (await this.users.findByEmail(party.email)) !== null,
    };
  }

  /**
   * Accepts the invitation: the signed-in user whose e-mail it names joins the request, or a new
   * account is made for that e-mail. Returns the user to sign in, and the request id.
   *
   * The account must have the role the part needs (a seller's account cannot become a listing
   * agent). The invitation's row is locked first, so simultaneous accepts queue: the first one
   * joins, the others are told it was accepted already.
   */
  async accept(token: string, signedIn: CurrentUser | undefined, input: AcceptInvitation | null): Promise<{ user: CurrentUser; requestId: number }> {
    const open = await this.openInvitation(token);
    return inTransaction(this.db, async (trx) => {
      const party = await trx('request_parties').where({ id: open.id }).forUpdate().first('id', 'user_id', 'invite_token', 'email', 'role', 'request_id');
      if (!party || party.user_id !== null || party.invite_token !== token) {
        throw new ConflictError(ACCEPTED_ALREADY);
      }
      const neededRole = ROLE_FOR_PARTY[party.role as keyof typeof ROLE_FOR_PARTY];
      let user = await this.users.findByEmail(party.email, trx);
      if (user) {
        if (!signedIn || signedIn.id !== user.id) {
          throw new ConflictError('An account with this e-mail exists: sign in with it, then open the link again.');
        }
        if (user.role !== neededRole) {
          // Said only to the signed-in owner of the invited e-mail, about their own account.
          throw new ForbiddenError(`This invitation is for ${neededRole === 'agent' ? 'an agent' : `a ${neededRole}`}; your account cannot take this part. Ask the agent to invite you with another e-mail.`);
        }
      } else {
        if (!input) throw new ConflictError('Choose your name and a password to make your account.');
        user = await this.users.create(
          { email: party.email, name: input.name, role: neededRole, organisationId: null, passwordHash: await this.passwords.hash(input.password) },
          trx,
        );
      }
      await this.requests.acceptInvitation(party.id, user.id, trx);
      return { user, requestId: party.request_id };
    });
  }
}
