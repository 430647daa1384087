import { pageTotal } from '../db/page-total';
import type { CurrentUser, Page, Role, User } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { UserRow } from '../db/tables';

const TABLE = 'users';

export type UserWithOrgRow = UserRow & { organisation_name: string | null };

export function toCurrentUser(row: Pick<UserWithOrgRow, 'id' | 'email' | 'name' | 'role' | 'organisation_id' | 'organisation_name'>): CurrentUser {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    organisationId: row.organisation_id,
    organisationName: row.organisation_name,
  };
}

function toUser(row: UserWithOrgRow): User {
  return { ...toCurrentUser(row), createdAt: row.created_at.toISOString(), isActive: row.is_active };
}

export interface NewUser {
  email: string;
  name: string;
  passwordHash: string;
  role: Role;
  organisationId: number | null;
}

export class UserRepository {
  constructor(private readonly db: Db) {}

  private withOrg(trx?: Trx) {
    return (trx ?? this.db)<UserWithOrgRow>(TABLE)
      .leftJoin('organisations as o', 'o.id', `${TABLE}.organisation_id`)
      .select(`${TABLE}.*`, 'o.name as organisation_name');
  }

  async findById(id: number, trx?: Trx): Promise<CurrentUser | null> {
    const row = await this.withOrg(trx).where(`${TABLE}.id`, id).first();
    return row ? toCurrentUser(row) : null;
  }

  /** The user of a session: null once the account is deactivated, which ends every session it has. */
  async findActiveById(id: number, trx?: Trx): Promise<CurrentUser | null> {
    const row = await this.withOrg(trx).where(`${TABLE}.id`, id).where(`${TABLE}.is_active`, true).first();
    return row ? toCurrentUser(row) : null;
  }

  /** The account as an administrator sees it. */
  async findUserById(id: number, trx?: Trx): Promise<User | null> {
    const row = await this.withOrg(trx).where(`${TABLE}.id`, id).first();
    return row ? toUser(row) : null;
  }

  async update(id: number, fields: { email: string; name: string; organisationId: number | null }, trx?: Trx): Promise<void> {
    await (trx ?? this.db)<UserRow>(TABLE)
      .where({ id })
      .update({ email: fields.email, name: fields.name, organisation_id: fields.organisationId, updated_at: new Date() });
  }

  async setActive(id: number, isActive: boolean, trx?: Trx): Promise<void> {
    await (trx ?? this.db)<UserRow>(TABLE).where({ id }).update({ is_active: isActive, updated_at: new Date() });
  }

  /** Signs the person out everywhere: deletes every stored session that carries their id. */
  async endSessions(id: number, trx?: Trx): Promise<void> {
    await (trx ?? this.db).raw(`DELETE FROM sessions WHERE (sess::jsonb -> 'passport' ->> 'user') = ?`, [String(id)]);
  }

  async findByEmail(email: string, trx?: Trx): Promise<CurrentUser | null> {
    const row = await this.withOrg(trx).whereRaw(`lower(${TABLE}.email) = lower(?)`, [email]).first();
    return row ? toCurrentUser(row) : null;
  }

  /** The stored hash, for the password check only; none for a deactivated account (it cannot sign in). */
  async passwordHashOf(id: number, trx?: Trx): Promise<string | null> {
    const row = await (trx ?? this.db)<UserRow>(TABLE).where({ id, is_active: true }).first('password_hash');
    return row?.password_hash ?? null;
  }

  async create(user: NewUser, trx?: Trx): Promise<CurrentUser> {
    const [row] = await (trx ?? this.db)<UserRow>(TABLE)
      .insert({
        email: user.email,
        name: user.name,
        password_hash: user.passwordHash,
        role: user.role,
        organisation_id: user.organisationId,
      })
      .returning('id');
    const created = await this.findById(row.id, trx);
    if (!created) throw new Error('user vanished after insert');
    return created;
  }

  async setPasswordHash(id: number, passwordHash: string, trx?: Trx): Promise<void> {
    await (trx ?? this.db)<UserRow>(TABLE).where({ id }).update({ password_hash: passwordHash, updated_at: new Date() });
  }

  async list(page: number, pageSize: number): Promise<Page<User>> {
    const query = this.withOrg()
      .select(this.db.raw('count(*) over() as total_count'))
      .orderBy(`${TABLE}.name`)
      .limit(pageSize)
      .offset(page * pageSize);
    const rows = await query;
    const total = await pageTotal(rows, query);
    return { items: rows.map(toUser), total, page, pageSize };
  }
}
