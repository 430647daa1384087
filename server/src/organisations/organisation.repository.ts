import type { CreateOrganisation, Organisation, OrganisationKind, Page } from '@cc/shared';
import type { Db, Trx } from '../db/knex';
import type { OrganisationRow } from '../db/tables';

const TABLE = 'organisations';

export function toOrganisation(row: OrganisationRow): Organisation {
  return {
    id: row.id,
    name: row.name,
    kind: row.kind,
    phone: row.phone,
    address: row.address,
    licenceNumber: row.licence_number,
    licenceState: row.licence_state,
    licenceClass: row.licence_class,
  };
}

export class OrganisationRepository {
  constructor(private readonly db: Db) {}

  async findById(id: number, trx?: Trx): Promise<Organisation | null> {
    const row = await (trx ?? this.db)<OrganisationRow>(TABLE).where({ id }).first();
    return row ? toOrganisation(row) : null;
  }

  async create(org: CreateOrganisation, trx?: Trx): Promise<Organisation> {
    const [row] = await (trx ?? this.db)<OrganisationRow>(TABLE)
      .insert({
        name: org.name,
        kind: org.kind,
        phone: org.phone,
        address: org.address,
        licence_number: org.licenceNumber,
        licence_state: org.licenceState,
        licence_class: org.licenceClass,
      })
      .returning('*');
    return toOrganisation(row);
  }

  async listByKind(kind: OrganisationKind): Promise<Organisation[]> {
    const rows = await this.db<OrganisationRow>(TABLE).where({ kind }).orderBy('name');
    return rows.map(toOrganisation);
  }

  async list(page: number, pageSize: number): Promise<Page<Organisation>> {
    const rows = await this.db<OrganisationRow & { total_count: string }>(TABLE)
      .select('*', this.db.raw('count(*) over() as total_count'))
      .orderBy([{ column: 'kind' }, { column: 'name' }])
      .limit(pageSize)
      .offset(page * pageSize);
    return { items: rows.map(toOrganisation), total: rows.length ? Number(rows[0].total_count) : 0, page, pageSize };
  }
}
