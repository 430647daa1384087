import { editionNote, itemsWithNotes, LineItemListSchema, toLineItemList } from '@cc/shared';
import { LineItemRepository } from '../../server/src/intake/line-item.repository';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { createUser, resetDatabase, signIn, validRequestBody, type SignedIn } from '../helpers/fixtures';

// Written for this test: three defects in three rooms, in an inspector's plain style.
const REPORT = [
  'ELECTRICAL',
  'The garage receptacles are not GFCI protected.',
  'Open ground at three receptacles in the living room.',
  'A double tapped breaker was observed in the main panel.',
].join('\n');

let t: TestApp;
let agent: SignedIn;
let inspector: SignedIn;
let seller: SignedIn;
let outsider: SignedIn;

beforeAll(async () => {
  t = createTestApp({ STORAGE_DIR: '/tmp/cc-items-api-files' });
  await resetDatabase(t.db);
  [agent, inspector, seller, outsider] = await Promise.all(
    [await createUser(t.db, 'agent'), await createUser(t.db, 'inspector'), await createUser(t.db, 'seller'), await createUser(t.db, 'agent')].map((u) => signIn(t.app, u)),
  );
});
afterAll(() => t.close());

interface Item { id: number; code: string; room: string; quantity: number | null; version: number; status: string; location: string; evidence: string | null; page: number | null }

async function requestWithItems(): Promise<{ id: number; items: Item[]; reportId: number }> {
  const created = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody({ inspectorEmail: inspector.user.email, sellerEmail: seller.user.email }));
  const id = created.body.id;
  const up = await agent.agent.post(`/api/requests/${id}/reports/paste`).set('x-csrf-token', agent.csrfToken).send({ text: `${REPORT}\n(${id})` });
  expect(up.status).toBe(201);
  const items = await listed(id);
  return { id, items, reportId: up.body.report.id };
}
const find = (items: Item[], code: string) => items.find((i) => i.code === code)!;
/** The request's items with their edition notes in place (the answer sends each note once, by key). */
const listed = async (id: number) => itemsWithNotes(LineItemListSchema.parse((await agent.agent.get(`/api/requests/${id}/items`).expect(200)).body));

