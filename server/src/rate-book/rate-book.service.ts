import {
  RateBookEntryContentSchema,
  type ContractorRateBook,
  type CreateRateBookEntry,
  type CreateSiteAdder,
  type CurrentUser,
  type Page,
  type RateBook,
  type RateBookChange,
  type RateBookEntryRecord,
  type RateBookEntryVersion,
  type RateBookImportResult,
  type RateBookTermsRecord,
  type SiteAdderRecord,
  type UpdateRateBookEntry,
  type UpdateSiteAdder,
  type VisitTermsSchema,
} from '@cc/shared';
import type { z } from 'zod';
import type { Db, Trx } from '../db/knex';
import type { OrganisationRepository } from '../organisations/organisation.repository';
import type { RateBookRepository } from './rate-book.repository';
import { toEngineRateBook } from './engine-rate-book';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../errors';
import { canonicalContent, entriesToCsv, parseEntriesCsv } from './rate-book-csv';

const STALE = 'This was changed by someone else meanwhile. Reload to see the current version.';

/** A key made from a name: lower-case words joined by hyphens, made unique among `taken`. */
export function keyFromName(name: string, taken: ReadonlySet<string>): string {
  const base = name.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 50).replace(/-+$/, '') || 'entry';
  let key = base;
  for (let n = 2; taken.has(key); n++) key = `${base}-${n}`;
  return key;
}

/** A rate book with its records, loaded for pricing. */
export interface LoadedRateBook {
  book: RateBook;
  entries: RateBookEntryRecord[];
  adders: SiteAdderRecord[];
}

/** The contractor's rate book: terms, entries (versioned), site adders, CSV, and the change log. */
export class RateBookService {
  constructor(
    private readonly db: Db,
    private readonly rateBooks: RateBookRepository,
    private readonly organisations: OrganisationRepository,
  ) {}

  /** The organisation whose rate book `user` keeps: any user of a contractor organisation. */
  private organisationOf(user: CurrentUser): number {
    if (user.role !== 'contractor' || user.organisationId === null) throw new ForbiddenError('Only a contractor keeps a rate book');
    return user.organisationId;
  }

  /** The rate book of `organisationId` as the pricing engine takes it; null without terms. */
  async load(organisationId: number, trx?: Trx): Promise<LoadedRateBook | null> {
    // One query at a time: a transaction is one connection.
    const org = await this.organisations.findById(organisationId, trx);
    const terms = await this.rateBooks.findTerms(organisationId, trx);
    if (!org || !terms) return null;
    const entries = await this.rateBooks.listEntries(organisationId, trx);
    const adders = await this.rateBooks.listAdders(organisationId, trx);
    return { book: toEngineRateBook(org.name, terms.terms, entries, adders), entries, adders };
  }

  async get(user: CurrentUser): Promise<ContractorRateBook> {
    const organisationId = this.organisationOf(user);
    const [org, terms, entries, adders] = await Promise.all([
      this.organisations.findById(organisationId),
      this.rateBooks.findTerms(organisationId),
      this.rateBooks.listEntries(organisationId),
      this.rateBooks.listAdders(organisationId),
    ]);
    return { organisationId, contractorName: org?.name ?? '', terms, entries, adders };
  }

  async getTerms(user: CurrentUser): Promise<RateBookTermsRecord> {
    const terms = await this.rateBooks.findTerms(this.organisationOf(user));
    if (!terms) throw new NotFoundError('This rate book has no terms yet');
    return terms;
  }

  /** Starts the rate book (version 0) or changes its terms (the version they were read at). */
  async saveTerms(user: CurrentUser, version: number, terms: z.output<typeof VisitTermsSchema>): Promise<RateBookTermsRecord> {
    const organisationId = this.organisationOf(user);
    await this.db.transaction(async (trx) => {
      const before = await this.rateBooks.findTerms(organisationId, trx);
      if (version === 0) {
        if (before) throw new ConflictError('This rate book has terms already. Reload to see them.');
        await this.rateBooks.insertTerms(organisationId, terms, trx);
      } else if (!before || !(await this.rateBooks.updateTerms(organisationId, version, terms, trx))) {
        throw new ConflictError(STALE);
      }
      const after = await this.rateBooks.findTerms(organisationId, trx);
      await this.rateBooks.recordChange(
        { organisationId, changedBy: user.id, subject: 'terms', subjectId: null, action: before ? 'update' : 'create', before: before?.terms ?? null, after: after?.terms ?? null },
        trx,
      );
    });
    return this.getTerms(user);
  }

