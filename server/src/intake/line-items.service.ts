import {
  editionNote,
  editionNoteKey,
  type LineItemList,
  findingCodeInfo,
  itemMove,
  type RepairRequestDetail,
  type ConfirmItems,
  type CreateLineItemSchema,
  type CurrentUser,
  type LineItem,
  type MergeLineItems,
  type HouseCode,
  type SplitLineItem,
  type UpdateLineItem,
} from '@cc/shared';
import type { z } from 'zod';
import type { Db, Trx } from '../db/knex';
import type { LineItemRepository, StoredLineItem } from './line-item.repository';
import type { ReportFileRepository } from './report-file.repository';
import { ConflictError, NotFoundError, ValidationError } from '../errors';
import { assertMayAct, moverOn, type FlowService, type Mover } from '../flow/flow.service';
import type { ActivityRepository } from '../activity/activity.repository';
import { recordItemChange } from '../activity/item-activity';
import { viewerOf, type RequestsService } from '../requests/requests.service';
import { JsonText } from '../http/json-text';

const STALE = 'This item was changed by someone else meanwhile. Reload to see the current version.';
const REVIEW_REFUSED = { notYours: "Only the request's agents can do this", notNow: 'The items of this request are confirmed already' };
const ITEM_REFUSED = { notYours: "Only the request's agents can do this", notNow: 'This item is past review', stale: STALE };

/** The agent's review of parsed items: edit, remove, merge, split, add, confirm. */
export class LineItemsService {
  constructor(
    private readonly db: Db,
    private readonly access: RequestsService,
    private readonly items: LineItemRepository,
    private readonly reports: ReportFileRepository,
    private readonly flow: FlowService,
    private readonly activity: ActivityRepository,
  ) {}

  /** The item with its note on the code in force when the house was built and the adopted edition. */
  withNote(item: StoredLineItem, house: HouseCode): LineItem {
    return { ...item, editionNote: editionNote(item.code, item.room, house) };
  }

  /**
   * The request's items as the item list sends them (LineItemList: each distinct edition note once),
   * as JSON text: the items come written by PostgreSQL with the access check in the same statement,
   * and each gets the key of its note (made here, once per code and room).
   */
  async list(user: CurrentUser, requestId: number): Promise<JsonText<LineItemList>> {
    const found = await this.items.listVisibleAsJson(viewerOf(user), requestId);
    if (!found) throw new NotFoundError('No such repair request');
    const notes = new Map<string, LineItem['editionNote']>();
    const items = found.items.map(({ json, code, room }) => {
      const key = editionNoteKey({ code: code as LineItem['code'], room: room as LineItem['room'] });
      let note = notes.get(key);
      if (note === undefined) {
        note = editionNote(code, room, found.house);
        notes.set(key, note);
      }
      // The item's JSON object with one more member: the key of its note (null without one).
      return `${json.slice(0, -1)},"editionNoteKey":${note === null ? 'null' : JSON.stringify(key)}}`;
    });
    const editionNotes = Object.fromEntries([...notes].filter((entry): entry is [string, NonNullable<LineItem['editionNote']>] => entry[1] !== null));
    return new JsonText(`{"items":[${items.join(',')}],"editionNotes":${JSON.stringify(editionNotes)}}`);
  }

  /** The request's items, each with its note; the note of one code and room is made once. */
  private async listItems(user: CurrentUser, requestId: number): Promise<LineItem[]> {
    const house = await this.access.house(user, requestId);
    const notes = new Map<string, LineItem['editionNote']>();
    return (await this.items.listForRequest(requestId)).map((item) => {
      const key = editionNoteKey(item);
      let note = notes.get(key);
      if (note === undefined) {
        note = editionNote(item.code, item.room, house);
        notes.set(key, note);
      }
      return { ...item, editionNote: note };
    });
  }

  /** 404 unless visible, 403 unless one of its agents (or admin), 409 once intake is over. */
  private async assertReviewer(user: CurrentUser, requestId: number): Promise<{ request: RepairRequestDetail; mover: Mover }> {
    const request = await this.access.get(user, requestId);
    const mover = moverOn(user, request);
    assertMayAct(mover.actors, 'review-items', request.status, REVIEW_REFUSED);
    return { request, mover };
  }

  /** The item, if the review may still change it: as long as it may still be removed. */
  private async reviewable(requestId: number, id: number, trx?: Trx): Promise<StoredLineItem> {
    const item = await this.items.findInRequest(requestId, id, trx);
    if (!item) throw new NotFoundError('No such item');
    if (!itemMove('remove', item.status)) throw new ConflictError(ITEM_REFUSED.notNow);
    return item;
  }

  private async reload(requestId: number, id: number, house: HouseCode): Promise<LineItem> {
    const item = await this.items.findInRequest(requestId, id);
    if (!item) throw new NotFoundError('No such item');
    return this.withNote(item, house);
  }

  async update(user: CurrentUser, requestId: number, id: number, input: UpdateLineItem): Promise<LineItem> {
    const { request } = await this.assertReviewer(user, requestId);
    const { version, ...changes } = input;
    await this.db.transaction(async (trx) => {
      const before = await this.reviewable(requestId, id, trx);
      if (!(await this.items.update(id, version, { ...changes, isEdited: true }, trx))) throw new ConflictError(STALE);
      await recordItemChange(this.activity, trx, user.id, 'item-edited', before, { ...before, ...changes });
    });
    return this.reload(requestId, id, request);
  }

