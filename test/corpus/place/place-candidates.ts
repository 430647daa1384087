// The place ranker's data (docs/parser.md, "A learned place ranker"): for each finding of the parser,
// every place its report names around it (its sentence, the rest of its block, the heading above, the
// same line, a Location field), plus the parser's own room, the code's usual room, `whole-house` and
// `unknown`, each with generic features only (where the place was named, how far away, the word before
// it, whether it is a reference point or in a remedy sentence, how often the code is in that room).
import type { Finding } from '@cc/shared';
import { splitBlocks } from '../../../shared/src/findings/block-splitter';
import { isCaption } from '../../../shared/src/findings/caption-repeats';
import { sourceRange } from '../../../shared/src/findings/mapped-text';
import { CODE_RULES } from '../../../shared/src/findings/code-patterns';
import { findRooms } from '../../../shared/src/findings/room-lexicon';
import type { Room } from '../../../shared/src/findings/room';

export type Features = Record<string, number>;

export interface PlaceCandidate {
  readonly room: Room;
  /** Generic features; `prior` (how often the code is in this room) is filled in per training fold. */
  readonly features: Features;
}

/** Places named in a finding's surroundings, one candidate per room (its features the strongest over its mentions). */
export interface FindingPlaces {
  readonly finding: Finding;
  readonly candidates: PlaceCandidate[];
  /** One of several findings of one code from one sentence (a list of places): the parser's rooms are kept. */
  readonly isListed: boolean;
}

const NEAR_WORD = /\b(?:by|beside|near|next to|from|off(?: of)?|under|underneath|beneath|below|above|over|behind|outside(?: of)?|toward|towards|adjacent to|serving|feeding|to)\s+(?:the\s+|a\s+|an\s+)?$/i;
const IN_WORD = /\b(?:in|at|on|inside|within|of)\s+(?:the\s+|a\s+|an\s+)?(?:[\w-]+\s+)?$/i;
const REMEDY = /\b(?:recommend\w*|suggest\w*|advis\w*|should be|have (?:a|an|the)?\s*(?:licensed|qualified)?\s*electrician|evaluat\w*|repair\w*|replac\w*|correct\w*|install\w*)\b/i;
const LOCATION_FIELD = /^\s*(?:location|loc|area|room|where)\s*[:=-]/i;
const SENTENCE_END = /[.!?](?:\s|$)|\n/g;

const CODE_DEFAULT = new Map(CODE_RULES.map((r) => [r.code as string, r.defaultRoom ?? null]));
const CODE_FIXED = new Map(CODE_RULES.map((r) => [r.code as string, r.fixedRoom ?? null]));

