import type { FindingCode } from './finding-code';
import type { Room } from './room';
import { adjGap, anyGap, gap, PROTECTION_FILLER as PF, rx, T } from './term-lexicon';

/**
 * The phrase table: for every finding code, the phrasings that state the defect. This is the one
 * place where a new code or a new phrasing is added (see docs/parser.md). Phrases are written in
 * the positive ("no GFCI", "reversed polarity"); negations ("no reversed polarity observed") are
 * handled by negation-detector.ts, rooms by room-lexicon.ts and counts by quantity-reader.ts.
 */
export interface CodePattern {
  readonly re: RegExp;
  /** Whether the phrase only recommends the correction ("recommend GFCI protection"). */
  readonly isRecommendation?: boolean;
  /** The sentence must also contain this for the phrase to count (e.g. a panel word). */
  readonly context?: RegExp;
  /** The phrase does not count when its sentence contains this. */
  readonly unless?: RegExp;
  /** Extra test on the match, e.g. the breaker really is larger than the wire allows. */
  readonly check?: (match: RegExpExecArray) => boolean;
}

export interface CodeRule {
  readonly code: FindingCode;
  /**
   * Words every phrase of the code contains (at least one of them). Sentences without any are
   * skipped for speed; code-matcher.spec.ts checks on the corpus that skipping changes nothing.
   */
  readonly trigger: RegExp;
  readonly patterns: readonly CodePattern[];
  /** Recommendation-only matches of this code are dropped when the sentence has one of these codes. */
  readonly yieldsTo?: readonly FindingCode[];
  /** This code's findings give way to a finding of one of these codes for the same place in the same sentence. */
  readonly yieldsInSentenceTo?: readonly FindingCode[];
  /** This code's findings give way to a finding of one of these codes for the same place in the same block. */
  readonly yieldsInBlockTo?: readonly FindingCode[];
  /** Room used whatever the text says (panel defects are at the panel). */
  readonly fixedRoom?: Room;
  /** Room used when neither the text nor the section names one. */
  readonly defaultRoom?: Room;
  /**
   * Whether a panel named with the defect is its place ("no grounding electrode conductor at the
   * panel"); for other codes a panel beside the defect is only a reference point.
   */
  readonly panelIsPlace?: boolean;
  /** Whether a place named anywhere in the sentence (a later clause too) is the finding's place before context. */
  readonly placeAnywhereInSentence?: boolean;
  /** Whether the room comes only from the sentence itself or the default (never from earlier sentences or the heading). */
  readonly ignoresContext?: boolean;
  /**
   * Whether the code is a condition of the house's wiring as a whole (aluminum branch wiring): the
   * places a sentence names are where it was seen, not its extent, unless the sentence limits it
   * ("only in the garage", "within the addition", "throughout the basement").
   */
  readonly isHouseWide?: boolean;
  /** Whether the code stands only in a block (item or paragraph) with no other finding. */
  readonly isFallbackOnly?: boolean;
}

const ADJ_GAP = adjGap(3);
/** Words between a switch and what is said of it, commas allowed ("The switch for the disposal, right of the sink, is loose"). */
const SWITCH_GAP = String.raw`(?:(?!${'(?:switch|light|fixture|receptacle|outlet|plates?\b|covers?\b)'})[\w'/#().-]+,?\s+){0,12}?`;
/** A switch or dimmer named by the light it controls ("the dimmer for the chandelier is hot"): the switch is the subject. */
const SWITCH_FOR_LIGHT = /\b(?:switch(?:es)?|dimmers?)\s+(?:that\s+)?(?:for|controlling|controls|serving|operating)\b/i;
/** A flexible cord: extension, lamp or zip cord. */
/** A cable made to run under ground or outdoors: what is wrong with it is its exposure (common practice). */
const OUTDOOR_CABLE = String.raw`(?:(?:uf|underground|direct[- ]burial|feeder|(?:well\s+|submersible\s+)?pump|well|(?:boat\s+)?lift|dock|outdoor|exterior|yard|landscape)\s+(?:\w+\s+)?(?:cables?|wir(?:e|es|ing)|conductors?|feeders?)\b)`;
const FLEX_CORD = String.raw`(?:extension|lamp|zip|flexible|appliance)\s+cords?`;
const RECOMMEND = String.raw`(?:recommend(?:ed|s|ing)?|suggest(?:ed)?|should (?:be|have)|install(?:ing|ed)?|upgrad(?:e|ed|ing) to|add(?:ing)?|need(?:s|ed)?|requires?|consider(?:ing)?|have the)`;
/** Words that turn a recommendation into one about an existing device (replace, test, reset). */
/** A repair asked for as a noun, the way buyers' addenda and attorneys' letters list them ("Installation of GFCI protection at ..."). */
const REQUEST_NOUN = String.raw`(?:installation|addition|provision)\s+of`;
const NOT_ABOUT_ADDING = String.raw`(?:(?!replac|repair|reset|test|check)[\w-]+\s+){0,4}?`;
/** A light that is part of an appliance (range hood, oven, refrigerator, opener) is not a light fixture. */
const NOT_APPLIANCE = String.raw`(?<!\b(?:hood|range|oven|microwave|refrigerator|fridge|freezer|opener|appliance|exhaust fan)\s)`;
/** A general evaluation that is conditional or points at items listed elsewhere ("all of the above") is not a finding of its own. */
const REFERS_TO_OTHERS = /\bif\b|\bany\b|\bshould any\b|\babove\b|\bbelow\b|\bfollowing\b|\bthese\b|\bthis section\b|\b(?:items?|conditions?|defects?|deficiencies) (?:in|of|listed|noted)\b|\blisted\b|\bmarked\b|\bitems\b|\bitem \d|\bdeficien\w*|\b(?:repairs|corrections)\s+(?:should|shall|must|are|to|by)\b|\bthe cause\b|\baffected\b/i;
/**
 * A general evaluation of the whole system ("evaluate the entire electrical system", "a full
 * evaluation of the wiring") is its own item beside a block's specific defects: its scope is the
 * house, not the defect before it (common practice). One that names a wiring method or "these"
 * repairs is that finding's recommendation.
 */
export const WHOLE_SYSTEM = /^(?![\s\S]*\b(?:alumin\w*|knob|k&t|legacy|these|those)\b)[\s\S]*?(?:\b(?:entire|whole|full|complete|comprehensive|overall)\s+(?:[\w-]+\s+){0,2}?(?:system|house|home|wiring|evaluation|review)\b|\bevaluate the (?:electrical )?system\b)/i;
/** An evaluation that points at other items, unless it is of the whole system ("so that any hidden conditions can be priced"). */
const REFERS_TO_OTHERS_ONLY = new RegExp(`^(?![\\s\\S]*(?:${WHOLE_SYSTEM.source}))[\\s\\S]*?(?:${REFERS_TO_OTHERS.source})`, 'i');
const PANEL_CONTEXT = /panel|\bpnl\b|dead[- ]?front|load cent|breaker box|fuse box|enclosure|\bcabinet\b|\bko\b.{0,20}\bcan\b/i;
/** A bare "cover" next to a junction box is the box's cover, not a device cover plate. */
const JBOX_WORD = /junction|j-?\s?box|(?<!\b(?:switch|device|outlet|receptacle|inside the|in the|within the|into the)\s)\bbox(?:es)?\b/i;
/** Old wiring that is out of service (common practice: only energized knob-and-tube is reported as a condition). */
const WIRING_OUT_OF_USE = /\b(?:not energized|de-?energized|abandoned|tested dead|no longer (?:in use|energized|active|in service)|(?:was|were|has been|have been) (?:removed|replaced)|(?:was|were|been) cut|cut (?:out|loose|off|back)|(?:came|taken|pulled|ripped) out|(?:nothing|not|none) (?:was |is )?(?:live|hot|energized)|(?:showed|read|detected) (?:nothing|no voltage)|(?:didn[’']?t|did not|could not|couldn[’']?t) find any|none (?:left|remaining|found in use|in use))\b/i;
/** A smoke/CO alarm, or a "Smoke:" / "CO:" label standing for it in shorthand. */
/** Old cable that is not knob-and-tube: at a receptacle it is an open ground; out of use it is history (WIRING_OUT_OF_USE). */
const OLD_CABLE_NOT_KT = new RegExp(String.raw`\b(?:recep\w*|rcpts?|outlets?|three[- ](?:slot|prong)|3[- ](?:slot|prong)|grounded cable|patchwork|mix|\d{1,2}\s*awg)\b|${WIRING_OUT_OF_USE.source}`, 'i');
const SMOKE_OR_LABEL = String.raw`(?:${T.SMOKE}|(?:smoke|co)(?:\s*(?:\/|and|&)\s*co)?\s*:)`;
/** An alarm past its service life: expired, end of life, chirping, older than ten years. */
const SMOKE_AGED = String.raw`(?:expired|end[- ]of[- ]life|chirp(?:s|ed|ing)?\b|(?:past|beyond|exceed(?:s|ed|ing)?|over|outlived|older than)\s+(?:(?:the|their|its|a|his|her)\s+)?(?:(?:\d+|ten)[- ]?(?:year|yr)s?\b|(?:recommended\s+|expected\s+|normal\s+)?(?:service|useful|rated)\s+life|life\s*span|expiration|replacement (?:age|date)))`;
/** A service part said to be sound ("secure, no damage observed", "ok"): a condition word after it is about something else. */
const SERVICE_SOUND = /\b(?:otherwise (?:secure|sound|ok)|(?:no|without) (?:damage|deficiencies|defects|corrosion|rust)|satisfactory|serviceable)\b/i;
/** "8 ft above the deck surface", "about a foot and a half above the roof". */
const CLEARANCE = String.raw`(?:only\s+|approx(?:imately|\.)?\s+|about\s+|roughly\s+|~\s?)?(\d+(?:\.\d+)?|a|one|two|three|four|five|six|seven|eight|nine)\s*(?:ft\b\.?|feet|foot|')(?:\s+(?:and\s+a\s+half|\d+\s*(?:in|inches|")))?\s+(?:above|over|from|off)\s+(?:the\s+)?(?:(?:rear|back|front|side|upper|lower|flat)\s+)?(roof|deck|walkway|walk|sidewalk|driveway|drive|grade|ground|yard|patio|pool|porch|balcony)`;
const CLEARANCE_WORDS: Readonly<Record<string, number>> = { a: 1, one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9 };
/** NFPA 70 (NEC) 2023, 230.24(A) and (B) (from memory): the least clearance above each surface, in feet. */
export const SERVICE_CLEARANCE_FT: Readonly<Record<string, number>> = {
  roof: 3, deck: 10, walkway: 10, walk: 10, sidewalk: 10, grade: 10, ground: 10, yard: 10, patio: 10, pool: 10, porch: 10, balcony: 10, driveway: 12, drive: 12,
};
/** The same check with the surface captured before the distance ("clearance above the deck is 8 ft"). */
function isTooLowSurfaceFirst(m: RegExpExecArray): boolean {
  return Number(m[2]) < SERVICE_CLEARANCE_FT[m[1].toLowerCase()];
}
function isTooLow(m: RegExpExecArray): boolean {
  const value = CLEARANCE_WORDS[m[1].toLowerCase()] ?? Number(m[1]);
  return value < SERVICE_CLEARANCE_FT[m[2].toLowerCase()];
}
/** Text in one clause that does not name another device (whose cover would be a cover plate). */
const NOT_ANOTHER_DEVICE = String.raw`(?:(?!${T.RCPT}|${T.SWITCH}|light|fixture|panel|breaker)[^.;!?]){0,80}?`;
/** A box named by what it feeds ("a junction box feeding the shop lights"): the box is the subject, not the lights. */
const BOX_FEEDING = /\b(?:junction|j-?\s?box|splice box)\b[^.;]{0,20}?\b(?:feeding|feeds|serving|serves|supplying|supplies|for)\b/i;
/** A box left open: no cover or lid, or its splices or conductors in view. */
const BOX_UNCOVERED = String.raw`\b(?:no|missing|without|lacks?|lacking)\s+(?:a\s+|its\s+|the\s+|any\s+)?(?:blank\s+)?(?:covers?|lids?)\b(?!\s*plates?|\s+(?:on|for|at)\s+(?:the\s+|an?\s+)?(?:[\w-]+\s+)?(?:${T.RCPT}|${T.SWITCH}|light))|\b(?:covers?|lids?)\s+(?:is\s+|are\s+)?(?:missing|absent|off|removed)\b|\b(?:splices?|wire nuts?|conductors?|connections?)\s+(?:are\s+|is\s+)?(?:visible|showing|exposed|accessible)\b`;
/** Words between a light and its condition: no other device. */
const LIGHT_GAP = String.raw`(?:(?!${T.RCPT}|${T.SWITCH}|fans?\b|panel|breaker|box(?:es)?\b|cords?\b|wir(?:e|es|ing)\b|cables?\b|smoke|alarms?\b)[\w'/#().@:-]+,?\s+){0,10}?`;
const LIGHT_CONDITION = String.raw`(?:loose\b(?!-)|dead\b|hang(?:s|ing)\s+(?:by|from)\s+(?:its|the|their)\s+wires\b|(?:has\s+)?water\s+in|rust(?:ed|ing|y)?\b|corroded|cracked|broken|damaged|scorched|melted|dangl(?:es|ing)|(?:does|did)\s*n[o']t\s+(?:light|work|come on|turn on)|${T.INOPERATIVE})`;
/** Words between a receptacle and its condition: no other device, no clause-ending comma. */
const RCPT_GAP = String.raw`(?:(?!${T.SWITCH}|light|fixture|panel|breaker|cords?\b|plates?\b|covers?\b|gfc?i|wir(?:e|es|ing)\b|cables?\b)[\w'/#().@:-]+\s+){0,12}?`;
/** What goes wrong with a receptacle (common practice): heat, damage, looseness, no power. */
const RCPT_CONDITION = String.raw`(?:(?:is|are|was|were|felt|feels?|runs?|ran|running)\s+(?:(?:noticeably|very|slightly)\s+)?(?:warm|hot)\b(?!\s+(?:and|&|\/)\s+neutral)|(?:warm|hot)\s+to\s+the\s+touch|discolou?red|scorched|burn(?:ed|t)|melted|charred|cracked|broken|damaged|loose\s+(?:in|from|at)\b|hanging\s+(?:out|loose|from)|pulled\s+(?:out|away)|(?:had\s+|has\s+)?no\s+power\b|dead\b|${T.INOPERATIVE})`;
/** Receptacles dead because the GFCI before them failed (common practice: that is the GFCI's defect). */
const DEAD_BEHIND_GFCI = /\bdownstream\b[^.;]{0,40}\b(?:dead|no power|without power)\b|\b(?:gfc?i|ground[- ]fault)\b[^.;]{0,30}\b(?:dead|no power)\b.{0,40}\breset\b|\b(?:gfc?i|ground[- ]fault)\b[^.;]{0,60}\b(?:will not|won't|does not|doesn't|did not|fails? to|failed to)\s+reset\b/i;
/** Words between a cable and its condition: not another device, whose condition it would be. */
const WIRE_GAP = String.raw`(?:(?!${T.RCPT}|${T.SWITCH}|light|fixture|box(?:es)?\b|panel|breaker|cords?\b|service|meter)[\w'/#().@-]+,?\s+){0,10}?`;
/** A cable said to be secured, or the cable of a splice or fixture (an open splice, a hanging fixture is that defect). */
const WIRE_SOUND_OR_OTHER = /\b(?:properly|neatly|adequately|well) (?:secured|supported|protected|stapled|strapped)\b|\bsplices?\b|\bwire nuts?\b|\b(?:chandelier|fixture|luminaire|pendant)s?\b|\bservice[- ]entrance\b|\bse cable\b|\bservice (?:drop|conductors?|cable)\b|\b(?:junction|j-?\s?box|jbox)\w*\b[^.;]{0,50}\bwires?\s+(?:are\s+)?(?:hanging|dangling|exposed|visible|pulled)/i;
/**
 * Service cable (its own code), or wires hanging out of an open box (that box's defect, NFPA 70 (NEC)
 * 2023, 314.25): "Open junction box over the bench, wires hanging".
 */