  async listEntries(user: CurrentUser): Promise<RateBookEntryRecord[]> {
    return this.rateBooks.listEntries(this.organisationOf(user));
  }

  async getEntry(user: CurrentUser, id: number): Promise<RateBookEntryRecord & { versions: RateBookEntryVersion[] }> {
    const entry = await this.rateBooks.findEntry(this.organisationOf(user), id);
    if (!entry) throw new NotFoundError('No such entry');
    return { ...entry, versions: await this.rateBooks.entryVersions(id) };
  }

  private async entryOrThrow(organisationId: number, id: number, trx: Trx): Promise<RateBookEntryRecord> {
    const entry = await this.rateBooks.findEntry(organisationId, id, trx);
    if (!entry) throw new NotFoundError('No such entry');
    return entry;
  }

  private async assertFreeKey(table: 'rate_book_entries' | 'rate_book_adders', organisationId: number, key: string | undefined, name: string, trx: Trx): Promise<string> {
    const taken = await this.rateBooks.liveKeys(table, organisationId, trx);
    if (key === undefined) return keyFromName(name, taken);
    if (taken.has(key)) throw new ValidationError('That key is taken', [{ path: 'key', message: `The key "${key}" is used by another ${table === 'rate_book_entries' ? 'entry' : 'condition'}` }]);
    return key;
  }

