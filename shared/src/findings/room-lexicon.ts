import { startFilteredScan } from './match-starts';
import type { Room } from './room';

/**
 * The words reports use for places, and the normalised room each one means. The earliest match in
 * the text wins; at the same position the room listed first wins, so rooms whose words contain
 * another room's word come first ("hall bath" is a bathroom, not a hallway).
 */
const ROOM_WORDS: ReadonlyArray<readonly [Room, string]> = [
  ['bathroom', String.raw`ba[ñn]os?\b|(?:(?:hall|guest|primary|master|main|upstairs|downstairs|half|full|kids'?|jack and jill|second|upper|lower)\s+)?bath(?:room)?s?\b|powder rooms?|en-?suites?|lavatory|restrooms?|(?:tub|shower)(?:\s+(?:area|enclosure|stall))?\b|vanity`],
  ['kitchen', String.raw`cocinas?\b|kitchens?|kitchenette|kit\b\.?|kitch\b\.?|(?:kitchen\s+)?island|breakfast (?:nook|area|bar)|peninsula|pantry|(?:kitchen\s+)?counter\s*tops?|countertops?|(?:(?<!\b(?:garage|basement|bar|laundry|utility|porch|patio|outdoor|outside|shop|workshop|deck)\s)(?:refrigerator|fridge)|dishwasher|garbage disposal|disposal|range hood|(?<!\b(?:wood|pellet|coal|wood[- ]burning|heating|parlou?r|franklin)[\s-])stove|cooktop|(?:electric\s+)?range(?=\s+(?:receptacle|outlet|cord|circuit|hood))|(?<=\b(?:the|behind|beside|near)\s)range\b)(?![\w\s,]{0,30}\b(?:garage|basement|laundry|bar|utility|porch|patio)\b)`],
  ['garage', String.raw`garaje\b|cochera\b|garages?|carports?|gar\b\.?|(?:work\s?)?shops?\b(?![- ](?:lights?|vacs?|fixtures?|lamps?))|shop (?:building|bldg)`],
  ['exterior', String.raw`(?:bank\s+|pole\s+|horse\s+|hay\s+|dairy\s+)?barns?\b|(?:machine|storage|garden|tool|equipment|pump|wood|potting)\s+sheds?\b|(?<!\b(?:to|they|it|that|which|will|can|actually)\s)sheds?\b(?!\s+(?:water|light|heat|rain|snow))|outbuildings?\b|pole buildings?\b|stables?\b|chicken coops?\b|exterior(?!\s+walls?\b)|out\s+(?:back|front)\b|outside(?!\s+(?:walls?|corner|of|the|a|an|its|their|this|that|each|every|all|any|bedrooms?|sleeping|junction|boxes?|enclosures?|panels?)\b)|outdoors?|patio|decks?\b|porch(?:es)?|balcon(?:y|ies)|yard|pool|spa\b|hot tub|siding|stucco|eaves|soffits?|(?:service\s+|meter\s+)?pedestal(?!\s+(?:sinks?|lavatory|basins?|fans?))|docks?\b|boat\s?(?:lifts?|houses?|slips?)\b|seawalls?\b|well\s?(?:heads?|caps?|houses?)\b|courtyards?|lanais?|verandas?|terraces?|gazebos?|breezeways?|(?:pool\s+|pump\s+)?equipment pads?|(?:front|rear|side|back) (?:wall|elevation)|ext\b\.?|(?:coach|carriage)\s+(?:lights?|lamps?|lanterns?)`],
  ['basement', String.raw`s[oó]tanos?\b|basements?|cellar|bsmt\b\.?|bsmnt\b\.?|lower (?:level|lvl\b\.?)`],
  ['crawl-space', String.raw`crawl\s?spaces?|crawl\s?ways?\b|crawl\b|(?:under|beneath) the (?:home|house|floor system|mobile home|manufactured home)|underfloor|under-floor|sub-?areas?\b|on the dirt\b`],
  ['laundry', String.raw`lavander[ií]a\b|laundry(?:\s+(?:room|area|closet))?|washer|dryer|utility room|mud ?room`],
  ['bedroom', String.raw`rec[aá]maras?\b|dormitorios?\b|habitaci[oó]n(?:es)?\b|(?:(?:primary|master|guest|front|rear|back|north|south|east|west|upstairs|downstairs|kids'?|second|third|small|large)\s+)?(?:bed\s?rooms?|bed\s?\d\b|bedrms?\b|bdrms?\b\.?|brs?\s?\d*\b|nursery)|(?:prim|pri|mstr|mbr)\.?\s+br\b|mbr\b|primary suite|master suite|(?:primary|master|mbr)\s+(?:walk-?in\s+)?closets?|walk-?in\s+closets?|guest room|(?:rented|rental|let|tenant'?s?|lodging|boarders?'?)\s+rooms?\b|rooms?\s+#?\d{1,2}\b(?![-\d])|rms?\.?\s*#?\d{1,2}\b(?![-\d])|sleeping\s+lofts?\b|lofts?\s*\(sleeping\)`],
  ['living-area', String.raw`sala\b|living(?: (?:room|area)s?)?\b|liv\.?\s?rm\b|lr\b(?=\s*:)|family rooms?|great rooms?|den\b|sun\s?rooms?|florida rooms?|sun porch(?:es)?|three[- ]season rooms?|rec(?:reation)? rooms?|bonus rooms?|parlou?r|library|front room|lr\b|fireplace|media room`],
  ['hallway', String.raw`pasillos?\b|hall(?:way)?s?\b|corridors?|stair(?:way|well|case)?s?\b|landing|foyer|(?<!\b(?:water|service|cable|line|pipe|meter|conduit|wire|point of)\s+)entry(?:way)?(?!\s+(?:doors?|points?))|front entry(?!\s+doors?)`],
  ['attic', String.raw`[aá]ticos?\b|attics?\b`],
  ['panel', String.raw`(?:main\s+|electrical\s+|service\s+|distribution\s+)?(?:sub-?\s?panel|panel\s*board|panel|pnl)s?\b|load cent(?:er|re)|breaker box|fuse box`],
  ['dining', String.raw`comedor\b|dining(?:\s+(?:room|area))?|dinette|dr\b(?![.'’])`],
  ['office', String.raw`(?:home\s+)?office|study\b`],
  ['whole-house', String.raw`throughout(?: the (?:home|house|dwelling|unit))?(?!\s+(?:the|this|that|each|every|all|both)\b)|anywhere in the (?:home|house|dwelling|unit)|(?:in|on) (?:each|every|all|any) (?:levels?|floors?|stor(?:y|ies))(?: of the (?:home|house|dwelling))?|whole[- ]house|entire (?:home|house|dwelling|electrical system|system)|all rooms|every room|(?<=\b(?:none|nothing|no\s+[\w/-]+(?:\s+[\w/-]+)?|present|found|installed|observed|anywhere)\s+)in (?:the )?(?:house|home|unit|dwelling)\b`],
];

