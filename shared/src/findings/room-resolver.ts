import { clauseIndexAt, clauseRanges, type Range } from './clause-splitter';
import type { CodeMatch } from './code-matcher';
import { WHOLE_SYSTEM } from './code-patterns';
import { readLocation } from './location-reader';
import { scanAll } from './regex-scan';
import { findRooms, type RoomMention } from './room-lexicon';
import type { Room } from './room';

/** Where a finding is, and the stretch of text its count is read from. */
/** A sentence that points at the place of the sentence before ("have an electrician evaluate this area"). */
export const POINTS_TO_PLACE = /\b(?:this|that) (?:area|room|space|location|building|addition|wing)\b/i;

export interface Placement {
  readonly room: Room;
  readonly location: string;
  /** The text the quantity is read from (the finding's own part of the sentence). */
  readonly countText: string;
  /** Text after that part, read for a count only when the sentence has one finding. */
  readonly laterText: string;
  /** Position in countText after which "a"/"an" no longer count as one (see readQuantity). */
  readonly articleLimit: number;
  /**
   * The clause's text before the finding's part: its subject when the part names no device ("The
   * receptacle at the deck has no cover and is not GFCI protected").
   */
  readonly subjectText?: string;
  /** Whether the room comes from context (an earlier sentence, the heading, the code's default). */
  readonly isInferred?: boolean;
}

export interface CarriedPlace {
  readonly room: Room;
  readonly location: string;
}

/** What the block and section say about place, for sentences that name none. */
export interface PlaceContext {
  /** A place named earlier in the block that this sentence refers back to ("It is not..."). */
  readonly carried: CarriedPlace | null;
  /**
   * The place named by the block's opening sentence: it carries to findings that name none, unless
   * that sentence was itself a finding and this code has a room of its own by default (a house-wide
   * alarm is not in the bedroom of the sentence before).
   */
  readonly opening?: (CarriedPlace & { readonly hadFindings: boolean }) | null;
  readonly sectionRoom: Room | null;
  readonly sectionTitle: string | null;
}

