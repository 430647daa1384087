import type { FindingCode } from '../findings/finding-code';
import type { Room } from '../findings/room';
import type { RateBookEntry } from '../pricing/rate-book.schema';
import { PICK_KINDS, type PickKind } from './economics.schema';

/** Sorts a material into the kind the pick list groups it under, by its name (first rule that matches). */
const KIND_RULES: readonly [RegExp, PickKind][] = [
  [/label/i, 'labels'],
  [/cover|plate|filler|closure/i, 'covers'],
  [/breaker/i, 'breakers'],
  [/\bwire\b|awg|pigtail|connector|copper|staple|raceway|clamp|screw|\bbar\b/i, 'wire-hardware'],
  [/receptacle|switch|alarm|fixture|transformer/i, 'devices'],
  [/box|brace|ring/i, 'boxes'],
];

export function materialKind(name: string): PickKind {
  return KIND_RULES.find(([pattern]) => pattern.test(name))?.[1] ?? 'other';
}

export interface SiteConditionExtra {
  name: string;
  /** Units of it per unit of the item. */
  perUnit: number;
}

/**
 * What a site condition (a rate-book adder, by its key) adds to the truck for each unit of an item
 * flagged with it. Common practice: a device recessed behind tile or stone needs longer device
 * screws; a shallow or crowded box an extension ring; a metal box without a ground path a ground
 * pigtail with a green screw; plaster and lath, old-work box supports.
 */
export const SITE_CONDITION_EXTRAS: Readonly<Record<string, readonly SiteConditionExtra[]>> = {
  'tile-or-stone': [{ name: 'Long device screws, 6-32 × 1½ in (pair)', perUnit: 1 }],
  'tight-box': [{ name: 'Box extension ring', perUnit: 1 }],
  'metal-box-no-ground': [{ name: 'Ground pigtail with green screw', perUnit: 1 }],
  'plaster-walls': [{ name: 'Old-work box supports (pair)', perUnit: 1 }],
};

/** Receptacle work outdoors needs an in-use (while-in-use) cover; NFPA 70 (NEC) 2023, 406.9(B)(1). */
const OUTDOOR_RECEPTACLE_CODES: readonly string[] = ['gfci-missing', 'gfci-inoperative', 'receptacle-damaged', 'reversed-polarity', 'open-ground', 'false-ground'];
export const IN_USE_COVER = 'Extra-duty in-use cover';

/** One booked item as the pick list sees it. */
export interface PickItem {
  itemId: number;
  code: FindingCode | string;
  room: Room | string;
  /** Label of the visit it is booked on ("Site visit 1 · 14 Quarry Rd"). */
  visitLabel: string;
  /** The rate-book entry it is priced with; null when it has none. */
  entry: RateBookEntry | null;
  quantity: number;
  /** Site conditions (adder keys) flagged on the item. */
  adderIds: readonly string[];
}

export interface BuiltPickLine {
  key: string;
  kind: PickKind;
  name: string;
  quantity: number;
  spare: number;
  total: number;
  isSiteCondition: boolean;
  forVisits: string[];
}

/**
 * What a line's load is made of, the same words on the screen and on paper: "5 for the items + 1 spare"
 * when a spare allowance is in it, else nothing (the load is just the items').
 */
export function spareNote(line: Pick<BuiltPickLine, 'quantity' | 'spare'>): string {
  return line.spare ? `${line.quantity} for the items + ${line.spare} spare` : '';
}

export interface BuiltPickList {
  lines: BuiltPickLine[];
  itemsWithoutMaterials: { itemId: number; code: string; reason: string }[];
}

const slug = (text: string) => text.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 150);

/**
 * The materials for a set of booked items: each entry's materials list times the item's quantity,
 * what the flagged site conditions add, and once per entry used its spare allowance (`spares`, spare
 * units of the entry by entry key). Lines with the same kind and name are added up; sorted by kind,
 * then name.
 */
export function buildPickList(items: readonly PickItem[], spares: Readonly<Record<string, number>>): BuiltPickList {
  const lines = new Map<string, BuiltPickLine>();
  const add = (name: string, quantity: number, spare: number, isSiteCondition: boolean, visitLabel: string | null) => {
    const kind = isSiteCondition && name === IN_USE_COVER ? 'covers' : materialKind(name);
    const key = `${kind}:${slug(name)}`;
    const line = lines.get(key) ?? { key, kind, name, quantity: 0, spare: 0, total: 0, isSiteCondition, forVisits: [] };
    line.quantity += quantity;
    line.spare += spare;
    line.total = line.quantity + line.spare;
    line.isSiteCondition = line.isSiteCondition && isSiteCondition;
    if (visitLabel && !line.forVisits.includes(visitLabel)) line.forVisits.push(visitLabel);
    lines.set(key, line);
  };
  const itemsWithoutMaterials: BuiltPickList['itemsWithoutMaterials'] = [];
  const entriesUsed = new Map<string, RateBookEntry>();
  for (const item of items) {
    const entry = item.entry;
    const materials = entry?.pricing.mode === 'time-and-materials' ? entry.pricing.materials : [];
    if (!entry) itemsWithoutMaterials.push({ itemId: item.itemId, code: item.code, reason: 'Not priced with a rate-book entry' });
    else if (!materials.length) {
      itemsWithoutMaterials.push({ itemId: item.itemId, code: item.code, reason: entry.pricing.mode === 'flat' ? 'Flat-rate entry: no materials list' : 'The entry lists no materials' });
    } else entriesUsed.set(entry.id, entry);
    for (const m of materials) add(m.name, m.quantityPerUnit * item.quantity, 0, false, item.visitLabel);
    for (const adder of item.adderIds) {
      for (const extra of SITE_CONDITION_EXTRAS[adder] ?? []) add(extra.name, extra.perUnit * item.quantity, 0, true, item.visitLabel);
    }
    const hasCover = materials.some((m) => /in-use cover/i.test(m.name));
    if (item.room === 'exterior' && OUTDOOR_RECEPTACLE_CODES.includes(item.code) && !hasCover) add(IN_USE_COVER, item.quantity, 0, true, item.visitLabel);
  }
  for (const entry of entriesUsed.values()) {
    const spareUnits = spares[entry.id] ?? 0;
    if (spareUnits > 0 && entry.pricing.mode === 'time-and-materials') {
      for (const m of entry.pricing.materials) add(m.name, 0, m.quantityPerUnit * spareUnits, false, null);
    }
  }
  const order = (k: PickKind) => PICK_KINDS.indexOf(k);
  return {
    lines: [...lines.values()].sort((a, b) => order(a.kind) - order(b.kind) || a.name.localeCompare(b.name)),
    itemsWithoutMaterials,
  };
}
