import type { CurrentUser, Page, Role, User } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { UserRow } from '../db/tables';

const TABLE = 'users';

type UserWithOrgRow = UserRow & { organisation_name: string | null };

function toCurrentUser(row: UserWithOrgRow): CurrentUser {
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
  return { ...toCurrentUser(row), createdAt: row.created_at.toISOString() };
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

  async findByEmail(email: string, trx?: Trx): Promise<CurrentUser | null> {
    const row = await this.withOrg(trx).whereRaw(`lower(${TABLE}.email) = lower(?)`, [email]).first();
    return row ? toCurrentUser(row) : null;
  }

  /** The stored hash, for the password check only. */
  async passwordHashOf(id: number, trx?: Trx): Promise<string | null> {
    const row = await (trx ?? this.db)<UserRow>(TABLE).where({ id }).first('password_hash');
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
    const rows = await this.withOrg()
      .select(this.db.raw('count(*) over() as total_count'))
      .orderBy(`${TABLE}.name`)
      .limit(pageSize)
      .offset(page * pageSize);
    const total = rows.length ? Number((rows[0] as unknown as { total_count: string }).total_count) : 0;
    return { items: rows.map(toUser), total, page, pageSize };
  }
}