function words(text: string): number {
  return (text.match(/[\w']+/g) ?? []).length;
}

function sentencesBetween(text: string): number {
  return (text.match(SENTENCE_END) ?? []).length;
}

function lineAround(joined: string, at: number): { start: number; end: number } {
  const start = Math.max(joined.lastIndexOf('\n', at - 1), joined.lastIndexOf('\f', at - 1)) + 1;
  let end = joined.slice(at).search(/[\n\f]/);
  end = end === -1 ? joined.length : at + end;
  return { start, end };
}

function add(into: Map<Room, Features>, room: Room, features: Features): void {
  const f = into.get(room) ?? {};
  for (const [k, v] of Object.entries(features)) f[k] = Math.max(f[k] ?? 0, v);
  into.set(room, f);
}

/** A table row's cells by source offsets (pipes, tabs or runs of 3+ spaces; at least 3 cells), or null. */
function rowCells(joined: string, line: { start: number; end: number }): Array<{ start: number; end: number }> | null {
  const text = joined.slice(line.start, line.end);
  const sep = text.includes('|') ? /\|/g : text.includes('\t') ? /\t/g : /\S {3,}\S/.test(text) ? / {3,}/g : null;
  if (!sep) return null;
  const cells: Array<{ start: number; end: number }> = [];
  let from = 0;
  for (const m of text.matchAll(sep)) {
    cells.push({ start: line.start + from, end: line.start + m.index! });
    from = m.index! + m[0].length;
  }
  cells.push({ start: line.start + from, end: line.end });
  const filled = cells.filter((c) => joined.slice(c.start, c.end).trim() !== '').length;
  return cells.length >= 3 && filled >= 2 ? cells : null;
}

const RULE_LINE = /^[\s|+:=-]*$/;
const LOCATION_HEADING = /\b(?:location|room|area|where|place)\b/i;

/** The more candidate sources of the second trial: the previous block's last place, a table row's cells and its column header, a photo caption's place. */
function moreCandidates(
  joined: string,
  finding: Finding,
  blocks: ReadonlyArray<{ start: number; end: number; section: { title: string | null } }>,
  blockIndex: number,
  line: { start: number; end: number },
  places: Map<Room, Features>,
): void {
  // The previous block's last place (not a reference point).
  const prev = blockIndex > 0 ? blocks[blockIndex - 1] : null;
  if (prev) {
    const live = findRooms(joined.slice(prev.start, prev.end)).filter((m) => !m.isReferencePoint);
    const last = live[live.length - 1];
    if (last) add(places, last.room, { prevBlockLast: 1, prevBlockSameSection: prev.section.title === blocks[blockIndex].section.title ? 1 : 0 });
  }
  // A table row: the other cells, with their column's header when the header names a location, and the
  // header over the finding's own cell.
  const cells = rowCells(joined, line);
  if (cells) {
    const own = cells.findIndex((c) => c.start <= finding.start && finding.start <= c.end);
    // The header: the first table row of the run of rows (and rule lines) the finding's row is in.
    let header: Array<{ start: number; end: number }> | null = null;
    let at = line.start;
    for (let k = 0; k < 60 && at > 0; k++) {
      const above = lineAround(joined, at - 1);
      const text = joined.slice(above.start, above.end);
      if (RULE_LINE.test(text)) {
        if (text.trim() === '') break;
      } else {
        const c = rowCells(joined, above);
        if (!c || c.length !== cells.length) break;
        header = c;
      }
      at = above.start;
    }
    cells.forEach((c, k) => {
      if (k === own) return;
      const headText = header ? joined.slice(header[k].start, header[k].end) : '';
      for (const m of findRooms(joined.slice(c.start, c.end))) {
        if (m.isReferencePoint) continue;
        add(places, m.room, { rowCell: 1, rowLocationCell: LOCATION_HEADING.test(headText) ? 1 : 0 });
      }
    });
    if (header && own !== -1) {
      for (const m of findRooms(joined.slice(header[own].start, header[own].end))) if (!m.isReferencePoint) add(places, m.room, { columnHeader: 1 });
    }
  }
  // A photo caption within three lines after the finding's line (or the line itself when it is one).
  let at = line.start;
  for (let k = 0; k < 4 && at < joined.length; k++) {
    const l = lineAround(joined, at);
    if (isCaption(joined, { start: l.start, end: l.end })) {
      for (const m of findRooms(joined.slice(l.start, l.end))) if (!m.isReferencePoint) add(places, m.room, { caption: 1, captionNear: 1 / (1 + k) });
    }
    at = l.end + 1;
  }
}

export interface PlaceOptions {
  /** The second trial's extra candidate sources (`moreCandidates`). */
  readonly more?: boolean;
}

/** Every finding of one report with its candidate places. */
export function findingPlaces(joined: string, findings: readonly Finding[], options: PlaceOptions = {}): FindingPlaces[] {
  const blocks = splitBlocks(joined).map((b) => ({ ...sourceRange(b.text), section: b.section }));
  const sameSentence = new Map<string, number>();
  for (const f of findings) sameSentence.set(`${f.start}:${f.code}`, (sameSentence.get(`${f.start}:${f.code}`) ?? 0) + 1);
  return findings.map((finding) => {
    let blockIndex = blocks.findIndex((b) => b.start <= finding.start && finding.start < b.end);
    if (blockIndex === -1) blockIndex = blocks.map((b) => b.start <= finding.start).lastIndexOf(true);
    const block = blockIndex === -1 ? null : blocks[blockIndex];
    const places = new Map<Room, Features>();
    const line = lineAround(joined, finding.start);
    const sentenceHasRemedy = REMEDY.test(finding.evidence);
    // The sentence itself.
    const inSentence = findRooms(finding.evidence);
    const live = inSentence.filter((m) => !m.isReferencePoint);
    inSentence.forEach((m) => {
      const before = finding.evidence.slice(Math.max(0, m.start - 24), m.start);
      add(places, m.room, {
        sentence: m.isReferencePoint ? 0 : 1,
        sentenceReference: m.isReferencePoint ? 1 : 0,
        sentenceFirst: live[0] === m ? 1 : 0,
        sentenceLast: live[live.length - 1] === m ? 1 : 0,
        sentenceLead: m.start < 3 ? 1 : 0,
        prepIn: IN_WORD.test(before) ? 1 : 0,
        prepNear: NEAR_WORD.test(before) ? 1 : 0,
        nearSentenceStart: 1 / (1 + words(finding.evidence.slice(0, m.start)) / 5),
        remedySentence: sentenceHasRemedy ? 1 : 0,
      });
    });
    if (block) {
      // The rest of the block: before the sentence (nearest first) and after it.
      const beforeText = joined.slice(block.start, finding.start);
      for (const m of findRooms(beforeText)) {
        if (m.isReferencePoint) continue;
        const gap = beforeText.slice(m.end);
        const sentenceOfMention = beforeText.slice(Math.max(0, beforeText.lastIndexOf('.', m.start) + 1), m.end + 60);
        add(places, m.room, {
          blockBefore: 1,
          blockBeforeNear: 1 / (1 + sentencesBetween(gap)),
          blockBeforeWords: 1 / (1 + words(gap) / 10),
          blockFirst: words(beforeText.slice(0, m.start)) <= 3 ? 1 : 0,
          sameLine: m.start >= line.start - block.start ? 1 : 0,
          locationField: LOCATION_FIELD.test(beforeText.slice(Math.max(0, beforeText.lastIndexOf('\n', m.start) + 1), m.start + 1)) ? 1 : 0,
          beforeRemedy: REMEDY.test(sentenceOfMention) ? 1 : 0,
        });
      }
      const afterText = joined.slice(finding.end, block.end);
      for (const m of findRooms(afterText)) {
        if (m.isReferencePoint) continue;
        const lineStart = afterText.lastIndexOf('\n', m.start) + 1;
        add(places, m.room, {
          blockAfter: 1,
          blockAfterNear: 1 / (1 + sentencesBetween(afterText.slice(0, m.start))),
          sameLine: finding.end + m.start <= line.end ? 1 : 0,
          locationField: LOCATION_FIELD.test(afterText.slice(lineStart, m.start + 1)) ? 1 : 0,
        });
      }
      // The heading above.
      if (block.section.title) {
        const fromTitle = findRooms(block.section.title).filter((m) => !m.isReferencePoint);
        for (const m of fromTitle) add(places, m.room, { heading: 1, headingOnly: fromTitle.length === 1 ? 1 : 0 });
      }
      if (block.section.room) add(places, block.section.room, { sectionRoom: 1, [`sectionKind:${block.section.kind}`]: 1 });
      if (options.more) moreCandidates(joined, finding, blocks, blockIndex, line, places);
    }
    const code = finding.code as string;
    const usual = CODE_DEFAULT.get(code);
    if (usual) add(places, usual, { codeDefault: 1 });
    const fixed = CODE_FIXED.get(code);
    if (fixed) add(places, fixed, { codeFixed: 1 });
    add(places, finding.room, { parser: 1, [`parser:${finding.confidence ?? 'exact'}`]: 1, parserLocation: finding.location ? 1 : 0 });
    add(places, 'whole-house', {});
    add(places, 'unknown', {});
    const sentenceNamesPlace = live.length > 0 ? 1 : 0;
    const blockNamesPlace = [...places.values()].some((f) => f.blockBefore || f.blockAfter || f.heading) ? 1 : 0;
    const candidates = [...places].map(([room, f]) => ({
      room,
      features: {
        ...f,
        // The two special answers, with whether anything else was named (a linear model needs the pairs).
        [`is:${room === 'whole-house' || room === 'unknown' || room === 'panel' ? room : 'room'}`]: 1,
        ...(room === 'whole-house' || room === 'unknown' ? { [`${room}:sentenceNamesPlace`]: sentenceNamesPlace, [`${room}:blockNamesPlace`]: blockNamesPlace } : {}),
      },
    }));
    return { finding, candidates, isListed: (sameSentence.get(`${finding.start}:${finding.code}`) ?? 0) > 1 };
  });
}