/**
 * One pass over the text: each room's words are one capturing group, tried in table order at each
 * word start. The word-start check stands once in front of the whole alternation (V8 rejects a
 * position much faster that way than with a check inside every alternative), and plain groups with
 * their numbers worked out here are cheaper to read than named ones.
 */
const ROOM_RE = new RegExp(String.raw`(?<![\w-])(?:${ROOM_WORDS.map(([, src]) => `(${src})`).join('|')})`, 'gi');

/** ROOM_RE's matches, tried only where two characters can begin a room word (see match-starts.ts). */
const scanRooms = startFilteredScan(ROOM_RE);

/** How many capturing groups a source has: with an empty alternative it matches '' and leaves them all unset. */
function groupCount(src: string): number {
  return (new RegExp(`(?:${src})|`).exec('') ?? ['']).length - 1;
}

/** ROOM_GROUP[i] is the number of the group that holds room i's words in ROOM_RE. */
const ROOM_GROUP: readonly number[] = (() => {
  const groups: number[] = [];
  let next = 1;
  for (const [, src] of ROOM_WORDS) {
    groups.push(next);
    next += 1 + groupCount(src);
  }
  return groups;
})();

/** A place named in the text. */
export interface RoomMention {
  readonly room: Room;
  readonly start: number;
  readonly end: number;
  readonly text: string;
  /** Whether the place is only a reference point ("beneath the kitchen", "above the garage"). */
  readonly isReferencePoint: boolean;
}

