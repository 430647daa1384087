import { editionNote } from '../code-editions/edition-note';
import { itemsWithNotes, LineItemListSchema, toLineItemList, type LineItem } from './line-item.schema';

const house = { yearBuilt: 1978, necEdition: 2023 } as const;

function item(id: number, code: string, room: string): LineItem {
  return {
    id, requestId: 7, code, room, location: '', quantity: 1, evidence: null, page: null, reportFileId: null,
    evidenceStart: null, evidenceEnd: null, severity: 'safety', necRefs: [], status: 'proposed', isEdited: false, version: 1,
    editionNote: editionNote(code, room, house), confidence: null, recommendation: null, computation: null,
  } as LineItem;
}

describe('the item list sent with each edition note once', () => {
  const items = [item(1, 'gfci-missing', 'kitchen'), item(2, 'gfci-missing', 'kitchen'), item(3, 'gfci-missing', 'garage'), item(4, 'double-tap', 'panel')];

  it('keeps one note per code and room, and none for an item without a note', () => {
    const list = LineItemListSchema.parse(toLineItemList(items));
    expect(Object.keys(list.editionNotes).sort()).toEqual(['gfci-missing/garage', 'gfci-missing/kitchen']);
    expect(list.items.map((i) => i.editionNoteKey)).toEqual(['gfci-missing/kitchen', 'gfci-missing/kitchen', 'gfci-missing/garage', null]);
  });

  it('gives the same items back with their notes in place', () => {
    expect(itemsWithNotes(toLineItemList(items))).toEqual(items);
  });

  it('survives the trip through JSON', () => {
    expect(itemsWithNotes(JSON.parse(JSON.stringify(toLineItemList(items))))).toEqual(items);
  });
});