describe('GET /api/requests/:id/items', () => {
  it('lists the proposals with labels for codes and edition notes where they apply', async () => {
    const { id, items } = await requestWithItems();
    expect(items.map((i) => i.code).sort()).toEqual(['double-tap', 'gfci-missing', 'open-ground']);
    expect(find(items, 'open-ground')).toMatchObject({ room: 'living-area', quantity: 3 });
    const gfci = (await listed(id)).find((i) => i.code === 'gfci-missing')!;
    // NFPA 70 (NEC) 2005, 210.8(A) lists garages, so the adopted edition asks for GFCI there; the
    // first year, 1978 (from memory), is the year this house was built, so it could go either way.
    expect(gfci.editionNote).toMatchObject({ requiredByAdoptedEdition: true, firstRequired: 1978, builtUnder: 'came-in-that-year' });
    expect(gfci.editionNote!.requiredSince).toBeLessThanOrEqual(2017);
    expect(gfci.editionNote!.text).toContain('authority having jurisdiction');
    await seller.agent.get(`/api/requests/${id}/items`).expect(200);
    await outsider.agent.get(`/api/requests/${id}/items`).expect(404);
  });

  it('sends each edition note once, however many items share it', async () => {
    const { id } = await requestWithItems();
    for (const location of ['left bay', 'right bay']) {
      await agent.agent.post(`/api/requests/${id}/items`).set('x-csrf-token', agent.csrfToken).send({ code: 'gfci-missing', room: 'garage', location, quantity: 1 }).expect(201);
    }
    const res = await agent.agent.get(`/api/requests/${id}/items`).expect(200);
    const list = LineItemListSchema.parse(res.body);
    const garage = list.items.filter((i) => i.code === 'gfci-missing' && i.room === 'garage');
    expect(garage).toHaveLength(3);
    expect(new Set(garage.map((i) => i.editionNoteKey))).toEqual(new Set(['gfci-missing/garage']));
    expect(Object.keys(list.editionNotes).sort()).toEqual(['gfci-missing/garage']);
    expect(list.items.find((i) => i.code === 'double-tap')!.editionNoteKey).toBeNull();
    expect(res.body.items.every((i: object) => !('editionNote' in i))).toBe(true);
    const noteText = list.editionNotes['gfci-missing/garage'].text;
    expect(res.text.split(JSON.stringify(noteText)).length - 1).toBe(1);
  });

  // PostgreSQL writes each item's JSON (LineItemRepository.listVisibleAsJson): the answer must be
  // exactly what the items read as rows and turned into LineItems would make, in the shared schema.
  it('answers exactly the items the repository reads, with their notes, in the shared schema', async () => {
    const { id, items } = await requestWithItems();
    // Every kind of value: an added item with no report position, a location, an edited quantity.
    await agent.agent.post(`/api/requests/${id}/items`).set('x-csrf-token', agent.csrfToken).send({ code: 'gfci-missing', room: 'kitchen', location: 'island', quantity: 2 }).expect(201);
    const edited = find(items, 'open-ground');
    await agent.agent.patch(`/api/requests/${id}/items/${edited.id}`).set('x-csrf-token', agent.csrfToken).send({ version: edited.version, quantity: 4, location: 'hall "west" wall' }).expect(200);
    const res = await agent.agent.get(`/api/requests/${id}/items`).expect(200);
    expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
    const house = await t.db('repair_requests').where({ id }).first('year_built', 'nec_edition');
    const rows = await new LineItemRepository(t.db).listForRequest(id);
    const expected = toLineItemList(rows.map((item) => ({ ...item, editionNote: editionNote(item.code, item.room, { yearBuilt: house.year_built, necEdition: house.nec_edition }) })));
    expect(res.body).toEqual(expected);
    expect(LineItemListSchema.strict().parse(res.body).items).toHaveLength(4);
    expect(res.body.items.map((i: { location: string }) => i.location)).toContain('hall "west" wall');
  });

  it('answers an empty list for a request without items, and 404 to an outsider or for no such request', async () => {
    const created = await agent.agent.post('/api/requests').set('x-csrf-token', agent.csrfToken).send(validRequestBody()).expect(201);
    const res = await agent.agent.get(`/api/requests/${created.body.id}/items`).expect(200);
    expect(res.body).toEqual({ items: [], editionNotes: {} });
    await outsider.agent.get(`/api/requests/${created.body.id}/items`).expect(404);
    await agent.agent.get('/api/requests/2147483000/items').expect(404);
  });
});

describe('PATCH /api/requests/:id/items/:itemId', () => {
  it('edits, marks the item edited, and bumps its version', async () => {
    const { id, items } = await requestWithItems();
    const item = find(items, 'gfci-missing');
    const res = await agent.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, quantity: 2, location: 'garage, both walls' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ quantity: 2, location: 'garage, both walls', isEdited: true, version: item.version + 1 });
  });

  it('responds 409 to a stale version and keeps the first writer’s change', async () => {
    const { id, items } = await requestWithItems();
    const item = find(items, 'double-tap');
    await agent.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, location: 'first writer' }).expect(200);
    const second = await agent.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, location: 'second writer' });
    expect(second.status).toBe(409);
    expect(second.body.error).toMatch(/changed by someone else/);
    const now = (await listed(id)).find((i) => i.id === item.id)!;
    expect(now.location).toBe('first writer');
  });

  it('responds 400 for bad fields, 403 to the inspector and seller, 404 to an outsider or another request’s item', async () => {
    const { id, items } = await requestWithItems();
    const other = await requestWithItems();
    const item = items[0];
    const bad = await agent.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, code: 'loose-wire', quantity: 0 });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((d: { path: string }) => d.path).sort()).toEqual(['code', 'quantity']);
    await inspector.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', inspector.csrfToken).send({ version: item.version, quantity: 1 }).expect(403);
    await seller.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', seller.csrfToken).send({ version: item.version, quantity: 1 }).expect(403);
    await outsider.agent.patch(`/api/requests/${id}/items/${item.id}`).set('x-csrf-token', outsider.csrfToken).send({ version: item.version, quantity: 1 }).expect(404);
    await agent.agent.patch(`/api/requests/${id}/items/${other.items[0].id}`).set('x-csrf-token', agent.csrfToken).send({ version: 1, quantity: 1 }).expect(404);
  });
});