const SERVICE_OR_BOX_WIRES = /\bservice[- ]entrance\b|\bse cable\b|\bservice (?:drop|conductors?|cable)\b|\b(?:junction|j-?\s?box|jbox)\w*\b[^.;]{0,50}\bwires?\s+(?:are\s+)?(?:hanging|dangling|exposed|visible|pulled)/i;
/** What goes wrong with a cable run (common practice): not secured, not protected, within reach of damage. */
const WIRE_CONDITION = String.raw`(?:(?:run|runs|running|left)\s+(?:bare|exposed|unprotected)\b|exposed to (?:physical )?damage|subject to (?:physical )?damage|unprotected|unsecured|unsupported|unstapled|(?:has\s+)?(?:come|came|coming|pulled|pulling) (?:loose|free|away)|(?:not|never) (?:clamped|secured|supported|stapled|strapped|fastened|protected)|loose\b|hang(?:s|ing)\b|dangl(?:es|ing)|draped|(?:hanging\s+)?in loops)`;
/** A part of the grounding electrode system or of piping bonding (NFPA 70 (NEC) 2023, 250.50, 250.104). */
const GROUND_PART = String.raw`(?:ground(?:ing)? electrode(?: conductor| system)?|ges\b|gec\b|(?:ground(?:ing)?|electrode)\s+(?:rods?|clamps?|wires?|conductors?)\b|(?:main\s+)?(?:water|gas|csst)(?:\s+(?:pipe|piping|line|main|service))?\s+bond(?:ing)?(?:\s+(?:jumper|clamp|wire|conductor|connection))?\b|bond(?:ing)?\s+(?:jumpers?|clamps?|conductors?|wires?|connections?)\b|acorn clamp)`;
/** What goes wrong with a grounding or bonding part (common practice). */
const GROUND_CONDITION = String.raw`(?:loose|corroded|(?:heavy|severe|some)?\s*corrosion|rust(?:ed|y)|disconnected|detached|cut(?: off)?|broken|damaged|missing|slipping off|pulled (?:off|loose|free)|(?:not|un)[- ]?(?:connected|attached|bonded|secured|clamped)|undersized|painted over|(?:appears? to )?(?:have|has) been removed|removed)\b`;
const COVER_OFF_TO_INSPECT = /\bremoved\s+(?:by\s+(?:the\s+)?inspector\s+)?(?:for|to|during|so|when|while)\b|\bwith\s+(?:the\s+)?(?:dead[- ]?front|(?:panel\s+)?cover)(?:\s+cover)?\s+(?:was\s+)?(?:removed|off)\b|\b(?:was|were)\s+removed\.?$|\b(?:dead[- ]?front|(?:panel\s+)?cover)\s+removed\s*(?::|\s-+\s|[.;]?\s*$)|\bremoved\b[^.;]{0,40}\b(?:looked at|examined|inspected|checked|evaluated|viewed)\b|\bonly\b[^.;]{0,40}\b(?:is|are)\s+removed\b|\bremoved\b[^.;]{0,30}\bwhen\b[^.;]{0,20}\bsafe\b/i;
/** A statement that the arrangement is right ("correct", "as permitted", "ok"), not negated ("not correct"). */
const CORRECT_AT_SERVICE = /(?<!\bnot\s)\b(?:correct(?:ly)?|permitted|proper(?:ly)?|acceptable|allowed|ok|okay|normal|appropriate|(?:like|as) (?:they|it) should be)\b|\b(?:is|serves as|being|acts as)\s+(?:the\s+)?(?:service (?:disconnect|equipment|panel)|main (?:service\s+)?(?:panel|disconnect)|first (?:means of )?disconnect)\b/i;
const SUBPANEL_CONTEXT = /sub-?\s?panel|secondary panel|remote panel|downstream|distribution panel|feeder/i;