const SEPARATOR = /,\s*|\s+(?:and|also|while|plus|as well as)\s+/gi;
/** Text between two places of one list: a conjunction, few words, no spatial preposition. */
const LIST_BETWEEN = /^(?=.*(?:,|\band\b|&|\/|\bor\b))(?!.*\b(?:above|below|beneath|under|over|near|behind|beside|next|adjacent|off|of|from|inside|within|serving|serves?|feeding|feeds?|supplies|supplying|where|for|which|that)\b)(?:[\s,&/()]*[\w'-]+){0,6}[\s,&/()]*$/i;

/** Words that limit a house-wide condition to the place named ("only in the garage", "within the addition"). */
const LIMITED = /\b(?:only|addition|addn|within|limited to|confined to|throughout the(?!\s+(?:house|home|dwelling|building))|circuit\s+\d+|all other)\b|\bon\s+(?:the\s+)?(?!branch\b|all\b|most\b|\d)[\w/-]+(?:\s+[\w/-]+)?\s+circuits\b/i;
/** "wired in knob-and-tube throughout, seen in the attic": the rooms named are where it was seen. */
const THROUGHOUT = /\bthroughout(?:\s+the\s+(?:house|home|dwelling|building))?\s*(?:[,.;:)]|$)/i;

/** Splits the sentence into one part per match: a match owns the text up to the next separator. */
function segments(text: string, matches: readonly CodeMatch[], clauses: readonly Range[]): Range[] {
  const bounds = [0];
  for (let i = 0; i + 1 < matches.length; i++) {
    const a = matches[i];
    const b = matches[i + 1];
    let cut = b.start;
    const ca = clauseIndexAt(clauses, a.start);
    if (ca !== clauseIndexAt(clauses, b.start)) {
      cut = clauses[ca].end;
    } else {
      const between = text.slice(a.end, b.start);
      const seps = scanAll(SEPARATOR, between);
      if (seps.length > 0) cut = a.end + seps[seps.length - 1].index;
    }
    bounds.push(cut);
  }
  bounds.push(text.length);
  return matches.map((m, i) => {
    const clause = clauses[clauseIndexAt(clauses, m.start)];
    return { start: Math.max(bounds[i], clause.start), end: Math.min(bounds[i + 1], clause.end) };
  });
}

function mentionsIn(rooms: readonly RoomMention[], range: Range): RoomMention[] {
  return rooms.filter((r) => r.start >= range.start && r.end <= range.end && !r.isReferencePoint);
}

/** The first place of a part, extended by the places listed with it ("bedroom, dining room and den"). */
function listedGroup(text: string, mentions: readonly RoomMention[]): RoomMention[] {
  const usable = mentions.some((m) => m.room !== 'panel') ? mentions.filter((m) => m.room !== 'panel') : mentions;
  const group = usable.slice(0, 1);
  for (let i = 1; i < usable.length; i++) {
    if (!LIST_BETWEEN.test(text.slice(usable[i - 1].end, usable[i].start))) break;
    group.push(usable[i]);
  }
  // "In the kitchen, the two countertop receptacles": two words for one room are one place, not a list.
  return group.filter((m, i) => group.findIndex((g) => g.room === m.room) === i);
}

function nearest(rooms: readonly RoomMention[], before: number, after: number, within: Range): RoomMention | null {
  const inside = rooms.filter((r) => !r.isReferencePoint && r.room !== 'panel' && r.start >= within.start && r.end <= within.end);
  const earlier = inside.filter((r) => r.end <= before);
  if (earlier.length > 0) return earlier[earlier.length - 1];
  return inside.find((r) => r.start >= after) ?? null;
}

/** A stair named alone ("the top of the stairs", "the mid-landing"), with no room word of its own. */
const BARE_STAIR = /^(?:(?:the\s+)?(?:mid-?|top\s+|bottom\s+|upper\s+|lower\s+)?(?:stair(?:s|way|well|case)?|landing))$/i;
const STAIR_ROOMS: ReadonlySet<Room> = new Set(['basement', 'attic', 'bedroom', 'exterior', 'garage', 'crawl-space']);

/**
 * "The switch at the top of the loft stairs" under a loft bedroom's heading, "the stair" of an exterior
 * stair, "by the stairs" in a basement paragraph: a stair named alone belongs to the space the block or
 * its heading is about, when that is a level, an outbuilding, the outside or a bedroom (common
 * practice: stairs inside such a space are part of it, not the hall).
 */
function roomOfStair(chosen: RoomMention, rooms: readonly RoomMention[], context: PlaceContext): Room | null {
  if (chosen.room !== 'hallway' || !BARE_STAIR.test(chosen.text.trim())) return null;
  // "Stair hall: the switch at the top of the stairs" names the hall itself.
  if (rooms.some((r) => r !== chosen && r.room === 'hallway' && !r.isReferencePoint && !BARE_STAIR.test(r.text.trim()))) return null;
  if (context.sectionRoom && STAIR_ROOMS.has(context.sectionRoom)) return context.sectionRoom;
  const opening = context.opening?.room;
  return opening && opening !== 'bedroom' && STAIR_ROOMS.has(opening) ? opening : null;
}

/** For each match of the sentence, one placement per place it applies to. */
export function placeMatches(
  text: string,
  matches: readonly CodeMatch[],
  context: PlaceContext,
  rooms: readonly RoomMention[] = findRooms(text),
  clauses: readonly Range[] = clauseRanges(text),
): Placement[][] {
  if (matches.length === 0) return [];
  const parts = segments(text, matches, clauses);
  return matches.map((match, i) => {
    const part = parts[i];
    const countText = text.slice(part.start, part.end);
    const laterText = text.slice(part.end);
    const firstWords = /^(?:\S+\s+){0,2}\S+/.exec(text.slice(match.start))?.[0].length ?? 0;
    const articleLimit = match.start - part.start + firstWords;
    const clauseStart = clauses[clauseIndexAt(clauses, match.start)].start;
    const own = { countText, laterText, articleLimit, subjectText: part.start > clauseStart ? text.slice(clauseStart, part.start) : '' };
    const fixed = match.rule.fixedRoom;
    if (fixed) return [{ room: fixed, location: fixedLocation(text, rooms, part, fixed), ...own }];
    if (match.rule.panelIsPlace) {
      // "No grounding electrode conductor at the panel or at the exterior": the first place named
      // with the defect, the panel included; a panel named elsewhere in the sentence before context.
      const inPart = mentionsIn(rooms, part);
      const first = inPart[0] ?? (rooms.some((r) => r.room === 'panel') ? rooms.find((r) => r.room === 'panel') : undefined);
      if (first?.room === 'panel') return [{ room: 'panel', location: readLocation(text, first), ...own }];
    }
    if (match.rule.placeAnywhereInSentence && THROUGHOUT.test(text)) return [{ room: match.rule.defaultRoom ?? 'whole-house', location: '', ...own, isInferred: true }];
    if (match.rule.isHouseWide && !LIMITED.test(text)) return [{ room: match.rule.defaultRoom ?? 'whole-house', location: '', ...own, isInferred: true }];
    // "the work seen in the attic and garage ... a full evaluation of the entire electrical system": the rooms are the reasons, the evaluation is house-wide.
    if (match.rule.ignoresContext && WHOLE_SYSTEM.test(text)) return [{ room: match.rule.defaultRoom ?? 'whole-house', location: '', ...own, isInferred: true }];
    // A panel named beside another code's defect is a reference point ("cable run up to the panel").
    const group = listedGroup(text, mentionsIn(rooms, part).filter((m) => m.room !== 'panel'));
    if (group.length > 1) {
      // "three receptacles in the parlor and two in the front bedroom": each place's own number, when every place has one.
      // "Cvr plates missing: BR2 (2), laundry (1), garage (3)": a bracketed count right after each place.
      const counts = group.map((m, j) => bracketAfter(text.slice(m.end, m.end + 8)) ?? placeCount(text.slice(j === 0 ? part.start : group[j - 1].end, m.start)));
      const eachCounted = counts.every((c) => c !== null);
      return group.map((m, j) => ({
        room: m.room,
        location: readLocation(text, m),
        countText: eachCounted ? `${counts[j]} ${PLACE_COUNT_NOUN}` : text.slice(j === 0 ? part.start : group[j - 1].end, m.end),
        laterText: '',
        articleLimit: Infinity,
      }));
    }
    const clause = clauses[clauseIndexAt(clauses, match.start)];
    // "Knob-and-tube is still in service up here -- ... runs feeding the front bedroom fixture" under
    // an attic heading: "here" is the section's place, said before any other place.
    const here = HERE.exec(text.slice(clause.start, group[0]?.start ?? text.length));
    if (here && context.sectionRoom && context.sectionRoom !== 'panel') {
      return [{ room: context.sectionRoom, location: context.sectionTitle ?? '', ...own, isInferred: true }];
    }
    const chosen =
      group[0] ??
      nearest(rooms, part.start, part.end, clause) ??
      nearest(rooms, part.start, text.length, { start: 0, end: part.start }) ??
      (match.rule.placeAnywhereInSentence ? nearest(rooms, part.end, part.end, { start: part.end, end: text.length }) : null);
    // "the receptacle on the back wall" under a GARAGE heading is on the garage's back wall.
    if (chosen && SIDE_WALL.test(chosen.text) && match.rule.defaultRoom !== 'exterior' && context.sectionRoom && context.sectionRoom !== 'exterior' && context.sectionRoom !== 'panel') {
      return [{ room: context.sectionRoom, location: readLocation(text, chosen), ...own, isInferred: true }];
    }
    const stairRoom = chosen ? roomOfStair(chosen, rooms, context) : null;
    if (chosen && stairRoom) return [{ room: stairRoom, location: readLocation(text, chosen), ...own, isInferred: true }];
    if (chosen) return [{ room: chosen.room, location: readLocation(text, chosen), ...own }];
    // A house-wide code stays house-wide unless the sentence points at the place before ("evaluate this area").
    if (match.rule.ignoresContext && context.carried && POINTS_TO_PLACE.test(text)) return [{ ...context.carried, ...own, isInferred: true }];
    if (match.rule.ignoresContext) return [{ room: match.rule.defaultRoom ?? 'unknown', location: '', ...own, isInferred: true }];
    if (context.carried) return [{ ...context.carried, ...own, isInferred: true }];
    const opening = context.opening;
    if (opening && !(opening.hadFindings && match.rule.defaultRoom)) {
      return [{ room: opening.room, location: opening.location, ...own, isInferred: true }];
    }
    // Under a panel heading, a code with a room of its own by default keeps it (aluminum wiring is house-wide).
    const sectionRoom = context.sectionRoom === 'panel' && match.rule.defaultRoom ? match.rule.defaultRoom : context.sectionRoom;
    if (sectionRoom) return [{ room: sectionRoom, location: context.sectionTitle ?? '', ...own, isInferred: true }];
    return [{ room: match.rule.defaultRoom ?? 'unknown', location: '', ...own, isInferred: true }];
  });
}

const HERE = /\b(?:up|down|in|out|over)\s+here\b/i;

/** A wall named only by its side ("the back wall"), which the room lexicon reads as the outside of the house. */
const SIDE_WALL = /^(?:front|rear|side|back) (?:wall|elevation)$/i;

const PLACE_COUNT_WORDS: Readonly<Record<string, number>> = { one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10 };
/** A number just before a listed place ("two in the", "at three receptacles in the front"). */
const PLACE_COUNT = /\b(\d{1,2}|one|two|three|four|five|six|seven|eight|nine|ten)\s+(?:[\w-]+\s+){0,2}?(?:in|at|on)\s+(?:the\s+)?(?:[\w-]+\s+){0,2}$/i;
/** The noun a place's own number is read with (the count reader needs a device after the number). */
const PLACE_COUNT_NOUN = 'devices';
function bracketAfter(after: string): number | null {
  const m = /^\s*\((\d{1,3})\)/.exec(after);
  return m ? Number(m[1]) : null;
}
function placeCount(before: string): number | null {
  const m = PLACE_COUNT.exec(before);
  if (!m || /^(?:\d{1,2})$/.test(m[1]) === false && PLACE_COUNT_WORDS[m[1].toLowerCase()] === undefined) return null;
  const after = before.slice(m.index + m[1].length);
  if (/^\s*(?:a|amps?|v|volts?|awg|ft|feet|inch(?:es)?|years?)\b|^-/i.test(after)) return null;
  return /^\d/.test(m[1]) ? Number(m[1]) : PLACE_COUNT_WORDS[m[1].toLowerCase()];
}

function fixedLocation(text: string, rooms: readonly RoomMention[], part: Range, room: Room): string {
  const own = rooms.find((r) => r.room === room && r.start >= part.start && r.end <= part.end) ?? rooms.find((r) => r.room === room);
  return own ? readLocation(text, own) : '';
}

/** The mention a later sentence of the same block can refer back to: the last place named, panels excluded. */
export function lastPlaceMention(rooms: readonly RoomMention[]): RoomMention | null {
  for (let i = rooms.length - 1; i >= 0; i--) {
    if (!rooms[i].isReferencePoint && rooms[i].room !== 'panel') return rooms[i];
  }
  return null;
}

/** The place a later sentence of the same block can refer back to, with its location as written. */
export function lastPlaceNamed(text: string, rooms: readonly RoomMention[] = findRooms(text)): CarriedPlace | null {
  const last = lastPlaceMention(rooms);
  return last ? { room: last.room, location: readLocation(text, last) } : null;
}
