import type { Room } from './room';

/**
 * The words reports use for places, and the normalised room each one means. The earliest match in
 * the text wins; at the same position the room listed first wins, so rooms whose words contain
 * another room's word come first ("hall bath" is a bathroom, not a hallway).
 */
const ROOM_WORDS: ReadonlyArray<readonly [Room, string]> = [
  ['bathroom', String.raw`(?:(?:hall|guest|primary|master|main|upstairs|downstairs|half|full|kids'?|jack and jill|second|upper|lower)\s+)?bath(?:room)?s?\b|powder rooms?|en-?suites?|lavatory|restrooms?|(?:tub|shower)(?:\s+(?:area|enclosure|stall))?\b|vanity`],
  ['kitchen', String.raw`kitchens?|kitchenette|kit\b\.?|(?:kitchen\s+)?island|breakfast (?:nook|area|bar)|pantry|(?:kitchen\s+)?counter\s*tops?|countertops?`],
  ['garage', String.raw`garages?|carports?|gar\b\.?`],
  ['exterior', String.raw`exterior|outside|outdoors?|patio|decks?\b|porch(?:es)?|balcon(?:y|ies)|yard|pool|spa\b|hot tub|siding|eaves|soffits?|(?:front|rear|side|back) (?:wall|elevation)|ext\b\.?`],
  ['basement', String.raw`basements?|cellar|bsmt\b\.?|bsmnt\b\.?|lower level|sump`],
  ['crawl-space', String.raw`crawl\s?spaces?|crawl\b`],
  ['laundry', String.raw`laundry(?:\s+(?:room|area|closet))?|washer|dryer|utility room|mud ?room`],
  ['bedroom', String.raw`(?:(?:primary|master|guest|front|rear|back|north|south|east|west|upstairs|downstairs|kids'?|second|third|small|large)\s+)?(?:bed\s?rooms?|bedrm\b|bdrms?\b\.?|br\s?\d*\b|nursery)|primary suite|master suite|guest room`],
  ['living-area', String.raw`living (?:room|area)s?|family rooms?|great rooms?|den\b|sun\s?rooms?|rec(?:reation)? rooms?|bonus rooms?|parlou?r|library|front room|lr\b|fireplace|media room`],
  ['hallway', String.raw`hall(?:way)?s?\b|corridors?|stair(?:way|well|case)?s?\b|landing|foyer|entry(?:way)?|front entry`],
  ['attic', String.raw`attics?\b`],
  ['panel', String.raw`(?:main\s+|electrical\s+|service\s+|distribution\s+)?(?:sub-?\s?panel|panel\s*board|panel)s?\b|load cent(?:er|re)|breaker box|fuse box`],
  ['dining', String.raw`dining(?:\s+(?:room|area))?|dinette`],
  ['office', String.raw`(?:home\s+)?office|study\b`],
  ['whole-house', String.raw`throughout(?: the (?:home|house|dwelling))?|whole[- ]house|entire (?:home|house|dwelling|electrical system|system)|all rooms|every room`],
];

/** One pass over the text: each room is a named group, tried in table order at each position. */
const ROOM_RE = new RegExp(
  ROOM_WORDS.map(([, src], i) => String.raw`(?<r${i}>(?<![\w-])(?:${src}))`).join('|'),
  'gi',
);

/** A place named in the text. */
export interface RoomMention {
  readonly room: Room;
  readonly start: number;
  readonly end: number;
  readonly text: string;
  /** Whether the place is only a reference point ("beneath the kitchen", "above the garage"). */
  readonly isReferencePoint: boolean;
}

const REFERENCE_BEFORE = /(?:beneath|below|under|underneath|above|over)\s+(?:the\s+)?$/i;
const FIXTURE_AFTER = /^\s*(?:sink|counter|cabinet|vanity|island|floor|closet)/i;

/** Every place named in `text`, in reading order, without overlaps. */
export function findRooms(text: string): RoomMention[] {
  const found: RoomMention[] = [];
  for (const m of text.matchAll(ROOM_RE)) {
    const i = Object.values(m.groups ?? {}).findIndex((g) => g !== undefined);
    const start = m.index;
    const end = start + m[0].length;
    const before = text.slice(Math.max(0, start - 20), start);
    const isReferencePoint = REFERENCE_BEFORE.test(before) && !FIXTURE_AFTER.test(text.slice(end));
    found.push({ room: ROOM_WORDS[i][0], start, end, text: m[0], isReferencePoint });
  }
  return found;
}