export const CODE_RULES: readonly CodeRule[] = [
  {
    code: 'gfci-missing',
    trigger: /gfc?i|gcfi|ground[- ]fault|protected circuit/i,
    yieldsTo: ['gfci-inoperative', 'open-ground', 'false-ground', 'knob-and-tube'],
    patterns: [
      // "no GFCI or breaker was tripped": a look for a tripped device, not a missing protection.
      { re: rx`(?:${T.NO}|not|non-?|none|(?:is|are|was|were)n[’']?t|neither\s+${anyGap(8)}(?:has|have|had|is|are|was|were))\s*${PF}${T.GFCI}(?!\s+(?:or\s+(?:\w+\s+)?breaker\s+)?(?:was|were|had been|has been)\s+tripped)` },
      // "... they are not protected, I tested them with my GFCI tester": a pronoun for the receptacles just named.
      { re: rx`(?:they|it)\s+(?:are|is|were|was)\s+not\s+protected\b`, context: /^(?=[\s\S]*\b(?:gfc?i|ground[- ]fault))(?=[\s\S]*\b(?:receptacles?|outlets?|rcpts?)\b)/i, unless: /afci|arc[- ]fault/i },
      { re: rx`none\s+of\s+(?:the\s+)?${gap(3)}${T.RCPT}\s+${gap(4)}(?:are|is|were|was|have|has|had)\s+${PF}${T.GFCI}` },
      // Downstream of no GFCI device, or on no protected circuit: the receptacle is unprotected.
      { re: rx`not\s+(?:connected\s+|wired\s+|located\s+)?(?:downstream|on the load side)\s+of\s+(?:an?|any)\s+${T.GFCI}` },
      { re: rx`(?:not|no)\s+(?:appear\s+to\s+be\s+|seem\s+to\s+be\s+)?on\s+an?\s+(?:gfci[- ])?protected\s+circuit` },
      { re: rx`${T.RCPT}\s+${gap(4)}(?:are|is|were|was)?\s*not\s+protected\b`, context: /gfc?i|ground[- ]fault/i, unless: /afci|arc[- ]fault/i },
      { re: rx`${T.GFCI}(?:\s+(?:protection|protected|${T.RCPT}|breakers?))?\s+${T.BE}${T.ABSENT}` },
      { re: rx`${T.GFCI}(?:\s+protect(?:ion|ed))?(?:\s+(?:at|in|for)\s+${gap(3)}[\w-]+)?\s*[:=-]\s*(?:no|none|missing|absent)\b` },
      { re: rx`${T.RCPT}\s+${gap(4)}(?:are|is|were|was)\s+not\s+(?:on|protected by)\s+(?:an?\s+)?${T.GFCI}` },
      { re: rx`${RECOMMEND}\s+${NOT_ABOUT_ADDING}${T.GFCI}`, isRecommendation: true },
      { re: rx`${REQUEST_NOUN}\s+${NOT_ABOUT_ADDING}${T.GFCI}`, isRecommendation: true },
    ],
  },
  {
    code: 'gfci-inoperative',
    trigger: /gfc?i|gcfi|ground[- ]fault|trip|reset/i,
    // A receptacle that does not trip because no GFCI protects it is unprotected, not a failed GFCI.
    yieldsInSentenceTo: ['gfci-missing'],
    patterns: [
      { re: rx`${T.GFCI}\s+${anyGap(7)}${T.FAILED}\s+(?:properly\s+|(?:stay|remain|hold)\s+(?=reset))?(?:trip|reset|respond|function|operate|work)` },
      { re: rx`${T.GFCI}(?:\s+${T.RCPT})?\s+${gap(8)}${T.BE}(?:${T.INOPERATIVE}|worn(?: out)?|at end of life|end[- ]of[- ]life|not (?:tripping|resetting))` },
      { re: rx`(?:${T.INOPERATIVE}|failed|worn|damaged)\s+${T.GFCI}(?:\s+${T.RCPT})?` },
      // Twelfth round: "will not stay reset", "won't hold reset": it trips again at once (common practice: a worn GFCI).
      { re: rx`${T.FAILED}\s+(?:(?:stay|remain|hold)\s+(?=reset))?(?:trip|reset)\b(?!\s+(?:the|a)?\s*breaker)` },
      { re: rx`${T.GFCI}(?:\s+${T.RCPT})?\s+${anyGap(6)}(?:-\s*)?(?:no|not|never)\s+(?:trip(?:ping|ped)?|reset(?:ting)?)\b` },
      { re: rx`(?:no|not|never)\s+(?:trip(?:ping|ped)?|reset(?:ting)?)\s+(?:with|when|on|using|at)\s+(?:the\s+)?(?:test(?:er)?|button|btn)` },
    ],
  },
  {
    code: 'afci-missing',
    trigger: /afc?i|arc[- ]fault/i,
    // AFCI protection was first required on bedroom circuits (NFPA 70 (NEC) 1999, 210.12, from
    // memory); a report that names no room speaks of those.
    defaultRoom: 'bedroom',
    patterns: [
      { re: rx`(?:${T.NO}|not|non-?)\s*${PF}${T.AFCI}` },
      { re: rx`${T.AFCI}(?:\s+(?:protection|protected|breakers?|${T.RCPT}))?\s+${T.BE}${T.ABSENT}` },
      { re: rx`${RECOMMEND}\s+${NOT_ABOUT_ADDING}${T.AFCI}`, isRecommendation: true },
      { re: rx`${REQUEST_NOUN}\s+${NOT_ABOUT_ADDING}${T.AFCI}`, isRecommendation: true },
      // A checklist or table row: the item, its place, then its absence ("AFCI | Bedrooms | NP | Not present").
      { re: rx`^\s*${T.AFCI}(?:\s+protection)?\s+${anyGap(4)}(?:(?:np|n\/p)\s+)?(?:not present|none|np|n\/p)\b(?!\s+(?:tripped|failed))`, unless: /\btested\s+(?:ok|good|fine)|\bsatisfactory\b|(?<!\bnot\s)\bpresent\b/i },
      // "None of the bedroom circuits have arc-fault protection" (NFPA 70 (NEC) 2023, 210.12).
      { re: rx`none\s+of\s+(?:the\s+)?${gap(3)}(?:circuits?|${T.RCPT}|breakers?|rooms?|bedrooms?)\s+${gap(2)}(?:are|is|were|was|have|has|had)\s+${PF}${T.AFCI}` },
      // "AFCI protection ... is recommended as a safety upgrade": the recommendation after the device.
      { re: rx`${T.AFCI}(?:\s+protection)?\s+${anyGap(12)}(?:is|are)\s+(?:recommended|advised|suggested)\b`, isRecommendation: true },
    ],
  },
  {
    code: 'reversed-polarity',
    trigger: /polarity|revers|swapped|transposed|\brp\b|\brev\.?\s*pol\b/i,
    patterns: [
      { re: rx`rev(?:erse[ds]?|\.)?\s*[- ]?polarity` },
      { re: rx`polarity\s+${T.BE}(?:reversed|incorrect|wrong)` },
      { re: rx`(?:hot|line)\s*(?:and|\/|-|&)\s*neutral(?:\s+(?:wires|conductors))?\s+${T.BE}(?:reversed|swapped|transposed)` },
      { re: rx`\brp\b` },
      // Inspectors' shorthand: "rev pol", "rev. pol.".
      { re: rx`rev\.?\s*pol\b\.?` },
      // Formal prose in the code's own terms: the hot is the "ungrounded" and the neutral the "grounded"
      // conductor ("the hot and grounded conductors were found reversed"; NFPA 70 (NEC) 2023, 200.11, Article 100).
      { re: rx`(?:hot|ungrounded|line)\s+(?:and|&|\/)\s+(?:the\s+)?(?:neutral|grounded)\s+(?:wires?|conductors?|terminals?)\s+${gap(4)}(?:reversed|swapped|transposed)\b` },
    ],
  },
  {
    code: 'open-ground',
    trigger: /ground|ungr|prong|slot|hole|egc/i,
    // A receptacle with a neutral-to-ground jumper has no ground wire either: the false ground is the defect.
    yieldsInBlockTo: ['false-ground'],
    patterns: [
      { re: rx`open(?:\s+equipment)?\s+grounds?(?:ed)?\b(?!\s*fault)` },
      { re: rx`(?:ungrounded|ungrnd|ungr'?d)\s+(?:(?:three|3)[- ](?:prong|slot|hole)\s+)?${gap(2)}${T.RCPT}` },
      { re: rx`(?:tested|tests?|read|reads|showed?|shows|indicated?|registers?|registered)\s+(?:as\s+)?(?:ungrounded|open ground)` },
      { re: rx`(?:three|3)[- ](?:prong|slot|hole)\s+${T.RCPT}?\s*${gap(3)}(?:on|with|in|fed by)\s+(?:an?\s+)?(?:ungrounded|two[- ]wire|2[- ]wire|non-?grounded)` },
      // A feeder with no equipment ground is a subpanel defect, a plastic water line no electrode: neither is a receptacle's open ground.
      { re: rx`(?:no|lacks?|lacking|missing|without)\s+(?:an?\s+)?(?:equipment\s+)?ground(?:ing)?(?:\s+(?:conductor|wire|path))?\b(?!\s*(?:fault|electrode|rod|clamp))`, unless: /\b(?:feeder|sub-?panel|water (?:line|pipe|service)|electrode|ground rod|knob[- ]?(?:and|&|n)[- ]?tube)\b|^(?![^]*\b(?:receptacles?|outlets?|recepts?|rcpts?|devices?|prong|slots?|plugs?)\b)[^]*\b(?:two|2)[- ]wire\b/i },
      { re: rx`${T.RCPT}\s+${gap(8)}${T.BE}(?:not grounded|ungrounded)` },
    ],
  },
  {
    code: 'false-ground',
    trigger: /ground|gnd|bootleg|jumper|green (?:terminal|screw)/i,
    yieldsTo: ['subpanel-bonding'],
    patterns: [
      { re: rx`(?:bootleg(?:ged)?|false|fake)\s+(?:indication of (?:a\s+)?)?ground(?:s|ed|ing)?\b` },
      // "(bootleg)" after the jumper it names, and "neutral -> ground screw" shorthand (common practice).
      { re: rx`bootleg(?:ged)?\b` },
      { re: rx`(?:jumper|jumpered|jumped)\s+${anyGap(3)}(?:n|neutral)\s*(?:->|-->|→|to)\s*(?:the\s+)?(?:g|gnd|ground)(?:ing)?\b(?:\s+(?:terminal|screw))?` },
      { re: rx`(?:jumper|jumpered|jumped|tied|bonded)\s+${anyGap(4)}(?:from\s+)?(?:the\s+)?neutral\s+${anyGap(3)}to\s+(?:the\s+)?(?:green\s+)?ground(?:ing)?(?:\s+(?:terminal|screw))?` },
      // "jumpered the neutral to the green screw": the green screw is the receptacle's ground terminal (NFPA 70 (NEC) 2023, 406.4(D)(2), 250.142(B)).
      { re: rx`(?:jumper|jumpered|jumped|tied)\s+${anyGap(4)}(?:from\s+)?(?:the\s+)?neutral\s+${anyGap(3)}to\s+(?:the\s+)?green\s+(?:terminal|screw)` },
      { re: rx`(?:jumper|wire)\s+${anyGap(4)}between\s+(?:the\s+)?neutral\s+${anyGap(3)}and\s+(?:the\s+)?(?:green\s+)?ground(?:ing)?(?:\s+(?:terminal|screw))?` },
      { re: rx`neutral[- ]to[- ]ground(?:ing)?\s+(?:terminal\s+|screw\s+)?jumper`, unless: PANEL_CONTEXT },
      { re: rx`neutral\s+${gap(4)}(?:jumpered|jumped|bonded|tied)\s+(?:over\s+)?to\s+(?:the\s+)?ground(?:ing)?(?:\s+(?:terminal|screw))?`, isRecommendation: true },
    ],
  },
  {
    code: 'receptacle-damaged',
    trigger: /rec[ei]p|rcp|outlet|duplex|device|plug|cord|tension|grip|contacts|face|housing|body|fit|hold|retain/i,
    // A GFCI that will not reset leaves the receptacles after it dead: that is the GFCI's defect, not theirs (common practice).
    yieldsInSentenceTo: ['gfci-inoperative'],
    patterns: [
      { re: rx`(?:loose|cracked|broken|damaged|scorched|burn(?:ed|t)|melted|charred|painted(?:[- ]over)?|worn|discolou?red|heat[- ]damaged|dead|${T.INOPERATIVE})\s+${ADJ_GAP}${T.RCPT}` },
      { re: rx`(?:cracked|broken|damaged) (?:face|housing|body)|loose (?:plug )?fit|plugs? (?:fits?|fit) loose(?:ly)?|(?:will not|won't|does not|doesn't) (?:hold|retain) (?:a |the )?plugs?` },
      { re: rx`${T.RCPT}\s+${gap(8)}${T.BE}(?:loose|cracked|broken|damaged|scorched|burn(?:ed|t)|melted|charred|painted(?: over)?|worn|discolou?red|dead|${T.INOPERATIVE}|not (?:energized|powered|secured|secure|fastened)|pulled (?:out|away)|recessed)`, unless: DEAD_BEHIND_GFCI },
      { re: rx`${T.RCPT}\s+${gap(5)}(?:(?:has|have|had)\s+no|(?:is|are)\s+without)\s+power` },
      { re: rx`${T.RCPT}\s+${gap(8)}(?:shows?|showed|has|have|had|with)\s+(?:an?\s+)?(?:(?:brown|black|dark|visible|some)\s+)?(?:scorch|burn|arc(?:ing)?|char|heat|melt|discolou?r)\w*(?:\s+marks?)?` },
      // A table row: the receptacle in one cell, its scorch marks in the next ("Recep R of range | D | Scorch marks on face").
      { re: rx`${T.RCPT}\s+${anyGap(6)}(?:scorch|burn|char)\w*\s+marks?\b` },
      { re: rx`(?:scorch|burn|arc(?:ing)?|char)\w*\s+marks?\s+(?:on|at)\s+${gap(3)}${T.RCPT}` },
      { re: rx`no power (?:at|to)\s+(?:the\s+)?${gap(3)}${T.RCPT}` },
      { re: rx`(?:plugs?|cords?)\s+(?:fall|falls|fell|slip|slips|pull|pulls)\s+out` },
      { re: rx`(?:loose|poor|weak|worn)\s+(?:blade\s+)?(?:tension|grip|contacts)` },
      // A receptacle and its condition in the same clause with a longer description between ("the
      // receptacle on the fireplace wall in the family room was warm and discolored"; common practice).
      { re: rx`${T.RCPT}:?\s+${RCPT_GAP}(?:${T.BE})?(?:(?:noticeably|very|slightly|visibly|partly|partially)\s+)?${RCPT_CONDITION}`, unless: DEAD_BEHIND_GFCI },
    ],
  },
  {
    code: 'weather-cover-missing',
    trigger: /cover|hood|lid|flap|enclosure|\bw[rp]\b|weather/i,
    defaultRoom: 'exterior',
    patterns: [
      { re: rx`(?:${T.NO}|${T.BROKEN})\s+(?:(?:an?|the|its|their|proper|required)\s+)?(?:(?:wr|wp|weather[- ]resistant|weather[- ]?proof)\s*\/\s*)?(?:in[- ]use|bubble|weather(?:[- ]?proof|[- ]resistant|[- ]tight)?|wp|wr|exterior|outdoor)[- ]?(?:rated\s+)?(?:covers?|cover plates?|enclosures?|hoods?|lids?|flaps?)` },
      // The same with a bracketed aside after it ("no in-use cover (the old flip lid is gone)"): the aside
      // speaks of the cover that is missing, not of another cover.
      { re: rx`(?:${T.NO})\s+(?:(?:an?|the|its|their|proper|required)\s+)?(?:in[- ]use|bubble|weather(?:[- ]?proof|[- ]resistant|[- ]tight)?|wp|wr)[- ]?(?:rated\s+)?(?:covers?|hoods?|lids?)\s*\([^()]{1,60}\)` },
      // Common practice (NFPA 70 (NEC) 2023, 406.9(B)(1)): an outdoor receptacle in a wet location has a cover that is weatherproof with a plug in; a flat cover is not.
      { re: rx`(?:only\s+(?:a\s+)?)?flat\s+${gap(2)}(?:covers?|lids?)(?:\s+only)?`, context: /in[- ]use|bubble|weather|exterior|outdoor|patio|porch|deck|while (?:a cord is )?(?:plugged|in use)/i },
      // "missing the weatherproof "bubble" covers": a nickname in quotes or brackets before the noun.
      { re: rx`(?:${T.NO}|${T.ABSENT}|lack(?:s|ing)?)\s+(?:(?:an?|the|its|their|proper|required)\s+)?(?:weather(?:[- ]?proof|[- ]resistant)|in[- ]use|wp|wr)\s+["“'(][\w -]{1,15}["”')]\s+(?:covers?|lids?|hoods?)` },
      { re: rx`(?:covers?|lids?)\s+${gap(3)}(?:${T.BE})?broken off` },
      // "none of the three has a weather cover": the absence at every one named (NFPA 70 (NEC) 2023, 406.9(B)(1)).
      { re: rx`none\s+of\s+(?:the\s+|them\s+)?${gap(3)}(?:has|have|had)\s+(?:an?\s+|any\s+)?(?:in[- ]use|bubble|weather(?:[- ]?proof|[- ]resistant)?|wp)\s+covers?` },
      { re: rx`(?<!\b(?:no|without|missing)\s)(?:in[- ]use|bubble|weather(?:[- ]?proof|[- ]resistant)?|wp)\s+covers?\s+${anyGap(8)}${T.BE}(?:${T.ABSENT}|broken|damaged|cracked|needed|recommended|required)` },
      { re: rx`(?:exterior|outdoor|outside|patio|deck|porch)\s+${T.RCPT}\s+${gap(3)}(?:covers?|lids?|flaps?)\s+${T.BE}(?:missing|broken|damaged|absent)` },
      { re: rx`(?:not|non)[- ](?:wr|weather[- ]resistant)\b` },
      // A nickname in brackets or quotes between the kind and the cover: 'no in-use ("bubble") cover'.
      { re: rx`(?:${T.NO})\s+(?:an?\s+)?(?:in[- ]use|weather[- ]?proof|wp)\s+[("'“]+\s*[\w -]{2,20}?\s*["'”)]+\s+covers?` },
      { re: rx`(?:covers?|lids?)\s+${anyGap(4)}(?:not|isn't|is not)\s+(?:an?\s+)?(?:in[- ]use|bubble|weather[- ]?proof|wp|while[- ]in[- ]use|extra[- ]duty)\b` },
      // Ninth round (NFPA 70 (NEC) 2023, 406.9(B)(1)): the cover named by its kind with a slash or a bracketed
      // nickname ("lack weather / in-use covers", "lacks a bubble (in-use) cover"), a lid that is gone or no
      // longer closes, and a receptacle left open to the weather.
      { re: rx`(?:${T.NO})\s+(?:an?\s+|the\s+)?(?:wr|wp|weather(?:[- ]?proof|[- ]resistant)?)\s*\/\s*(?:in[- ]use|bubble)\s+(?:covers?|lids?|hoods?)` },
      { re: rx`(?:${T.NO})\s+(?:an?\s+)?(?:in[- ]use|bubble|weather[- ]?proof|wp)\s+\(\s*[\w -]{2,20}?\s*\)\s+(?:covers?|lids?|hoods?)` },
      { re: rx`(?:(?:hinged|flip|spring(?:-loaded)?|snap)[- ]?(?:lids?|covers?)|lids?)\s+${anyGap(4)}(?:no longer|(?:does|do|will|would)\s?n[o'’]?t|won'?t|can(?:no|'|’)?t)\s+(?:close|shut|latch|stay (?:closed|shut))` },
      { re: rx`(?:(?:hinged|flip|spring(?:-loaded)?|snap)[- ]?(?:lids?|covers?)|lids?)\s+${T.BE}(?:gone|missing|broken off|torn off)` },
      { re: rx`${T.RCPT}\s+${anyGap(8)}(?:(?:is|are|left|sits?)\s+)?(?:open|exposed|out)\s+(?:in|to)\s+(?:the\s+)?(?:weather|rain|elements)` },
    ],
  },
  {
    code: 'cover-plate-missing',
    trigger: /plate|cover/i,
    patterns: [
      { re: rx`(?:${T.NO}|broken|cracked|damaged)\s+(?:(?:the|a|an|any|its|their)\s+)?(?:\d{1,2}\s+|two\s+|both\s+)?(?:(?:switch|${T.RCPT}|light|blank)\s+)?${T.PLATE}`, unless: JBOX_WORD },
      { re: rx`${T.PLATE}\s+${gap(8)}${T.BE}(?:${T.ABSENT}|broken|cracked|damaged)`, unless: JBOX_WORD },
      { re: rx`${T.PLATE}\s+(?:for|on|at|of)\s+(?:the\s+|a\s+)?${ADJ_GAP}(?:${T.SWITCH}|${T.RCPT})\s+${gap(5)}${T.BE}(?:broken|cracked|damaged|missing)` },
    ],
  },
  {
    code: 'open-junction-box',
    trigger: /box|splice|wire nut/i,
    patterns: [
      { re: rx`(?:open|uncovered|unenclosed)\s+(?:${T.JBOX}|box(?:es)?\b)` },
      { re: rx`${T.JBOX}\s+${gap(8)}(?:(?:has|have|had|with|is|are|was|were)\s+)?(?:no|missing|without|lacks?|lacking|open|uncovered|not covered)\b(?:\s+(?:a|its|the|blank))?(?:\s+(?:covers?|lids?|plates?))?` },
      // "Grey metal electric box on the floor joist ... has no lid on it, wire nuts showing".
      { re: rx`box(?:es)?\s+(?:${anyGap(10)}(?:with|has|have|had)\s+)?(?:no|missing|without)\s+(?:a\s+|its\s+)?(?:covers?|lids?)`, context: /splice|wires? nuts?|junction|conductors? (?:are |is )?(?:exposed|visible)|wires? (?:are |is )?(?:exposed|visible|showing|hanging)/i },
      { re: rx`${T.JBOX}\s+(?:covers?|lids?)\s+${gap(3)}${T.BE}(?:${T.ABSENT}|off|removed)` },
      { re: rx`${T.NO}\s+(?:blank\s+)?(?:covers?|lids?)\s+(?:on|for)\s+(?:the\s+|an?\s+)?${T.JBOX}` },
      { re: rx`(?:splices?|spliced (?:wires|conductors)|wire nuts?)\s+${anyGap(6)}(?:outside(?:\s+of)?|not in|not within|not enclosed|without)\s+(?:in\s+)?(?:an?\s+|the\s+|any\s+)?(?:(?:approved|junction|electrical|enclosed)\s+)?(?:box|enclosure|junction box)` },
      { re: rx`(?:open|exposed|unenclosed|loose|taped)\s+(?:wire\s+)?splices?` },
      // Terse notes: "tape splice on wall at workbench, no box".
      { re: rx`splices?\b\s+${anyGap(8)}no\s+(?:junction\s+)?box\b(?!\s*(?:covers?|lids?))` },
      // "Two cables spliced with tape and hanging from a joist, no box" (NFPA 70 (NEC) 2023, 300.15).
      { re: rx`(?:${T.WIRING}|wires|conductors)\s+(?:were\s+|are\s+|have been\s+)?spliced\b\s+${anyGap(8)}(?:no|without|not in)\s+(?:an?\s+|any\s+)?(?:junction\s+)?box(?:es)?\b(?!\s*(?:covers?|lids?))` },
      { re: rx`(?:spliced?|splices|connections?|connected)\b\s+${anyGap(20)}(?:(?:with\s+|and\s+)no|without(?:\s+an?)?|not\s+in(?:\s+an?)?|rather than (?:being\s+)?(?:enclosed\s+)?in(?:\s+an?)?|outside(?:\s+of)?(?:\s+(?:an?|any))?)\s+(?:junction\s+|electrical\s+)?(?:box|enclosure)` },
      { re: rx`(?:wrapped|taped)\s+(?:only\s+)?(?:in|with)\s+(?:electrical\s+)?tape` },
      // A box and its missing cover, or its visible splices, anywhere in the clause (terse notes and
      // table rows: "J-box above furnace, no cover, splices visible"; "Lid missing from junction box").
      { re: rx`${T.JBOX}${NOT_ANOTHER_DEVICE}(?:${BOX_UNCOVERED})` },
      { re: rx`(?:covers?|lids?)\s+(?:is\s+|are\s+)?(?:missing|absent|off|removed)\s+(?:from|on|at)\s+(?:the\s+|an?\s+)?${T.JBOX}` },
      // "a junction box feeding the shop lights has no cover plate": the box is the subject (common practice).
      { re: rx`${T.JBOX}\s+(?:that\s+)?(?:feeding|feeds|serving|serves|supplying|supplies|for)\s+${anyGap(4)}(?:has|have|is|are|with)?\s*(?:no|missing|without)\s+(?:a\s+|its\s+|the\s+|any\s+)?(?:blank\s+)?(?:covers?|lids?|cover plates?)\b` },
    ],
  },
  {
    code: 'exposed-wiring',
    trigger: /wir|cabl|conductor|\bnm\b|romex|cord/i,
    patterns: [
      { re: rx`(?:exposed|unprotected|unsecured|loose|dangling|hanging|unsupported|unstapled|frayed)(?:,?\s+(?:dangling|hanging|unsecured|loose|exposed))?\s+(?:(?:nm|romex|electrical|branch(?: circuit)?|sheathed|non-?metallic(?:[- ]sheathed)?)\s+)?(?:wir(?:e|es|ing)|cables?|nm(?:-b)?|romex)\b` },
      { re: rx`${T.WIRING}\s+${gap(8)}${T.BE}(?:exposed|unprotected|unsecured|loose|not (?:secured|supported|protected|stapled|strapped)|dangling|hanging|lying|draped|subject to (?:physical )?damage|within reach)`, unless: SERVICE_OR_BOX_WIRES },
      { re: rx`${FLEX_CORD}\s+${gap(3)}(?:used|in use|serving|as|for|run|powering|supplying|providing|feeding|(?:has|have)\s+been\s+(?:run|routed|stapled|strung|nailed|tacked|fastened|used|installed))` },
      { re: rx`${FLEX_CORD}\s+${gap(2)}(?:${T.BE}|being\s+)(?:stapled|strung|nailed|tacked|fastened|routed|run|draped|tied)\s+(?:along|across|through|to|under|over|up|around|in)\b` },
      { re: rx`${FLEX_CORD}\s+${anyGap(6)}(?:in place of|instead of|as|substitut\w+ for|for)\s+(?:a\s+)?(?:permanent|fixed|premises|branch(?:[- ]circuit)?)\s+wiring` },
      { re: rx`(?:used|using|uses|plugged in(?:\s?to)?|powered by|connected to|on|fed by|fed from|through)\s+(?:an?\s+|the\s+)?${ADJ_GAP}extension cords?` },
      { re: rx`(?:uf|nm|underground|feeder|branch|direct[- ]burial)?\s*${T.WIRING}\s+${gap(6)}(?:${T.BE}|(?:has|have)\s+(?:simply\s+)?been\s+)?(?:lies|lying|laid|laying|lays|rests?|resting|run|strung|draped)\s+(?:directly\s+)?(?:on|across|along|on top of)\s+(?:the\s+)?(?:surface of the\s+)?(?:ground|dirt|soil|grass|lawn|yard|floor|crawl ?space floor)\b` },
      { re: rx`(?:permanent|fixed)\s+(?:use of\s+)?extension cords?` },
      // A cable that belongs under ground or in conduit outdoors (a feeder, UF, a pump or lift cable)
      // lying on the surface or with no conduit (NFPA 70 (NEC) 2023, 300.5(A) burial and 300.5(D) protection; 340.10).
      { re: rx`${OUTDOOR_CABLE}\s+${anyGap(12)}(?:lies|lying|laid|laying|runs?|running|strung|draped|rests?|resting|sits?|comes? up)\s+(?:\w+\s+){0,3}?(?:on|across|along|over|out of)\s+(?:the\s+)?(?:surface of the\s+|top of the\s+)?(?:ground|grade|rocks?|surface|walkway|dock|bank|gravel|lawn|yard|dirt)\b` },
      { re: rx`${OUTDOOR_CABLE}\s+${anyGap(12)}(?:(?:is\s+|are\s+)?not\s+(?:in|inside|sleeved in|protected by)\s+(?:a\s+)?conduit|(?:with\s+)?no\s+(?:conduit|burial|sleeve)|(?:is\s+|are\s+)?not\s+(?:buried|sleeved)|unburied|above ground)` },
      // Cable across the top of joists near an attic opening needs guard strips or running boards (NFPA 70 (NEC) 2023, 334.23 and 320.23(A)).
      { re: rx`(?:nm|romex|sheathed)?\s*cables?\s+${anyGap(16)}(?:no|without)\s+(?:running boards?|guard strips?)` },
      // A cable and its condition in the same clause with other words between ("NM cable to the
      // disposal not clamped at the unit, loose under the sink"; common practice, NEC 334.15 and 334.30).
      { re: rx`(?:nm(?:-b)?|romex|uf|surface[- ](?:run|mounted)|branch(?:[- ]circuit)?|sheathed)?\s*(?:wir(?:e|es|ing)\b(?!\s+nuts?\b)|cables?\b|cabling\b)\s+${WIRE_GAP}(?:${T.BE})?${WIRE_CONDITION}`, unless: WIRE_SOUND_OR_OTHER },
    ],
  },
  {
    code: 'double-tap',
    trigger: /tap|lug|terminal|screw|breaker/i,
    fixedRoom: 'panel',
    patterns: [
      { re: rx`(?:doubled?|dubbled?|dbl\.?|dual|twin)[- ]?tap(?:s|ped|ping|ed)?\b` },
      { re: rx`double[- ]lug(?:ged|s)?\b` },
      { re: rx`(?:two|2|multiple)\s+(?:\d{1,2}\s+awg\s+)?(?:(?:cu|copper|al|aluminum)\s+)?(?:wires?|conductors?|circuits|neutrals)\s+${gap(3)}(?:under|on|to|landed on|terminated on|sharing)\s+(?:a\s+|one\s+|1\s+|the same\s+|single\s+|its\s+|their\s+|the\s+)+(?:terminal|lug|screw|breaker)` },
      // Terse notes leave out the article: "2 cond. under lug".
      { re: rx`(?:two|2)\s+(?:\d{1,2}\s+awg\s+)?(?:(?:cu|copper|al|aluminum)\s+)?(?:wires?|conductors?|cond)\.?\s+(?:under|on)\s+(?:terminal|lug|screw)\b` },
    ],
  },
  {
    code: 'overcurrent-mismatch',
    trigger: /breaker|brkr|bkr|ocpd|fuse|overcurrent|undersized/i,
    fixedRoom: 'panel',
    patterns: [
      { re: rx`(?:oversized?|over-sized|over-?fused|mismatched|incorrectly sized|wrong(?:ly sized)?|improperly sized)\s+${gap(2)}${T.BREAKER}` },
      { re: rx`${T.BREAKER}\s+${gap(3)}${T.BE}(?:oversized|over-sized|too large|too big|larger than|rated (?:higher|above|too high))` },
      { re: rx`undersized\s+(?:wir(?:e|es|ing)|conductors?)` },
      // Ratings checked against the conductor or the nameplate are computed in overcurrent-check.ts.
    ],
  },
  {
    code: 'panel-deficiency',
    trigger: /dead[- ]?front|panel|cover|screw|knockout|k\.?o|slot|opening|filler|blank|directory|legend|label|identif|unmarked|corro|rust|moisture|stain|clearance|access|space|blocked|obstruct/i,
    fixedRoom: 'panel',
    patterns: [
      { re: rx`${T.NO}\s+${gap(2)}(?:dead[- ]?front|panel cover|inner cover|interior cover)(?:\s+screws?)?` },
      // Polarity: a cover taken off to look inside ("removed for inspection", "with the dead front removed") is procedure, not a defect.
      { re: rx`(?:dead[- ]?front|panel cover|inner cover)(?:\s+cover)?\s+${gap(3)}${T.BE}(?:missing|absent|removed|not installed)(?:\s+(?:\w+\s+)?screws?)?`, unless: COVER_OFF_TO_INSPECT },
      { re: rx`(?:pointed|sharp|sharp[- ]tipped|drywall|sheet metal|self-tapping|incorrect|wrong|improper)\s+${gap(2)}screws?`, context: PANEL_CONTEXT },
      { re: rx`(?:missing|no)\s+${gap(2)}screws?`, context: PANEL_CONTEXT },
      { re: rx`(?:open|unused|unsealed)\s+(?:knockouts?|k\.?o\.?s?\b|breaker (?:slots?|spaces?|openings?)|slots?|openings?)`, context: PANEL_CONTEXT },
      { re: rx`(?:${T.NO})\s+(?:the\s+|its\s+)?(?:blank\s+)?(?:breaker\s+)?(?:fillers?|filler plates?|blanks?|blanking plates?|knockout (?:closures|seals|plugs|covers))` },
      { re: rx`(?:dead[- ]?front|panel cover|cover)\s*[:-]?\s*${gap(3)}(?:\(\d\)\s*)?screws?\s+${T.BE}(?:missing|absent)`, context: PANEL_CONTEXT },
      { re: rx`(?:missing|absent)\s+(?:\d|one|two|three|four)\s+screws?`, context: PANEL_CONTEXT },
      { re: rx`(?:rust|corrosion|water stain(?:s|ing)?)(?:\s*(?:and|\/|&|\+)\s*(?:rust|corrosion|water stain(?:s|ing)?))?\s+${gap(3)}(?:at|on|in|inside|within)\s+(?:the\s+)?(?:bottom|base|back)\s+of\s+(?:the\s+)?(?:enclosure|panel|can|cabinet)` },
      { re: rx`(?:rust|corrosion)\s+(?:and\s+(?:rust|corrosion|water staining)\s+)?${T.BE}(?:found|observed|noted|present|visible)\s+(?:at|on|in|inside)\s+(?:the\s+)?${gap(2)}(?:enclosure|panel|lugs|breakers|bus)`, context: PANEL_CONTEXT },
      // Working space in front of a panel: 30 inches wide, 36 inches deep, kept clear (NFPA 70 (NEC) 2023, 110.26(A) and (B)).
      { re: rx`(?:working|clear|clearance)\s+(?:space|clearance|area)\s+${gap(4)}${T.BE}(?:less than|under|only|about|blocked|obstructed|reduced)`, context: PANEL_CONTEXT },
      { re: rx`(?:installed|placed|stored|located|built|stacked|sits|sit)\s+(?:directly\s+)?in front of\s+(?:and beside\s+)?(?:the\s+panel|it)\b`, context: PANEL_CONTEXT },
      { re: rx`(?:blocks?|blocking|obstructs?|obstructing|restricts?|restricting)\s+(?:the\s+)?(?:access|working space|clearance)`, context: PANEL_CONTEXT },
      { re: rx`less than (?:a foot|an? (?:arm's length|few inches)|\d+\s*(?:inches|in\.?|"|feet|ft)) of (?:clear|working|open) (?:space|clearance)`, context: PANEL_CONTEXT },
      { re: rx`(?:shelving|storage|shelves|cabinets?|freezer|furniture)\s+${gap(3)}within\s+\d+\s*(?:inches|in\.?|")\s+of\s+(?:the\s+)?panel` },
      { re: rx`(?:directory|legend|circuit labels?|labell?ing|entries)\s+${gap(3)}${T.BE}(?:faded|unreadable|illegible|outdated|out of date|wrong|incorrect)` },
      { re: rx`(?:knockouts?|fillers?|filler plates?)\s+${T.BE}(?:missing|open|absent)` },
      { re: rx`(?:knockouts?|fillers?|filler plates?)\s+${gap(6)}${T.BE}(?:missing|open|absent)`, context: PANEL_CONTEXT },
      // The enclosure and its rust in one clause, either order ("the enclosure is rusted along the
      // bottom", "the inside of the panel has surface rust", "rust @ bottom of can", "corrosion on the
      // neutral bar"); a meter's can is the service's (common practice; NFPA 70 (NEC) 2023, 312.2).
      { re: rx`(?<!meter\s)(?:enclosure|${T.PANEL}|cabinet)\s+${gap(4)}${T.BE}(?:rusted|rusting|corroded)\b`, unless: /\bmeter\b|\bsolar\b/i },
      { re: rx`(?:rust|corrosion)\s+(?:and\s+(?:rust|corrosion|water stain(?:s|ing)?)\s+)?(?:at|on|in|inside|@)\s+(?:the\s+)?(?:bottom\s+of\s+(?:the\s+)?)?(?:enclosure|can|cabinet|neutral bars?|bus(?: ?bars?)?|breaker terminals)\b`, context: PANEL_CONTEXT, unless: /\bmeter\b/i },
      // "the neutral bar and the interior of the enclosure show heavy white corrosion".
      { re: rx`(?:enclosure|${T.PANEL}|breakers?|bus(?: bars?)?|neutral bar|lugs?|handles)\s+${gap(2)}(?:shows?|has|have|with)\s+(?:heavy\s+|white\s+|green\s+|some\s+|visible\s+|significant\s+){0,3}(?:corrosion|rust)` },
      { re: rx`(?:${T.NO}|incomplete|illegible|inaccurate)\s+(?:panel\s+|circuit\s+)*(?:directory|legend|labels?|labell?ing|identification)` },
      { re: rx`(?:directory|legend|circuit labels?|labell?ing)\s+${gap(3)}${T.BE}(?:${T.ABSENT}|incomplete|illegible|inaccurate|blank|empty|not (?:filled|completed))` },
      { re: rx`(?:circuits?|breakers?)\s+${gap(3)}${T.BE}(?:not|un)[- ]?(?:labell?ed|identified|marked)`, context: PANEL_CONTEXT },
      { re: rx`(?:unlabell?ed|unidentified|unmarked)\s+(?:circuits?|breakers?)` },
      // Seventh round (common practice; NFPA 70 (NEC) 2023, 408.4(A), 110.26(A)): "not one is labeled", a
      // directory described where it is before it is "blank", equipment set in front of "the unit panel".
      { re: rx`(?:not (?:one|a single)(?: \w+)?|none)\s+(?:of\s+(?:them|the\s+(?:breakers?|circuits?))\s+)?(?:is|are|was|were|has been|have been)\s+(?:labell?ed|identified|marked)`, context: /breaker|circuit|panel/i },
      { re: rx`(?:directory|legend)\s+(?:on|inside|in|at)\s+${anyGap(6)}${T.BE}(?:blank|empty|not filled(?: in| out)?)` },
      { re: rx`(?:installed|placed|stored|located|built|stacked)\s+(?:directly\s+)?in front of\s+the\s+(?:unit|main|electrical|breaker|service)\s+panel\b` },
      { re: rx`(?:corrosion|rust|moisture|water stains?)\s+${gap(3)}(?:in|on|inside|at|within)\s+(?:the\s+)?(?:main\s+|electrical\s+|service\s+)?(?:${T.PANEL}|breakers?|bus)` },
      { re: rx`(?:${T.PANEL}|bus bars?|breakers?|lugs?)\s+${gap(3)}${T.BE}(?:corroded|rusted|rusty|shows? (?:corrosion|rust))` },
      { re: rx`(?:blocked|obstructed|inadequate|insufficient|restricted)\s+(?:working\s+)?(?:clearance|access|space)`, context: PANEL_CONTEXT },
      { re: rx`${T.PANEL}\s+${gap(3)}${T.BE}(?:blocked|obstructed|not accessible|inaccessible)` },
      { re: rx`(?:shelving|storage|stored items|items|cabinets?|shelves|furniture)\s+${gap(3)}(?:blocking|blocks|obstruct\w*|in front of)\s+(?:the\s+)?(?:access to the\s+)?${gap(2)}${T.PANEL}` },
    ],
  },
  {
    code: 'subpanel-bonding',
    trigger: /neutral|ground|bond|green|egc|\bn\s*(?:&|\/|and)\s*g\b/i,
    fixedRoom: 'panel',
    // Polarity: neutrals and grounds together at the main service are correct ("which is correct at
    // the service equipment", "as permitted at the main"; NFPA 70 (NEC) 2023, 250.24(A)).
    patterns: [
      { re: rx`(?:neutrals?|grounds?|n)(?:\s+(?:conductors?|wires?))?\s*(?:and|&|\/|\+)\s*(?:neutrals?|grounds?|grounding|equipment grounds?|g)(?:\s+(?:conductors?|wires?))?\s+${gap(3)}(?:share|sharing|are on|on (?:the )?same|(?:landed |terminated )?together|combined|commingled|mixed|${T.BE}not (?:separated|isolated))`, unless: CORRECT_AT_SERVICE },
      { re: rx`(?:grounds?|ground wires|egcs?|equipment grounds?)\s+${gap(3)}(?:on|landed on|connected to|terminated on|share)\s+(?:the\s+)?neutral\s+(?:bar|bus)`, context: SUBPANEL_CONTEXT },
      { re: rx`(?:bonding|bond|green)\s+(?:screw|strap|jumper)\s+${gap(3)}(?:${T.BE}(?:present|installed|in place|not removed)|in\b(?!\s+(?:the|a|an|place)\b))`, context: SUBPANEL_CONTEXT, unless: /\b(?:not|never)\s+(?:been\s+)?(?:installed|present|in place)\b/i },
      { re: rx`neutral\s+(?:bar|bus)?\s*${gap(2)}${T.BE}bonded\s+to\s+(?:the\s+)?(?:enclosure|case|can|cabinet|panel|ground)`, context: SUBPANEL_CONTEXT },
      { re: rx`no separate ground(?:ing)? (?:bar|bus)` },
    ],
  },
  {
    code: 'grounding-electrode',
    trigger: /ground|gec|\bges\b|bond|electrode|jumper|acorn/i,
    defaultRoom: 'panel',
    panelIsPlace: true,
    patterns: [
      { re: rx`(?:${T.NO}|loose|disconnected|damaged|broken|cut|corroded|inadequate|improper)\s+(?:(?:a|an|the)\s+)?${gap(2)}(?:ground(?:ing)? electrode(?: conductor| system)?|gec\b|ges\b|ground(?:ing)? rods?|ground(?:ing)? clamps?|water (?:pipe |line )?bond(?:ing)?(?: jumper)?|gas (?:pipe |line )?bond(?:ing)?|bonding (?:jumper|conductor|clamp|wire|connection))` },
      { re: rx`(?:grounding electrode(?: conductor)?|gec\b|ground(?:ing)? rods?|ground(?:ing)? clamps?|bonding (?:jumper|clamp|conductor))\s+${gap(12)}${T.BE}(?:${T.ABSENT}|loose|disconnected|damaged|cut(?: off)?|severed|broken|corroded|not (?:connected|attached|bonded|secured)|undersized|inadequate)` },
      // A water meter or filter bridged by no jumper leaves the piping bond open (NFPA 70 (NEC) 2023, 250.53(D)(1) and 250.68(B)).
      { re: rx`${T.NO}\s+(?:bonding\s+)?jumper\s+(?:wire\s+)?(?:around|across|bridging|over|at)\s+(?:the\s+)?(?:water\s+)?(?:meter|filter|softener|water heater)` },
      { re: rx`(?:gas|water|metal|csst)(?:\s+(?:service|supply|main))?\s+(?:pipes?|piping|lines?)\s+${gap(8)}(?:has|have|had|with)\s+no\s+bond(?:ing)?\b` },
      { re: rx`(?:ground(?:ing)?|electrode)\s+(?:wire|conductor)\s+${gap(8)}${T.BE}(?:loose|disconnected|cut(?: off)?|severed|broken|not (?:connected|attached))` },
      { re: rx`(?:water|gas|metal|csst)(?:\s+(?:service|supply|main))?(?:\s+(?:pipes?|piping|lines?))?\s+${gap(2)}${T.BE}(?:not|un)[- ]?bonded` },
      { re: rx`(?:not|no)\s+bond(?:ed|ing)\s+(?:\w+\s+){0,3}?(?:water|gas|csst|metal piping)` },
      // A grounding or bonding part and its condition in the same clause, with other words between
      // ("ground wire to the water line at the water heater is loose", "GEC: clamp @ rod loose").
      { re: rx`${GROUND_PART}\s*[:-]?\s+${anyGap(12)}(?:${T.BE})?${GROUND_CONDITION}` },
      // "GEC #6 Cu to rod: lug on panel ground bar loose": a labelled part, then its condition after the colon.
      { re: rx`${GROUND_PART}\s+${anyGap(4)}[\w'/#().@-]+:\s+${anyGap(8)}(?:${T.BE})?${GROUND_CONDITION}` },
      // A part that should be there and was looked for: "none found", "could not be located" is the defect itself.
      { re: rx`${GROUND_PART}\s*[:-]?\s+${anyGap(8)}(?:${T.BE})?(?:none (?:found|located|observed|visible)|not (?:found|located|visible|observed|present|installed)|could not be (?:found|located|confirmed|verified|seen))` },
      { re: rx`(?:could\s?n[o']t|did\s?n[o']t|was unable to|were unable to|unable to)\s+(?:locate|find|confirm|verify|see|identify)\s+(?:a|an|the|any)?\s*${GROUND_PART}` },
    ],
  },
  {
    code: 'smoke-co-alarm',
    trigger: /smoke|alarm|detector|carbon monoxide|unit|device|\bco\b/i,
    defaultRoom: 'whole-house',
    patterns: [
      { re: rx`(?:${T.NO}|${T.INOPERATIVE}|expired|outdated|dated|disconnected|removed|chirping)\s+${gap(2)}${T.SMOKE}(?!\s+(?:issues|problems|concerns|defects|deficiencies))` },
      { re: rx`${T.SMOKE}\s*[:-]?\s*${gap(8)}${T.BE}(?:${T.ABSENT}|none|${T.INOPERATIVE}|expired|past (?:their|its) (?:service life|expiration)|(?:over|older than|more than) (?:10|ten) years|disconnected|removed|chirping|${T.FAILED} (?:respond|sound|activate|operate|work)|failed|no\s+respon[sc]e)` },
      // A topic label answered by what is needed: "Smoke: need 1 in bsmt bdrm".
      { re: rx`(?:smoke|co|carbon monoxide)(?:\s+(?:alarms?|detectors?))?\s*(?::|-)\s*(?:needs?|needed|add|install)\s+(?:\d|one|an?)\b` },
      // A bare topic label answered by its absence: "CO: none found", "Hall smoke - none".
      { re: rx`(?:smoke|co|carbon monoxide)(?:\s*(?:\/|&|and)\s*co)?\s*(?::|-)\s*(?:none|${T.ABSENT})\b` },
      { re: rx`${RECOMMEND}\s+${NOT_ABOUT_ADDING}${T.SMOKE}`, isRecommendation: true, unless: /\btest/i },
      { re: rx`(?:unit|device)\s+${gap(4)}${T.FAILED}\s+(?:sound|alarm|respond|activate)`, context: /smoke|carbon monoxide|\bco\b|alarm|detector/i },
      // Common practice: smoke alarms are replaced ten years after manufacture (the date on the
      // label), CO alarms at the end of life the maker prints; an old date is the defect.
      { re: rx`${T.SMOKE},?\s+${anyGap(10)}${T.FAILED}\s+(?:sound|alarm|respond|activate|operate|work)` },
      // "Smoke alarms: battery units; alarm missing from the upstairs bedroom": the device named by its last word.
      { re: rx`(?:alarms?|detectors?)\s+${gap(3)}${T.BE}(?:${T.ABSENT}|${T.INOPERATIVE}|expired)`, context: /smoke|carbon monoxide|\bco\b/i },
      { re: rx`${SMOKE_OR_LABEL}[^.;]{0,90}?${SMOKE_AGED}` },
      // "The hallway alarm ... may be past its service life", "the alarm in the upstairs hall was chirping": an
      // alarm named without "smoke" in a report is a smoke or CO alarm unless it is a security system's.
      { re: rx`(?<!\b(?:security|burglar|intrusion|fire panel)\s)alarms?\s+[^.;]{0,90}?${SMOKE_AGED}`, unless: /\b(?:security|burglar|intrusion|monitor\w*|alarm (?:panel|system|company|contract))\b/i },
      { re: rx`${SMOKE_OR_LABEL}[^.;]{0,60}?(?:dated|date[- ]?(?:codes?|stamps?)|manufactured|manufacture dates?|made|stamped)\s+(?:in\s+|of\s+)?(?:19[5-9]\d|20[0-2]\d)\b`, context: /replac|expir|past|beyond|exceed|old|aged|life|chirp|\b(?:10|ten)[- ]years?/i },
      { re: rx`(?:19[5-9]\d|20[0-2]\d)\s+(?:date[- ]?codes?|manufactur\w+ dates?)`, context: /smoke|carbon monoxide|\bco\b|alarm|detector/i, unless: /\btested (?:ok|fine|good|properly|correctly)\b|\bsatisfactory\b/i },
      { re: rx`smoke(?:\s*(?:\/|and|&)\s*co)?\s*[:-]?\s+(?:${T.ABSENT}|none|expired|${T.INOPERATIVE})` },
      // An alarm off its base: "hanging by its wiring harness", "not on its base", "pulled off the mounting plate" (common practice; NFPA 72 (2022), 29.8.3.4, from memory).
      { re: rx`${T.SMOKE}\s+${gap(6)}(?:(?:hangs?|hanging|dangling|dangles|suspended)\s+(?:from|by|on)\s+(?:its\s+|the\s+)?(?:wir(?:e|es|ing)|harness|connector|pigtail)|(?:off|not on|not attached to|detached from|pulled (?:off|from)|fallen (?:off|from))\s+(?:of\s+)?(?:its\s+|the\s+)?(?:base|bracket|mounting (?:plate|base|bracket)|ceiling))` },
      // "None of the four rented rooms has a smoke alarm": none of the places named has one.
      { re: rx`none of (?:the\s+)?${gap(4)}(?:has|have|had|contains?)\s+(?:an?\s+|any\s+)?(?:working\s+)?${T.SMOKE}` },
    ],
  },
  {
    code: 'light-fixture',
    trigger: /light|fixture|luminaire|chandelier|gasolier|lantern|pendant|sconce|globe|lens|shade|diffuser|bulb|lamp|insulation|socket|housing|recessed|\bcans?\b/i,
    patterns: [
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(8)}${T.BE}(?:${T.INOPERATIVE}|loose|dangling|hanging|not (?:secured|secure|attached|mounted)|${T.FAILED} (?:operate|work|respond|turn on|come on)|in contact with (?:the\s+)?insulation|covered (?:by|with) insulation|not (?:rated|listed|suitable|approved) for (?:a |the )?(?:wet|damp))` },
      { re: rx`(?:${T.INOPERATIVE}|loose|dangling|damaged|broken)\s+${gap(2)}${NOT_APPLIANCE}${T.LIGHT}` },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(6)}(?:flickers?|flickering|buzz(?:es|ing)?|(?:is|are|was)\s+(?:scorched|discolou?red|melted|cracked))\b`, unless: SWITCH_FOR_LIGHT },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(6)}(?:hangs?|hanging|suspended|dangles|dangling)\s+(?:from|by|on)\b` },
      { re: rx`(?:${T.NO}|broken)\s+(?:(?:the|a)\s+)?(?:globes?|lens(?:es)?|light covers?|shades?|diffusers?)` },
      { re: rx`(?:bare|open|exposed|uncovered)\s+(?:incandescent\s+)?(?:bulbs?|lamps?)\b` },
      { re: rx`insulation\s+${gap(3)}(?:in contact with|touching|covering|over|on top of|against)\s+(?:the\s+)?${gap(2)}(?:recessed|can)\s+(?:lights?|fixtures?|cans?|housings?)` },
      // Common practice: a recessed housing not rated IC must keep its clearance from insulation.
      { re: rx`(?:non-?ic|recessed|can)\s+(?:(?:light|lighting|fixture)\s+)?(?:housings?|fixtures?|lights?|cans?)\s+${gap(6)}(?:${T.BE})?(?:covered|buried|packed|surrounded)\s+(?:down\s+|over\s+)?(?:by|in|with|under)\b` },
      // "one recessed can housing is an older non-IC type and blown cellulose is packed against it" (common practice; NFPA 70 (NEC) 2023, 410.116(B)).
      { re: rx`(?:insulation|cellulose|fiberglass|batts?)\s+${gap(3)}(?:packed|piled|pushed|stuffed|blown|heaped|banked|laid)\s+(?:up\s+|tight(?:ly)?\s+)?(?:against|around|over|on top of|onto|into|up to)\s+(?:it|them|the\s+(?:housings?|cans?|fixtures?|lights?))\b`, context: /non-?ic|recessed|can light|housing/i },
      // "can lights ... are the old non-IC type with blown cellulose piled on top of them" (common practice; NFPA 70 (NEC) 2023, 410.116(B)).
      { re: rx`(?:recessed|can|pot)\s+(?:lights?|fixtures?|housings?|cans?)\s+${anyGap(8)}non-?ic\b`, context: /\b(?:insulation|cellulose|fiberglass|blown|batts?)\b/i },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${SWITCH_GAP}(?:${T.FAILED}|${T.BE}not)\s+(?:light|illuminate|come on|turn on|operate|work)\b` },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(8)}(?:has\s+)?(?:pulled|pulling|come|coming|separated|separating)\s+(?:away\s+|loose\s+)?(?:from|off)\s+(?:the\s+|its\s+)?(?:(?:log|wood|cedar|board|stone|block|masonry|exterior|porch|house|garage)\s+)?(?:wall|siding|stucco|brick|soffit|fascia|ceiling|box|mounting|surface)` },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(6)}(?:${T.BE})?(?:missing|without|lacks?|has no)\s+(?:(?:its|a|the|their)\s+)?(?:glass\s+)?(?:globes?|lens(?:es)?|shades?|diffusers?|covers?)`, unless: BOX_FEEDING },
      { re: rx`(?:globes?|lens(?:es)?|shades?|diffusers?)\s+${T.BE}(?:missing|broken|cracked|absent)`, context: /light|fixture|lamp|bulb/i },
      { re: rx`(?:bare[- ]bulb|open|exposed|porcelain|keyless)\s+(?:porcelain\s+)?(?:lamp\s?holders?|sockets?)` },
      { re: rx`(?:lamp\s?holders?|sockets?)\s+${gap(3)}${T.BE}(?:cracked|broken|damaged|loose|missing)` },
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}\s+${gap(3)}(?:hangs?|hanging|suspended)\s+(?:from|by)\s+(?:one|a single|its)\s+(?:chain|end|wire|wires)` },
      // A light and its condition in the same clause with other words between (common practice):
      // water in the globe, rust, loose from its mounting, does not light.
      { re: rx`${NOT_APPLIANCE}${T.LIGHT}[:,]?\s+${LIGHT_GAP}(?:${T.BE})?${LIGHT_CONDITION}` },
    ],
  },
  {
    code: 'fan-support',
    trigger: /fan/i,
    patterns: [
      { re: rx`(?<!\b(?:exhaust|vent|ventilation|bath|attic|range|inline|not|non)[\s-])(?:ceiling\s+)?fans?\s+${gap(4)}(?:wobbl\w*|shak(?:es|ing|y)|sways?|swaying|unstable|${T.BE}(?:loose|not (?:secured|supported|properly (?:supported|secured|mounted))|improperly (?:mounted|supported|secured)))`, unless: /\b(?:without|no)\s+(?:any\s+|noticeable\s+)?(?:wobbl|shak|sway)/i },
      { re: rx`(?:ceiling\s+)?fans?\s+${gap(2)}${T.BE}(?:mounted|installed|hung|supported)\s+(?:on|to|from|by)\s+(?:a|an|the)?\s*(?:standard|non-?fan[- ]rated|light(?:ing)?|plastic|pancake|junction|ordinary)\s+(?:fixture\s+|outlet\s+|light\s+)?box` },
      { re: rx`(?:wobbl\w*|loose|unsecured|shaky)\s+(?:ceiling\s+)?fans?\b` },
      // A fan hung from a box made for a light, with words between (NFPA 70 (NEC) 2023, 314.27(C)):
      // "the ceiling fan in the sunroom is hung from a shallow pancake box", "clg fan on std pancake box".
      { re: rx`(?:ceiling\s+)?fans?\s+${anyGap(5)}(?:(?:mounted|installed|hung|supported|hanging|attached)\s+)?(?:on|to|from)\s+(?:an?\s+|the\s+|its\s+)?(?:(?:shallow|small|light[- ]duty|old|original|metal|round|existing|thin)\s+){0,2}(?:(?:standard|std\.?|non-?fan[- ]rated|light(?:ing)?|plastic|pancake|ordinary)\s+){1,2}(?:fixture\s+|outlet\s+|light\s+|ceiling\s+)?box`, unless: /\bfan[- ]rated (?:box|brace) (?:is |was )?(?:present|installed|in place)/i },
      { re: rx`(?<!\b(?:not|non)[- ])(?:ceiling\s+)?fans?\s+${gap(3)}(?:rocks|rocking|sways)\b` },
      { re: rx`(?:not|non)[- ](?:an?\s+)?fan[- ](?:rated|support(?:ing)?)\b` },
      // A fan hung from a box that cannot carry it (NFPA 70 (NEC) 2023, 314.27(C)): "not rated to carry a fan", "no fan brace".
      { re: rx`fans?\s+${anyGap(12)}box\s+${anyGap(4)}(?:${T.BE})?not\s+(?:rated|listed|approved|designed)\s+(?:to\s+(?:carry|support|hold)|for)\s+(?:a\s+|the\s+)?(?:ceiling\s+)?fan` },
      { re: rx`(?:no|without|lacks?|missing)\s+(?:a\s+|any\s+)?(?:ceiling\s+)?fan[- ](?:rated\s+)?(?:brace|box|support|bracket)`, context: /\bfans?\b/i },
      { re: rx`(?:no|without)\s+fan[- ]rat(?:ing|ed)\b(?!\s+(?:is|was)\s+(?:needed|required))`, context: /\bbox\b/i },
      // A ceiling fan and its wobble in one clause, with its mounting described between ("hung from a j-box hook only, no brace, wobbles").
      { re: rx`ceiling\s+fans?\s+(?:(?!(?:not|without|never|none|free|satisfactory|ok|operated|operate|operates)\b)[\w'/#().@-]+,?\s+){0,14}?(?<!\b(?:no|any|little|slight)\s)(?:wobbl\w*|sways|shakes)\b` },
    ],
  },
  {
    code: 'switch-issue',
    trigger: /switch|toggle|rocker|paddle|dimmer|\b(?:3|4|three|four)[- ]ways?\b/i,
    patterns: [
      // A switch whose purpose the inspector could not find ("a switch by the sink that I could not find a purpose for"; common practice).
      { re: rx`${T.SWITCH}\s+${anyGap(10)}(?:(?:could\s?n[o']t|can\s?n[o']t|cannot|unable to|did\s?n[o']t|was not able to)\s+(?:find|determine|identify|tell|work out|figure out)\s+(?:a|any|its|the|what)\s+(?:purpose|function|use)|(?:purpose|function)\s+(?:is\s+|was\s+|remains\s+)?(?:unknown|undetermined|not (?:known|determined|found)))` },
      { re: rx`${T.SWITCH}\s+${gap(8)}${T.BE}(?:${T.INOPERATIVE}|loose|broken|damaged|cracked|(?:warm|hot) to the touch|warm|hot|sparks?|sparking|arcs?\b(?![- ]fault)|arcing|${T.FAILED} (?:operate|work|respond|control))` },
      { re: rx`${T.SWITCH}\s+${gap(7)}(?:(?:has|have|had|of|with|serves?)\s+)?(?:an?\s+)?(?:unknown|no known|undetermined|unclear) (?:function|purpose|use)` },
      { re: rx`(?:function|purpose) of (?:the |a |an )?${gap(2)}${T.SWITCH}\s+${gap(5)}${T.BE}(?:unknown|unclear|undetermined|not determined|could not be determined)` },
      { re: rx`(?:${T.INOPERATIVE}|loose|broken|damaged|cracked|unknown(?:[- ]function)?)\s+${gap(2)}${T.SWITCH}(?!\s*(?:cover\s*)?plates?)` },
      // Common practice: a switch whose purpose cannot be found is reported for the seller or an electrician to identify.
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}(?:(?:has|have|had|with)\s+)?(?:no|unknown|unk\.?)\s+(?:apparent\s+|known\s+|obvious\s+|determined\s+)?(?:function|purpose|use)` },
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}(?:does|did|do)\s*(?:n[o']t|not)?\s*(?:appear to\s+|seem to\s+)?(?:nothing|not (?:control|operate|turn on|power) (?:anything|any\w*)|not turn (?:the\s+)?${gap(2)}(?:on|off))` },
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}(?:does|did)\s*n[o']?t\s+(?:appear to\s+|seem to\s+)?(?:control|operate|turn on|power|do)\s+(?:anything|any\s+\w+)` },
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}${T.BE}loose in (?:the|its) (?:wall|box)` },
      // "The switch controlling the desk receptacle is broken": the switch is the subject, not what it controls.
      { re: rx`${T.SWITCH}\s+(?:that\s+)?(?:controlling|controls|for|serving|serves|operating|operates)\s+(?:the\s+|a\s+)?${anyGap(3)}(?:${T.RCPT}|${T.LIGHT}|fans?\b|disposal|disposer)\s+${T.BE}(?:${T.INOPERATIVE}|loose|broken|damaged|cracked)` },
      // A switch whose purpose could not be found, in more wordings (common practice): "could not
      // determine what it controls", "could not be determined to operate any fixture", "dosnt seem to
      // do anything", "do not control the chandelier reliably", "does not turn the lights on".
      { re: rx`${T.SWITCH}\s+${anyGap(10)}(?:could\s?n[o']?t|cannot|can't|unable to)\s+(?:be\s+)?determine[ds]?\s+(?:what\s+(?:it|they)\s+(?:controls?|operates?|does)|(?:its|their)\s+(?:function|purpose)|to\s+(?:operate|control|power))` },
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}(?:dosn'?t|doesn'?t|does\s+not)\s+seem\s+to\s+do\s+anything` },
      { re: rx`${T.SWITCH}\s+${SWITCH_GAP}(?:do|does|did)\s*n[o']?t\s+(?:control|operate|turn on)\s+(?:the\s+)?(?:[\w-]+\s+)?${T.LIGHT}\s+(?:reliably|properly|correctly|consistently|at all)` },
      { re: rx`${T.SWITCH}\s+${anyGap(6)}(?:do|does|did)\s*n[o']?t\s+turn\s+(?:the\s+)?${T.LIGHT}\s+on\b` },
      { re: rx`${T.SWITCH}\s+(?:for|to)\s+(?:the\s+)?${anyGap(3)}(?:crackles?|crackling|buzz(?:es|ing)?)\b` },
      { re: rx`${T.SWITCH}\s+${gap(6)}(?:crackles?|crackling|buzz(?:es|ing)?)\b` },
      // A push button, toggle or switch stuck in one position (common practice): "the upper button of the push-button switch pair is stuck in".
      { re: rx`(?:${T.SWITCH}|buttons?|toggles?|rockers?)\s+${gap(9)}${T.BE}(?:stuck|jammed|frozen)\b(?!\s+(?:open|closed)\s+(?:breaker|valve))`, context: /switch|push[- ]?button|toggle|rocker/i },
      // The switch's toggle, rocker or paddle broken or loose (common practice).
      { re: rx`(?:toggle|rocker|paddle)s?\s+${gap(3)}${T.BE}(?:broken|snapped(?: off)?|sloppy|loose|missing|cracked|stuck)`, context: /switch|toggle/i },
    ],
  },
  {
    code: 'aluminum-branch-wiring',
    trigger: /alum|\bal\b/i,
    defaultRoom: 'whole-house',
    isHouseWide: true,
    ignoresContext: true,
    patterns: [
      {
        re: rx`(?:(?:single|solid)[- ](?:strand(?:ed)?|conductor)\s+)?(?:aluminum|aluminium|alum\.?|al)\s+(?:single[- ]strand\s+|solid\s+)?(?:branch(?:[- ]circuit)?\s+)?(?:circuit\s+)?(?:wir(?:e|es|ing)|conductors?|circuits?)\b`,
        unless: /\bstranded\b|service[- ]entrance|se cable|feeder|service conductors/i,
      },
      {
        re: rx`(?:branch[- ]circuits?|branch wiring|wiring|circuits)\s+${gap(5)}${T.BE}(?:(?:single|solid)[- ](?:strand(?:ed)?|conductor)\s+)?(?:aluminum|aluminium)\b`,
        unless: /\bstranded\b|service[- ]entrance|se cable|feeder/i,
      },
      // "the addition is wired with single-strand aluminum on its 15 and 20 amp circuits" (common practice).
      {
        re: rx`wired\s+(?:entirely\s+|mostly\s+|partly\s+)?(?:with|in|using)\s+(?:(?:single|solid)[- ](?:strand(?:ed)?|conductor)\s+)?(?:aluminum|aluminium)\b(?!\s+(?:feeders?|service|se\b))`,
        unless: /\bstranded\b|service[- ]entrance|se cable|feeder/i,
      },
    ],
  },
  {
    code: 'knob-and-tube',
    trigger: /knob|k\s?&\s?t|\bk-t\b|\bknt\b|ungrounded|two[- ]wire|2[- ]wire|cloth|fabric|rubber/i,
    defaultRoom: 'whole-house',
    // A wiring method is where the sentence finds it, in any of its clauses ("remains in use; it is visible in the attic").
    placeAnywhereInSentence: true,
    patterns: [
      { re: rx`knob[- ]?(?:and|&|n|'n'?)[- ]?tube`, unless: WIRING_OUT_OF_USE },
      { re: rx`\bk\s?&\s?t\b|\bk-t\b|\bknt\b`, unless: WIRING_OUT_OF_USE },
      // Two-wire or cloth-covered cable is a wiring method of its own; at a three-slot receptacle it
      // is an open ground, so it is knob-and-tube only when the sentence says the wiring is that old
      // kind with no receptacle on it (common practice).
      { re: rx`(?:ungrounded|two[- ]wire|2[- ]wire|cloth[- ](?:insulated|covered|sheathed)|fabric[- ](?:insulated|covered)|rubber[- ]insulated)\s+(?:legacy\s+|old(?:er)?\s+|original\s+|vintage\s+)?(?:wir(?:e|es|ing)|cables?|circuits?)\b`, unless: OLD_CABLE_NOT_KT },
    ],
  },
  {
    code: 'service-equipment',
    trigger: /service|weather\s?head|drip|meter|\bse\b|seu|mast|overhead|utility|clearance|drop|limb|branch|tree|pedestal/i,
    fixedRoom: 'exterior',
    patterns: [
      { re: rx`${T.SERVICE}\s+${gap(8)}${T.BE}(?:damaged|leaning|bent|loose|pulling away|detached|unsecured|not (?:secured|sealed|properly (?:secured|sealed|supported))|${T.ABSENT}|deteriorated|worn|frayed|cracked|rusted|rusting|corroded|too low|sagging|in contact with|contacting|touching|rubbing|exposed|weathered|brittle|torn|split)` },
      { re: rx`(?:${T.NO}|damaged|deteriorated|frayed|worn|cracked|weathered|brittle|loose|leaning|bent|rusted|corroded)\s+${gap(2)}${T.SERVICE}(?!\s+(?:deficiencies|defects|issues|problems|concerns)\b)` },
      { re: rx`(?:trees?|branches|limbs|vegetation|vines)\s+${gap(3)}(?:in contact with|contacting|touching|rubbing|against|interfering with)\s+(?:the\s+)?${gap(2)}${T.SERVICE}` },
      { re: rx`(?:inadequate|insufficient|improper|low)\s+(?:service\s+)?(?:drop\s+)?clearance\b`, context: /service|drop|overhead|mast|utility|roof/i, unless: PANEL_CONTEXT },
      { re: rx`${T.SERVICE}\s+${gap(8)}(?:has\s+|have\s+|is\s+|are\s+)?(?:pulled|pulling|separated|separating|come|coming|broken)\s+(?:away\s+|loose\s+)?(?:from|off)\b` },
      { re: rx`${T.SERVICE}\s+${gap(4)}(?:jacket|sheath(?:ing)?|insulation)\s+${T.BE}(?:(?:uv|sun)[- ]?)?(?:degraded|damaged|cracked|split|deteriorated|worn|brittle|torn)` },
      { re: rx`${T.SERVICE}\s+${gap(6)}(?:${T.BE})?(?:not (?:strapped|supported|fastened|clamped)|rubs?|rubbing|chafing|chafed)\b` },
      // Common practice: service drop conductors keep their clearance above decks, roofs and drives (NFPA 70 (NEC) 2023, 230.24).
      { re: rx`${T.SERVICE}\s+${anyGap(8)}(?:cross(?:es)?|pass(?:es)?|runs?|hangs?|sags?)\s+(?:right\s+|directly\s+|straight\s+)?(?:over|through|about|roughly|only|within|among|across|to)\b`, context: /\b(?:\d+|five|six|seven|eight|nine|ten)\s*(?:ft|feet|foot|')|limbs?|branch(?:es)?|\btrees?\b|within reach|clearance/i, unless: /\b(?:otherwise secure|adequate clearance|clearance (?:is )?(?:adequate|ok|good))\b/i },
      { re: rx`(?:service\s+)?drop\s+(?:sags?|sagging|clearance\s+(?:over|above|at|to|is)|is too low|rubs?|rubbing)\b`, context: /service|overhead|utility|drop/i, unless: /\bclearance (?:is )?(?:adequate|ok|good|sufficient)\b/i },
      { re: rx`(?:limbs?|branch(?:es)?|trees?)\s+${gap(3)}(?:rubs?|rubbing|touch(?:es|ing)?|contacts?|contacting|in contact with|rest(?:s|ing)?\s+on|lying on|lie on|grow(?:s|ing)?\s+(?:through|into|around))\s+(?:against\s+|on\s+)?(?:them|it|(?:the\s+)?(?:service\s+|drop\s+|overhead\s+)?(?:drop|conductors|service|lines|wires))`, context: /service|drop|overhead|conductor|utility/i },
      // NFPA 70 (NEC) 2023, 230.24 (from memory): "measured clearance above the deck ... is about 8 ft".
      { re: rx`clearance\s+(?:above|over)\s+(?:the\s+)?(?:(?:rear|back|front|side|upper|lower|flat)\s+)?(roof|deck|walkway|walk|sidewalk|driveway|drive|grade|ground|yard|patio|pool|porch|balcony)\b[^.;]{0,40}?\b(?:is|was|of)\s+(?:only\s+|about\s+|approx(?:imately|\.)?\s+|roughly\s+|~\s?)?(\d+(?:\.\d+)?)\s*(?:ft\b|feet|foot|')`, check: isTooLowSurfaceFirst },
      // A part of the service and a condition of it in the same clause, with other words between
      // ("the meter socket on the left side has heavy corrosion", "SE cable @ meter - jacket split").
      { re: rx`${T.SERVICE}\s+${anyGap(10)}(?:${T.BE})?(?:${T.SERVICE_CONDITION})`, unless: SERVICE_SOUND },
      { re: rx`(?:no|without|missing)\s+(?:a\s+)?(?:drip loop|weather\s?head|service mast)\b` },
      // NFPA 70 (NEC) 2023, 230.24 (from memory): overhead service conductors keep 3 ft above a roof,
      // 10 ft above grade, decks and walks, 12 ft above a residential driveway; a measured
      // clearance below that is the defect.
      { re: rx`${T.SERVICE}[^.;]{0,100}?${CLEARANCE}`, check: isTooLow },
      // A clearance stated in inches is below every 230.24 minimum (3 ft at the least, from memory).
      { re: rx`${T.SERVICE}[^.;]{0,100}?\bclears?\s+(?:the\s+)?(?:[\w-]+\s+){0,2}?by\s+(?:only\s+)?(?:about\s+|approx(?:imately|\.)?\s+|roughly\s+)?(\d{1,2})\s*(?:inches|in\b|")`, check: (m) => Number(m[1]) < 36 },
    ],
  },
  {
    code: 'evaluate-general',
    trigger: /electrician|electrical contractor/i,
    isFallbackOnly: true,
    defaultRoom: 'whole-house',
    // An evaluation of the system is house-wide wherever the sentence stands; only a place it names narrows it.
    ignoresContext: true,
    patterns: [
      { re: rx`(?:evaluat|review|inspect|assess|examin|diagnos|correct|repair)\w*\s+${anyGap(8)}(?:by|from)\s+(?:a|an)\s+${anyGap(3)}(?:electrician|electrical contractor)s?`, unless: REFERS_TO_OTHERS_ONLY },
      // "Full evaluation by licensed electrician": terse notes leave out the article.
      { re: rx`(?:evaluation|review|assessment)\s+by\s+(?:licensed\s+|qualified\s+)?(?:electrician|electrical contractor)s?`, unless: REFERS_TO_OTHERS_ONLY },
      // "a licensed electrician perform a complete evaluation of the system": the noun as well as the verb.
      { re: rx`(?:electrician|electrical contractor)s?\s+${anyGap(4)}(?:evaluate|review|inspect|assess|examine|diagnose|check|go (?:through|over)|look (?:over|through)|walk (?:through\s+)?(?:the\s+)?(?:whole|entire|electrical)|(?:perform|conduct|do|make|provide)\s+(?:an?\s+)?(?:(?:full|complete|thorough|comprehensive|further)\s+)?(?:evaluation|review|inspection|assessment))`, unless: REFERS_TO_OTHERS_ONLY },
      { re: rx`(?:consult|contact|hire|engage|retain|call)\s+(?:with\s+)?(?:a|an)\s+${anyGap(3)}(?:electrician|electrical contractor)`, unless: /\bif\b|\bany\b/i },
      // "recommend a licensed electrician do a full evaluation of the whole system" (common practice).
      { re: rx`(?:electrician|electrical contractor)s?\s+${anyGap(3)}(?:do|perform|make|conduct|carry out|complete|provide)\s+(?:a|an)\s+(?:[\w-]+\s+){0,2}?(?:evaluation|review|inspection|assessment)`, unless: REFERS_TO_OTHERS_ONLY },
    ],
  },
];