  async createEntry(user: CurrentUser, input: CreateRateBookEntry): Promise<RateBookEntryRecord> {
    const organisationId = this.organisationOf(user);
    const { key: wanted, ...content } = input;
    const id = await this.db.transaction(async (trx) => {
      const key = await this.assertFreeKey('rate_book_entries', organisationId, wanted, content.name, trx);
      const entryId = await this.rateBooks.createEntry(organisationId, key, content, user.id, trx);
      const after = await this.entryOrThrow(organisationId, entryId, trx);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'entry', subjectId: entryId, action: 'create', before: null, after }, trx);
      return entryId;
    });
    return (await this.rateBooks.findEntry(organisationId, id)) as RateBookEntryRecord;
  }

  /**
   * A change makes a new version of the entry; earlier versions stay as they were, so a quote sent
   * with one keeps its figures. Items priced with the entry take the new version from now on.
   */
  async updateEntry(user: CurrentUser, id: number, input: UpdateRateBookEntry): Promise<RateBookEntryRecord> {
    const organisationId = this.organisationOf(user);
    await this.db.transaction(async (trx) => {
      const before = await this.entryOrThrow(organisationId, id, trx);
      if (before.version !== input.version) throw new ConflictError(STALE);
      const content = RateBookEntryContentSchema.parse({
        code: input.code !== undefined ? input.code : before.code,
        name: input.name ?? before.name,
        unit: input.unit ?? before.unit,
        pricing: input.pricing ?? before.pricing,
      });
      if (canonicalContent(content) === canonicalContent(before)) return;
      if (!(await this.rateBooks.addEntryVersion(id, input.version, content, user.id, trx))) throw new ConflictError(STALE);
      const after = await this.entryOrThrow(organisationId, id, trx);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'entry', subjectId: id, action: 'update', before, after }, trx);
    });
    return (await this.rateBooks.findEntry(organisationId, id)) as RateBookEntryRecord;
  }

  /** Takes the entry out of the rate book; sent quotes keep the version they were priced with. */
  async deleteEntry(user: CurrentUser, id: number, version: number): Promise<void> {
    const organisationId = this.organisationOf(user);
    await this.db.transaction(async (trx) => {
      const before = await this.entryOrThrow(organisationId, id, trx);
      if (!(await this.rateBooks.deleteEntry(id, version, trx))) throw new ConflictError(STALE);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'entry', subjectId: id, action: 'delete', before, after: null }, trx);
    });
  }

  async listAdders(user: CurrentUser): Promise<SiteAdderRecord[]> {
    return this.rateBooks.listAdders(this.organisationOf(user));
  }

  private async adderOrThrow(organisationId: number, id: number, trx: Trx): Promise<SiteAdderRecord> {
    const adder = await this.rateBooks.findAdder(organisationId, id, trx);
    if (!adder) throw new NotFoundError('No such site condition');
    return adder;
  }

  async createAdder(user: CurrentUser, input: CreateSiteAdder): Promise<SiteAdderRecord> {
    const organisationId = this.organisationOf(user);
    const { key: wanted, ...adder } = input;
    const id = await this.db.transaction(async (trx) => {
      const key = await this.assertFreeKey('rate_book_adders', organisationId, wanted, adder.name, trx);
      const adderId = await this.rateBooks.createAdder(organisationId, key, adder, trx);
      const after = await this.adderOrThrow(organisationId, adderId, trx);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'adder', subjectId: adderId, action: 'create', before: null, after }, trx);
      return adderId;
    });
    return (await this.rateBooks.findAdder(organisationId, id)) as SiteAdderRecord;
  }

  /** Site conditions are not versioned: a sent quote keeps its own copy of the ones it used. */
  async updateAdder(user: CurrentUser, id: number, input: UpdateSiteAdder): Promise<SiteAdderRecord> {
    const organisationId = this.organisationOf(user);
    await this.db.transaction(async (trx) => {
      const before = await this.adderOrThrow(organisationId, id, trx);
      const changed = {
        name: input.name ?? before.name,
        effect: input.effect ?? before.effect,
        appliesWhenBuiltBefore: input.appliesWhenBuiltBefore !== undefined ? input.appliesWhenBuiltBefore : before.appliesWhenBuiltBefore,
      };
      if (!(await this.rateBooks.updateAdder(id, input.version, changed, trx))) throw new ConflictError(STALE);
      const after = await this.adderOrThrow(organisationId, id, trx);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'adder', subjectId: id, action: 'update', before, after }, trx);
    });
    return (await this.rateBooks.findAdder(organisationId, id)) as SiteAdderRecord;
  }

  async deleteAdder(user: CurrentUser, id: number, version: number): Promise<void> {
    const organisationId = this.organisationOf(user);
    await this.db.transaction(async (trx) => {
      const before = await this.adderOrThrow(organisationId, id, trx);
      if (!(await this.rateBooks.deleteAdder(id, version, trx))) throw new ConflictError(STALE);
      await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'adder', subjectId: id, action: 'delete', before, after: null }, trx);
    });
  }

  async changes(user: CurrentUser, page: number, pageSize: number): Promise<Page<RateBookChange>> {
    return this.rateBooks.listChanges(this.organisationOf(user), page, pageSize);
  }

  async exportCsv(user: CurrentUser): Promise<string> {
    return entriesToCsv(await this.rateBooks.listEntries(this.organisationOf(user)));
  }

  /**
   * Imports entries from CSV, all or nothing: rows match live entries by key; a changed row makes
   * a new version, a new key a new entry; entries missing from the file stay as they are.
   */
  async importCsv(user: CurrentUser, text: string): Promise<RateBookImportResult> {
    const organisationId = this.organisationOf(user);
    const parsed = parseEntriesCsv(text);
    if (!parsed.ok) throw new ValidationError('Some rows of the file need attention; nothing was imported', parsed.details);
    return this.db.transaction(async (trx) => {
      const current = new Map((await this.rateBooks.listEntries(organisationId, trx)).map((e) => [e.key, e]));
      const result: RateBookImportResult = { created: 0, updated: 0, unchanged: 0 };
      for (const { key, ...content } of parsed.entries) {
        const before = current.get(key);
        if (before && canonicalContent(before) === canonicalContent(content)) {
          result.unchanged++;
          continue;
        }
        let entryId: number;
        if (before) {
          if (!(await this.rateBooks.addEntryVersion(before.id, before.version, content, user.id, trx))) throw new ConflictError(STALE);
          entryId = before.id;
          result.updated++;
        } else {
          entryId = await this.rateBooks.createEntry(organisationId, key, content, user.id, trx);
          result.created++;
        }
        const after = await this.entryOrThrow(organisationId, entryId, trx);
        await this.rateBooks.recordChange({ organisationId, changedBy: user.id, subject: 'entry', subjectId: entryId, action: 'import', before: before ?? null, after }, trx);
      }
      return result;
    });
  }
}