/** Ceiling lights "over the kitchen", seen from the attic above, light that room (common practice). */
const LIGHTS_IN_CEILING = /\b(?:recessed|can|pot)\s+(?:can\s+)?(?:lights?|fixtures?|housings?|cans?)\s+(?:\w+\s+)?(?:over|above)\s+(?:the\s+)?$/i;
/** A place the inspector looked from ("From the attic we observed ...", "seen from the crawl space"). */
const VANTAGE_BEFORE = /(?:^\s*|[.;]\s+)from\s+(?:the\s+)?$|\b(?:viewed|seen|observed|visible|looking)\s+from\s+(?:the\s+)?$/i;
/** A verb of supply before a room: the room is served, not the place ("feeding the kitchen"). */
const SERVED_BEFORE = /\b(?:feeding|feeds|serving|serves|supplying|supplies|powering|powers|(?:running|runs|routed|heading|headed|extending)\s+(?:up\s+|down\s+|over\s+)?(?:toward|towards|to|into))\s+(?:the\s+)?$/i;
/** A device noun after the room: "serving the kitchen receptacles" names the devices' place. */
const DEVICE_AFTER = /^\s*(?:[\w-]+\s+)?(?:receptacles?|outlets?|rcpts?|lights?|fixtures?|counters?|countertops?|switch(?:es)?|fans?|gfcis?|alarms?|smoke)\b/i;
const REFERENCE_BEFORE = /(?:facing|beneath|below|under|underneath|above|over|outside(?:\s+of)?|open to|(?<!\b(?:turned|shut|switched|cut|is|are|was|were)\s)off(?:\s+of)?|(?:shared|common)\s+(?:with|to))\s+(?:the\s+)?$/i;
/** "at the bedroom end of the hall": the room names an end of the place that follows. */
const ACCESS_BEFORE = /\b(?:reached|accessed|entered|access(?:ible)?)\s+(?:by|from|through|via)\s+(?:the\s+|an?\s+)?(?:[\w-]+\s+){0,4}?(?:(?:in|from|off|at)\s+(?:the\s+)?)?$|\b(?:access|hatch|scuttle|pull-?down(?:\s+stairs?)?)\s+(?:(?:is|was|located)\s+)?(?:in|inside)\s+(?:the\s+)?$/i;
const BELOW_AFTER = /^\s+(?:ceilings?\s+|(?:recessed\s+|can\s+)?(?:can\s+)?lights?\s+)?below\b/i;
const END_OF_AFTER = /^\s+(?:end|side)\s+of\s+(?:the\s+)?/i;
/** "by the kitchen pass-through", "near the dining room archway": a room's opening as a landmark of another room. */
const BESIDE_BEFORE = /(?:by|near|beside|next to|at|toward|towards)\s+(?:the\s+)?$/i;
const OPENING_AFTER = /^\s*(?:pass[- ]?through|opening|archway)/i;
const LANDMARK_DEVICE_AFTER = /^\s*(?:exhaust\s+)?(?:fan|vent)s?\b/i;
const FIXTURE_AFTER = /^\s*(?:sink|counter|cabinet|vanity|island|floor|closet|door|window|opener)/i;

