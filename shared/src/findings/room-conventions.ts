import { clauseIndexAt, type Range } from './clause-splitter';
import type { CodeMatch } from './code-matcher';
import { evaluationTarget } from './evaluation-target';
import { findRooms } from './room-lexicon';
import type { Room } from './room';
import type { Placement } from './room-resolver';

/**
 * The lead's room conventions (seventh round), from where the electrician goes to do the work:
 * - a defect at the grounding electrode itself outdoors (the rod, its clamp, the conductor where it
 *   meets the rod) is `exterior`; at or in a panel, or when the text does not say where, `panel`;
 * - a subpanel's defects are `panel` wherever the subpanel is; the electrode a separately fed
 *   building lacks is its subpanel's;
 * - an overcurrent device in an outdoor disconnect (A/C, heat pump, pool, spa) is `exterior`;
 * - a missing alarm stated for the house as a whole is `whole-house`, even when the remedy names a room.
 * Applied to the places `placeMatches` gives, one sentence at a time.
 */
export interface ConventionContext {
  /** The room of the section heading, if it names one. */
  readonly sectionRoom: Room | null;
  /** The sentence before in the same block ("The fused disconnect ... is fused at 45 A. The data plate states MAX FUSE 30 A."). */
  readonly previousText: string;
}

/** A rod named as the place of the defect: "at the ground rod", "@ rod", "above the rod", "the rod clamp", "wrapped around the rod". */
const AT_ROD =
  /\b(?:at|@|on|off|above|near|beside|next to|around|by|from|into|in)\s+(?:the\s+)?(?:top of (?:the\s+)?)?(?:(?:ground(?:ing)?|grnd|gnd|driven|electrode|generator|copper|the)\s+)*rods?\b|(?:^|[\s(])@\s*(?:the\s+)?(?:ground\s+)?rod\b|\b(?:ground(?:ing)?\s+|grnd\s+)?rod(?:'s)?\s+clamps?\b|\bacorn\s+clamps?\b|\bclamps?\s+(?:at|on|@)\s+(?:the\s+)?(?:ground(?:ing)?\s+|grnd\s+)?rod\b|^\s*(?:[\w.()-]+\s+){0,3}ground(?:ing)?\s+rod\b[^:]{0,40}:/i;
/** A rod that is not there: the electrode is missing, so the defect is the system's, not the rod's. */
const ROD_MISSING =
  /\b(?:no|without)\s+(?:[\w-]+\s+){0,3}rods?\b|\brods?\b[^.;]{0,60}\b(?:not (?:be\s+)?(?:found|located|visible|present|observed)|could not be (?:found|located)|none)\b|\bcould(?:\s+not|n'?t)\s+(?:find|locate)\b[^.;]{0,40}\brods?\b/i;
/** A panel, its bars or lugs named in the sentence: the defect is at the panel end. */
const AT_PANEL = /\b(?:sub-?\s?)?pan+el(?:board)?s?\b|\bpnl\b|\blugs?\b|\b(?:neutral|ground(?:ing)?|grnd)\s+(?:bar|bus)\b|\benclosure\b|\b(?:service|main)\s+disconnect\b|\bload cent(?:er|re)\b/i;
/** A separately fed building or a subpanel: its grounding electrode belongs to its subpanel (NFPA 70 (NEC) 2023, 250.32(A)). */
const SEPARATE_BUILDING =
  /\b(?:detached|separate)\s+(?:building|structure|garage|shop|workshop|barn|studio)\b|\bdet\.?\s*(?:bldg|building|gar(?:age)?|shop)\b|\boutbuildings?\b|\bsub-?\s?pan+els?\b|\bfed by a feeder\b/i;

/** An overcurrent device in a disconnect outdoors ("the fused disconnect beside the condenser", "A/C disc (ext)", "breaker in the spa disconnect"). */
const OUTDOOR_DISCONNECT =
  /\b(?:fused\s+|pull-?out\s+|non-fused\s+|(?:a\/?c|ac|condenser|heat pump|hp|pool|spa|hot tub|pump)\s+)(?:disconnect|disconect|disc\b\.?)|\b(?:disconnect|disconect)\s+(?:box\s+)?(?:beside|next to|at|by|near|on)\s+(?:the\s+)?(?:[\w-]+\s+){0,2}(?:unit|condenser|compressor|heat pump|pool|spa|hot tub|pad|patio|pump)\b/i;
/** A disconnect that is the service's or a panel's (those devices are at the panel). */
const PANEL_DISCONNECT = /\b(?:main|service)\s+(?:disconnect|disc\b)|\b(?:in|at)\s+(?:the\s+)?(?:main\s+|distribution\s+|electrical\s+)?(?:sub-?\s?)?pan+el\b/i;

/**
 * Ninth round: a disconnect named without saying whose ("the disconnect", "Disconnect on the wall", "DISCO")
 * next to an appliance that stands outdoors, and a generator's own breaker (standby and portable
 * generators stand outside; common practice).
 */
const BARE_DISCONNECT = /(?<!\b(?:main|service|utility)\s)\b(?:disconnect|disconect|disco)\b(?!\s+(?:switch\s+)?(?:in|at)\s+(?:the\s+)?(?:main\s+)?pan+el)/i;
const OUTDOOR_APPLIANCE = /\b(?:hot tub|spa|pool(?: pump)?|condenser|heat pump|a\/c unit|compressor)\b/i;
const GENERATOR_BREAKER =
  /\bgenerator(?:'s|s)?\s+(?:own\s+)?(?:output\s+|main\s+|built-in\s+)?(?:circuit\s+)?breaker\b|\bbreaker\s+(?:on|in|at)\s+(?:the\s+)?generator\b/i;

/** Whether an oversized device is in a disconnect the sentence or the one before puts beside an outdoor appliance, or is a generator's own. */
export function inOutdoorEquipment(sentence: string, previous: string): boolean {
  if (GENERATOR_BREAKER.test(sentence)) return true;
  const both = `${previous}\n${sentence}`;
  return BARE_DISCONNECT.test(both) && OUTDOOR_APPLIANCE.test(both) && !PANEL_DISCONNECT.test(sentence);
}

/** An alarm stated for the house as a whole ("no CO alarm anywhere in the house", "none in the cabin at all"). */
const HOUSE_WIDE_ALARM =
  /\banywhere\b(?!\s+(?:in|on)\s+(?:the\s+)?(?:basement|attic|garage|lower|upper|upstairs|downstairs|first|second|third|main|bedroom|level|floor))|\bin\s+the\s+(?:house|home|unit|cabin|dwelling|residence|apartment|condo|camp|cottage)\b(?:\s+at all)?|\bat all\b(?!\s+(?:in|on)\s+(?:the\s+)?(?!house|home|unit|cabin|dwelling)\w)/i;
/** A carbon monoxide alarm "none found": CO alarms go by dwelling and level, not room, so a bare "none" is house-wide. */
const CO_NONE = /\b(?:co|carbon monoxide)(?:\s+(?:alarms?|detectors?|alms?))?\s*[:-]?\s*(?:none|not)\s+(?:found|present|installed|observed|seen)\b/i;
/** Where the remedy starts: the rooms after it are where to install, not where the defect is. */
const REMEDY = /\s*(?:->|=>|[;:]\s*(?=install|add|recommend)|\b(?:install|add|recommend|place|put|mount|one should|should be|needs? (?:one|to be)|we recommend)\b)/i;

function clauseOf(text: string, clauses: readonly Range[], at: number): string {
  if (clauses.length === 0) return text;
  const c = clauses[clauseIndexAt(clauses, at)];
  return text.slice(c.start, c.end);
}

/**
 * Twelfth round: a panel named only as where the inspector was going ("While walking to the panel I
 * found the grounding electrode conductor loose next to the rod") is no place of the defect.
 */
const ON_THE_WAY_TO = /\b(?:walking|walked|heading|headed|going|went|on (?:my|our|the) way)\s+(?:back\s+)?(?:to|toward|towards)\s+(?:the\s+)?(?:main\s+)?(?:sub-?\s?)?pan+el\b/gi;

/** The room a grounding or bonding defect goes to under the conventions, or null to keep the placement's. */
export function groundingRoom(sentence: string, clause: string, room: Room): Room | null {
  if (room === 'exterior') return null;
  if (AT_ROD.test(clause) && !ROD_MISSING.test(clause) && !AT_PANEL.test(sentence.replace(ON_THE_WAY_TO, ''))) return 'exterior';
  if (room !== 'panel' && SEPARATE_BUILDING.test(sentence)) return 'panel';
  return null;
}

/** Whether an oversized device is in an outdoor disconnect (its sentence, or the one before that named the device). */
export function inOutdoorDisconnect(sentence: string, previous: string): boolean {
  const said = (t: string) => OUTDOOR_DISCONNECT.test(t) && !PANEL_DISCONNECT.test(t);
  return said(sentence) || (said(previous) && !PANEL_DISCONNECT.test(sentence));
}

/** Whether a missing alarm is stated for the house as a whole (the remedy's rooms aside). */
export function alarmIsHouseWide(clause: string, sectionRoom: Room | null, room: Room): boolean {
  if (room === 'whole-house') return false;
  const cut = REMEDY.exec(clause);
  const defect = cut && cut.index > 0 ? clause.slice(0, cut.index) : clause;
  const named = findRooms(defect).some((r) => !r.isReferencePoint && r.room !== 'whole-house');
  if (named) return false;
  if (HOUSE_WIDE_ALARM.test(defect)) return true;
  return CO_NONE.test(defect) && sectionRoom !== room;
}

/** The placements of one sentence's matches brought to the conventions. */
export function applyRoomConventions(
  text: string,
  matches: readonly CodeMatch[],
  placements: readonly Placement[][],
  clauses: readonly Range[],
  context: ConventionContext,
): Placement[][] {
  return placements.map((places, i) => {
    const match = matches[i];
    const code = match.rule.code;
    if (code === 'grounding-electrode') {
      const clause = clauseOf(text, clauses, match.start);
      return places.map((p) => {
        const room = groundingRoom(text, clause, p.room);
        return room ? { ...p, room } : p;
      });
    }
    if (code === 'overcurrent-mismatch' && (inOutdoorDisconnect(text, context.previousText) || inOutdoorEquipment(text, context.previousText))) {
      return places.map((p) => (p.room === 'panel' ? { ...p, room: 'exterior' as Room } : p));
    }
    // Every weather-cover label of the corpus (127) is outside: the cover is for a wet location (NFPA 70 (NEC) 2023, 406.9(B)).
    if (code === 'weather-cover-missing') return places.map((p) => (p.room === 'exterior' ? p : { ...p, room: 'exterior' as Room }));
    if (code === 'evaluate-general' && evaluationTarget(text, match.start)?.isPanel === true) {
      return places.map((p) => ({ ...p, room: 'panel' as Room }));
    }
    if (code === 'smoke-co-alarm' && places.length === 1 && alarmIsHouseWide(clauseOf(text, clauses, match.start), context.sectionRoom, places[0].room)) {
      return [{ ...places[0], room: 'whole-house' as Room, location: '' }];
    }
    return places;
  });
}

/** A remedy that installs one alarm ("Install one CO alarm in the hall", "recommend installing a CO alarm", "install min 1"). */
const ONE_ALARM_REMEDY =
  /\b(?:install(?:ing|ed)?|add(?:ing|ed)?|place|mount|needs?|requires?)\s+(?:(?:at least|a minimum of)\s+)?(?:a|one|1|a single)\s+(?:[\w/-]+\s+){0,2}(?:alarms?|detectors?|alms?)\b(?![^.;]{0,60}\b(?:each|every|per|all)\b)|\binstall\s+min(?:imum)?\.?\s*(?:of\s+)?(?:1|one)\b|\b(?:install|put|add|place|mount)\s+(?:a single|one|1)\s+(?:in|near|outside|on|at)\b/i;

/**
 * The count of an alarm missing house-wide: the number its remedy installs when that is one (the
 * writers' rule for a singular named device, issue 10), else none ("install CO alarms on each level").
 * `after` is the sentence's text after the defect and the next sentence of the block.
 */
export function houseWideAlarmCount(after: string): 1 | null {
  return ONE_ALARM_REMEDY.test(after) ? 1 : null;
}