describe('merge, split, add, remove', () => {
  it('merges two items into the first, adding quantities', async () => {
    const { id, items } = await requestWithItems();
    const a = find(items, 'open-ground');
    const added = (await agent.agent.post(`/api/requests/${id}/items`).set('x-csrf-token', agent.csrfToken).send({ code: 'open-ground', room: 'bedroom', location: 'front bedroom', quantity: 2 })).body;
    const res = await agent.agent.post(`/api/requests/${id}/items/merge`).set('x-csrf-token', agent.csrfToken).send({ items: [{ id: a.id, version: a.version }, { id: added.id, version: added.version }] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: a.id, quantity: 5 });
    const after = await listed(id);
    expect(after.some((i: Item) => i.id === added.id)).toBe(false);
  });

  it('splits an item whose parts add up, and refuses parts that do not', async () => {
    const { id, items } = await requestWithItems();
    const item = find(items, 'open-ground');
    const wrong = await agent.agent.post(`/api/requests/${id}/items/${item.id}/split`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, quantities: [1, 1] });
    expect(wrong.status).toBe(400);
    expect(wrong.body.details[0].path).toBe('quantities');
    const res = await agent.agent.post(`/api/requests/${id}/items/${item.id}/split`).set('x-csrf-token', agent.csrfToken).send({ version: item.version, quantities: [2, 1] });
    expect(res.status).toBe(200);
    expect(res.body.map((i: Item) => i.quantity)).toEqual([2, 1]);
    expect(res.body[1]).toMatchObject({ code: 'open-ground', evidence: item.evidence });
  });

  it('adds an item from selected report text, with its evidence and page', async () => {
    const { id, reportId } = await requestWithItems();
    const report = (await agent.agent.get(`/api/requests/${id}/reports`)).body[0];
    const text: string = (await agent.agent.get(`/api/requests/${id}/reports/${report.id}/text`).expect(200)).body.pages.join('\f');
    const start = text.indexOf('double tapped');
    const res = await agent.agent
      .post(`/api/requests/${id}/items`)
      .set('x-csrf-token', agent.csrfToken)
      .send({ code: 'panel-deficiency', room: 'panel', reportFileId: reportId, evidenceStart: start, evidenceEnd: start + 13 });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ evidence: 'double tapped', page: 1, status: 'proposed', isEdited: true, severity: 'repair' });
    const outside = await agent.agent.post(`/api/requests/${id}/items`).set('x-csrf-token', agent.csrfToken).send({ code: 'panel-deficiency', room: 'panel', reportFileId: reportId, evidenceStart: 0, evidenceEnd: 999_999 });
    expect(outside.status).toBe(400);
    expect(outside.body.details[0].path).toBe('evidenceEnd');
  });
});

describe('POST /api/requests/:id/items/confirm', () => {
  it('turns every proposal into an open line item and moves the request to pricing', async () => {
    const { id, items } = await requestWithItems();
    const res = await agent.agent.post(`/api/requests/${id}/items/confirm`).set('x-csrf-token', agent.csrfToken).send({ items: items.map((i) => ({ id: i.id, version: i.version })) });
    expect(res.status).toBe(200);
    expect(res.body.every((i: Item) => i.status === 'open')).toBe(true);
    const detail = await agent.agent.get(`/api/requests/${id}`);
    expect(detail.body.status).toBe('pricing');
    expect(detail.body.itemCount).toBe(3);
    expect(detail.body.history.at(-1)).toMatchObject({ from: 'intake', to: 'pricing' });
    // After confirmation the review is closed.
    const late = await agent.agent.patch(`/api/requests/${id}/items/${items[0].id}`).set('x-csrf-token', agent.csrfToken).send({ version: items[0].version + 1, quantity: 1 });
    expect(late.status).toBe(409);
  });

  it('responds 409 when the list changed since it was loaded, and confirms nothing', async () => {
    const { id, items } = await requestWithItems();
    const res = await agent.agent.post(`/api/requests/${id}/items/confirm`).set('x-csrf-token', agent.csrfToken).send({ items: items.slice(1).map((i) => ({ id: i.id, version: i.version })) });
    expect(res.status).toBe(409);
    const after = await listed(id);
    expect(after.every((i: Item) => i.status === 'proposed')).toBe(true);
    expect((await agent.agent.get(`/api/requests/${id}`)).body.status).toBe('intake');
  });

  it('responds 403 to the inspector', async () => {
    const { id, items } = await requestWithItems();
    await inspector.agent.post(`/api/requests/${id}/items/confirm`).set('x-csrf-token', inspector.csrfToken).send({ items: items.map((i) => ({ id: i.id, version: i.version })) }).expect(403);
  });
});