/** Every place named in `text`, in reading order, without overlaps. */
export function findRooms(text: string): RoomMention[] {
  const found: RoomMention[] = [];
  // Read only when a room follows a reference word (most sentences never need it).
  let hasVantage: boolean | undefined;
  const seenFromAbove = () => (hasVantage ??= /\bfrom\s+(?:the\s+)?(?:attic|crawl)/i.test(text));
  for (const m of scanRooms(text)) {
    let i = 0;
    while (m[ROOM_GROUP[i]] === undefined) i++;
    const start = m.index;
    const end = start + m[0].length;
    const before = text.slice(Math.max(0, start - 20), start);
    const after = text.slice(end, end + 24);
    const isReferencePoint =
      (REFERENCE_BEFORE.test(before) && !FIXTURE_AFTER.test(after) && !(seenFromAbove() && LIGHTS_IN_CEILING.test(text.slice(Math.max(0, start - 50), start)))) ||
      (BESIDE_BEFORE.test(before) && OPENING_AFTER.test(after)) ||
      // "(2) jct boxes w/ no covers by the bath fan" in an attic: the fan is a landmark there.
      (BESIDE_BEFORE.test(before) && LANDMARK_DEVICE_AFTER.test(after)) ||
      VANTAGE_BEFORE.test(text.slice(Math.max(0, start - 30), start)) ||
      END_OF_AFTER.test(after) ||
      // "the bedroom ceilings below", "the kitchen can lights below": a room seen from above is a reference point.
      BELOW_AFTER.test(after) ||
      // "The attic is reached by pull-down stairs in the hallway": where a space is entered from.
      ACCESS_BEFORE.test(text.slice(Math.max(0, start - 50), start));
    // "DR chandelier dead": the dining room's abbreviation only in capitals ("Dr." and "Oak Dr" are no room).
    if (m[0].length === 2 && m[0] !== 'DR' && /^dr$/i.test(m[0])) continue;
    found.push({ room: ROOM_WORDS[i][0], start, end, text: m[0], isReferencePoint });
  }
  // Twelfth round: "joist bays under LR + DR", "beneath the kitchen and dining room": places listed
  // right after a reference point are reference points too.
  for (let i = 1; i < found.length; i++) {
    const [a, b] = [found[i - 1], found[i]];
    if (a.isReferencePoint && a.room !== 'panel' && b.room !== 'panel' && /^\s*(?:,|and|&|\+|\/)\s*(?:the\s+)?$/i.test(text.slice(a.end, b.start))) found[i] = { ...b, isReferencePoint: true };
  }
  // A level or outbuilding named before a room is where that room is ("basement bedroom", "garage
  // apartment kitchen"): the room itself is the place.
  for (let i = 0; i + 1 < found.length; i++) {
    const [a, b] = [found[i], found[i + 1]];
    if (LEVEL_ROOMS.has(a.room) && HABITABLE.has(b.room) && /^[\s-]*$/.test(text.slice(a.end, b.start))) found[i] = { ...a, isReferencePoint: true };
  }
  // A room a cable or circuit feeds ("NM cable feeding the kitchen", "still supplies the bedroom and
  // living room circuits") is where it goes, not where the defect is; places listed with it too.
  for (let i = 0; i < found.length; i++) {
    const r = found[i];
    if (r.isReferencePoint || r.room === 'panel') continue;
    const lead = text.slice(Math.max(0, r.start - 24), r.start);
    if (!SERVED_BEFORE.test(lead) || DEVICE_AFTER.test(text.slice(r.end, r.end + 24))) continue;
    found[i] = { ...r, isReferencePoint: true };
    for (let j = i + 1; j < found.length && /^\s*(?:,|and|or|&|\/)\s*(?:the\s+)?$/i.test(text.slice(found[j - 1].end, found[j].start)); j++) found[j] = { ...found[j], isReferencePoint: true };
  }
  // "Bath 1 (hall)", "Bedroom 3 (front)": a place in brackets right after another place says which
  // one it is; the place before the brackets is where the defect is.
  for (let i = 1; i < found.length; i++) {
    const [a, b] = [found[i - 1], found[i]];
    if (a.room !== 'panel' && !a.isReferencePoint && /^\s*(?:#?\d{1,2}\s*)?\(\s*$/.test(text.slice(a.end, b.start)) && /^\s*\)/.test(text.slice(b.end, b.end + 3))) found[i] = { ...b, isReferencePoint: true };
  }
  // "Bank barn - lower level", "machine shed loft": a level of an outbuilding is in the outbuilding.
  for (let i = 1; i < found.length; i++) {
    const [a, b] = [found[i - 1], found[i]];
    if (a.room === 'exterior' && OUTBUILDING.test(a.text) && (LEVEL_ROOMS.has(b.room) || b.room === 'attic') && /^[\s,:(–—-]*$/.test(text.slice(a.end, b.start))) found[i] = { ...b, isReferencePoint: true };
  }
  // A shop named after another place is in that place ("basement workshop", "garage shop").
  for (let i = 1; i < found.length; i++) {
    const [a, b] = [found[i - 1], found[i]];
    if (/shop/i.test(b.text) && a.room !== 'panel' && /^[\s-]*$/.test(text.slice(a.end, b.start))) found[i] = { ...b, isReferencePoint: true };
  }
  markPositiveAsides(text, found);
  // Twelfth round: "Foyer: the left coach light is out": a coach or carriage light hangs outside the
  // door of the entry or hall named with it (common practice), so that room is only a landmark.
  if (found.some((r) => COACH_LIGHT.test(r.text))) {
    for (let i = 0; i < found.length; i++) if (found[i].room === 'hallway') found[i] = { ...found[i], isReferencePoint: true };
  }
  // An entry named with the outside ("at the front entry, loose from the siding") is the outside entry.
  if (found.some((r) => r.room === 'exterior' && !r.isReferencePoint)) {
    for (let i = 0; i < found.length; i++) if (/\bentry\b/i.test(found[i].text) && found[i].room === 'hallway') found[i] = { ...found[i], room: 'exterior' };
  }
  // A wall named by its side ("the back wall", "the side wall") is the outside of the house only
  // when nothing else names the room: "the back wall of the garage" is in the garage.
  if (found.some((r) => WALL_SIDE.test(r.text)) && found.some((r) => !WALL_SIDE.test(r.text) && r.room !== 'panel' && !r.isReferencePoint)) {
    return found.map((r) => (WALL_SIDE.test(r.text) ? { ...r, isReferencePoint: true } : r));
  }
  return found;
}

/** A bracketed aside that says something is fine ("(one present in the hall)", "(kitchen tested OK)"). */
const POSITIVE_ASIDE = /\(([^()]{0,80}?\b(?:present|tested(?:\s+(?:ok|good|fine))?|ok|working|functional|operat(?:ed|es|ing)|in place)\b[^()]{0,80})\)/gi;

/**
 * Places named inside a bracketed aside that says a device there is fine are reference points:
 * "Missing in bedrooms 2 and 3 (one present in primary bedroom and hall)" is missing in the bedrooms only
 * (common practice: inspectors note where the device was found beside where it was not).
 */
function markPositiveAsides(text: string, found: RoomMention[]): void {
  if (!text.includes('(')) return;
  for (const m of text.matchAll(POSITIVE_ASIDE)) {
    const [from, to] = [m.index, m.index + m[0].length];
    if (/\b(?:no|not|missing|none|never|failed|without)\b/i.test(m[1])) continue;
    for (let i = 0; i < found.length; i++) if (found[i].start > from && found[i].end < to) found[i] = { ...found[i], isReferencePoint: true };
  }
}

const COACH_LIGHT = /^(?:coach|carriage)\s/i;
const OUTBUILDING = /barn|shed|outbuilding|pole building|stable|coop/i;
const LEVEL_ROOMS: ReadonlySet<Room> = new Set(['basement', 'attic', 'garage', 'hallway']);
const HABITABLE: ReadonlySet<Room> = new Set(['bedroom', 'bathroom', 'kitchen', 'laundry', 'office', 'living-area', 'dining']);
const WALL_SIDE = /^(?:front|rear|side|back) (?:wall|elevation)$/i;