  async remove(user: CurrentUser, requestId: number, id: number, version: number): Promise<void> {
    const { mover } = await this.assertReviewer(user, requestId);
    await this.db.transaction(async (trx) => {
      const item = await this.reviewable(requestId, id, trx);
      await this.flow.moveItem(trx, { ...item, version }, 'remove', mover, ITEM_REFUSED, { isEdited: true });
    });
  }

  /** The first item absorbs the second: quantities add up (unknown if either is), places are joined. */
  async merge(user: CurrentUser, requestId: number, input: MergeLineItems): Promise<LineItem> {
    const { request, mover } = await this.assertReviewer(user, requestId);
    const [keepRef, dropRef] = input.items;
    await this.db.transaction(async (trx) => {
      const keep = await this.reviewable(requestId, keepRef.id, trx);
      const drop = await this.reviewable(requestId, dropRef.id, trx);
      const quantity = keep.quantity !== null && drop.quantity !== null ? keep.quantity + drop.quantity : null;
      const location = [keep.location, drop.location].filter((l, i, all) => l && all.indexOf(l) === i).join('; ');
      const necRefs = [...new Set([...keep.necRefs, ...drop.necRefs])];
      if (!(await this.items.update(keep.id, keepRef.version, { quantity, location, necRefs, isEdited: true }, trx))) throw new ConflictError(STALE);
      await recordItemChange(this.activity, trx, user.id, 'items-merged', keep, { ...keep, quantity, location }, `Merged item #${drop.id} into this one`);
      await this.flow.moveItem(trx, { ...drop, version: dropRef.version }, 'remove', mover, ITEM_REFUSED, { isEdited: true });
    });
    return this.reload(requestId, keepRef.id, request);
  }

  /** One item becomes several with the given quantities (which must add up to a known quantity). */
  async split(user: CurrentUser, requestId: number, id: number, input: SplitLineItem): Promise<LineItem[]> {
    const { request } = await this.assertReviewer(user, requestId);
    const ids = await this.db.transaction(async (trx) => {
      const item = await this.reviewable(requestId, id, trx);
      const sum = input.quantities.reduce((a, b) => a + b, 0);
      if (item.quantity !== null && sum !== item.quantity) {
        throw new ValidationError('The parts must add up to the quantity', [
          { path: 'quantities', message: `The parts add up to ${sum}, but the item has ${item.quantity}` },
        ]);
      }
      const [first, ...rest] = input.quantities;
      if (!(await this.items.update(id, input.version, { quantity: first, isEdited: true }, trx))) throw new ConflictError(STALE);
      const { id: _id, version: _v, ...copy } = item;
      const added = await this.items.insert(rest.map((quantity) => ({ ...copy, quantity, isEdited: true })), trx);
      await recordItemChange(this.activity, trx, user.id, 'item-split', item, { ...item, quantity: first }, `Split into ${input.quantities.length} items (${input.quantities.join(' + ')})`);
      return [id, ...added];
    });
    return Promise.all(ids.map((i) => this.reload(requestId, i, request)));
  }

  /** A person adds an item the reader missed, optionally from text selected in a report. */
  async add(user: CurrentUser, requestId: number, input: z.output<typeof CreateLineItemSchema>): Promise<LineItem> {
    const { request, mover } = await this.assertReviewer(user, requestId);
    let evidence: string | null = null;
    let page: number | null = null;
    if (input.reportFileId !== null) {
      const report = await this.reports.text(requestId, input.reportFileId);
      if (!report) throw new ValidationError('No such report on this request', [{ path: 'reportFileId', message: 'Choose a report of this request' }]);
      if (input.evidenceStart !== null && input.evidenceEnd !== null) {
        const joined = report.pages.join('\f');
        if (input.evidenceEnd > joined.length) {
          throw new ValidationError('The selection is outside the report', [{ path: 'evidenceEnd', message: 'Select text inside the report' }]);
        }
        evidence = joined.slice(input.evidenceStart, input.evidenceEnd);
        page = joined.slice(0, input.evidenceStart).split('\f').length;
      }
    }
    const info = findingCodeInfo(input.code);
    const [id] = await this.db.transaction((trx) =>
      this.flow.createItems(
        trx,
        'propose',
        mover,
        [
          {
            requestId,
            code: input.code,
            room: input.room,
            location: input.location,
            quantity: input.quantity,
            evidence,
            page,
            severity: input.severity ?? info.severity,
            necRefs: [...info.necRefs],
            isEdited: true,
            reportFileId: input.reportFileId,
            evidenceStart: input.evidenceStart,
            evidenceEnd: input.evidenceEnd,
          },
        ],
        REVIEW_REFUSED,
      ),
    );
    return this.reload(requestId, id, request);
  }

  /**
   * Confirms the review: every proposed item (each at the version the agent saw) becomes a line item
   * of the request, and the request moves on to pricing.
   */
  async confirm(user: CurrentUser, requestId: number, input: ConfirmItems): Promise<LineItem[]> {
    const { mover } = await this.assertReviewer(user, requestId);
    await this.db.transaction(async (trx) => {
      const current = (await this.items.listForRequest(requestId, trx)).filter((i) => itemMove('confirm', i.status));
      const seen = new Map(input.items.map((i) => [i.id, i.version]));
      const unseen = current.filter((i) => seen.get(i.id) !== i.version);
      if (unseen.length || current.length !== seen.size) {
        throw new ConflictError('The list of items changed since you loaded it. Reload and review again.');
      }
      await this.flow.moveRequest(trx, requestId, 'confirm-items', mover, `${current.length} ${current.length === 1 ? 'item' : 'items'} confirmed`, REVIEW_REFUSED);
      for (const item of current) await this.flow.moveItem(trx, item, 'confirm', mover, ITEM_REFUSED);
    });
    return this.listItems(user, requestId);
  }
}
