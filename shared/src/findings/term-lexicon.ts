/**
 * Regular-expression fragments for the trade words inspectors use, with their abbreviations and
 * common misspellings. Every phrase in code-patterns.ts is built from these, so a new spelling of a
 * word is added here once and every pattern that uses the word accepts it.
 */

/**
 * Builds a case-insensitive global RegExp from a template; backslashes are kept as written. Every
 * phrase starts at the start of a word, which also lets the engine skip mid-word positions fast.
 */
export function rx(strings: TemplateStringsArray, ...parts: string[]): RegExp {
  return new RegExp(`(?<![\\w])(?:${String.raw({ raw: strings.raw }, ...parts)})`, 'gi');
}

/** Words that name a different device or part, so a gap between two pattern words may not cross them. */
const DEVICE_NOUNS = String.raw`(?:wir(?:e|es|ing)\b|cables?\b|covers?\b|plates?\b|box(?:es)?\b|j-?box|panel|sub-?panel|breakers?\b|switch|light|fixture|fans?\b|splices?\b|cords?\b|rcpts?\b|recep|outlets?\b|smoke|alarms?\b|detectors?\b|gfc?i|afci|screws?\b|conductors?\b)`;

/** Up to `n` ordinary words (not device nouns, not sentence punctuation) between two pattern words. */
export function gap(n: number): string {
  return String.raw`(?:(?!${DEVICE_NOUNS})[\w'/#().-]+\s+){0,${n}}?`;
}

/**
 * Up to `n` words between an adjective and its noun: not device nouns and not prepositions or
 * conjunctions ("cracked at the receptacle" speaks of something else being cracked).
 */
export function adjGap(n: number): string {
  return String.raw`(?:(?!${DEVICE_NOUNS}|(?:at|on|in|near|by|behind|beside|under|of|to|for|from|with|and|or)\b)[\w'/#().-]+\s+){0,${n}}?`;
}

/** Up to `n` words of any kind (device nouns allowed), for phrases whose two ends are specific. */
export function anyGap(n: number): string {
  return String.raw`(?:[\w'/#().@-]+,?\s+){0,${n}}?`;
}

/** Grammatical filler allowed between a negative word and "GFCI"/"AFCI" ("not protected by a GFCI"). */
export const PROTECTION_FILLER = String.raw`(?:(?:protected|protection|by|a|an|any|on|the|with|provided|installed|equipped|of|for|have|has|had|is|are|be|been|currently|appear|appears|to)\s+){0,5}`;

export const T = {
  /** receptacle, recepticle, receptical, recep., rcpt, outlet, outlett, plug-in */
  RCPT: String.raw`(?:rec[ei]pt?[aeiu]?c(?:le|al|el)s?\b|recepts?\b\.?|recep\b\.?|rcpts?\b\.?|rcp\b\.?|outlett?s?\b(?!\s+height)|duplex(?:es)?\b|devices?\b)`,
  GFCI: String.raw`(?:gfcis?\b|g\.f\.c\.i\.|gfis?\b|gfic\b|gcfi\b|ground[- ]fault(?:[- ]circuit[- ]interrupt(?:er|or|ing)?s?)?(?:[- ]protect(?:ed|ion))?)`,
  AFCI: String.raw`(?:afcis?\b|a\.f\.c\.i\.|afi\b|arc[- ]fault(?:[- ]circuit[- ]interrupt(?:er|or|ing)?s?)?(?:[- ]protect(?:ed|ion))?)`,
  BREAKER: String.raw`(?:circuit\s+)?(?:breakers?\b|brkrs?\b\.?|bkrs?\b\.?|ocpds?\b|fuses?\b|overcurrent (?:protection|devices?))`,
  PANEL: String.raw`(?:sub-?\s?panel|panel\s*board|panel|load cent(?:er|re)|breaker box|fuse box)`,
  JBOX: String.raw`(?:(?:junction|splice|electrical|outlet|switch|ceiling|wiring)\s+box(?:es)?\b|j-?\s?box(?:es)?\b|jbox(?:es)?\b)`,
  PLATE: String.raw`(?:(?:cover|face|wall|trim|switch|outlet|receptacle)[- ]?plates?\b|plates?\b|covers?\b)`,
  WIRING: String.raw`(?:wir(?:e|es|ing)\b(?!\s+nuts?\b)|cables?\b|conductors?\b|nm(?:-b)?\b|romex\b)`,
  SWITCH: String.raw`(?:(?:(?:light|wall|dimmer|3-way|three[- ]way|toggle)\s+)?switch(?:es)?\b|dimmers?\b(?!\s+switch)|(?:3|4|three|four)[- ]ways?\b(?!\s+(?:switch|splice|valve|tee|connector|adapter|tap|plug|lamp|bulb|stop)))`,
  LIGHT: String.raw`(?:(?:recessed|can|ceiling|closet|exterior|flood|porch|vanity|wall)\s+)?(?:light(?:ing)?(?:\s+fixtures?)?\b(?![- ](?:rust|rusting|corrosion|corroded|stain(?:s|ing|ed)?|duty|weight|wear|scratch(?:es)?|surface|gr[ae]y|brown|tan)\b)|lights\b|fixtures?\b|luminaires?\b|chandeliers?\b|gasoliers?\b|lanterns?\b|pendants?\b|sconces?\b|can lights?\b|flood ?lights?\b|lamp[- ]?posts?\b)`,
  SMOKE: String.raw`(?:(?:smoke(?:\s*(?:\/|and|&|or)\s*(?:co|carbon monoxide))?|co|carbon monoxide)\s*(?:alarms?|detectors?)\b|smokes\b)`,
  SERVICE: String.raw`(?:(?:overhead\s+)?service[- ](?:mast|riser|head|drop(?: drip loop| conductors?| wires?| cable)?|entrance(?: cable| conductors?)?|conductors?|lateral|cable)\b|weather\s?head\b|drip loops?(?: conductors?)?\b|(?:electric\s+)?meter(?:\s+(?:base|socket|box|can|enclosure|pan|pole|post|ring))\b|se cable\b|seu\b|mast(?:head)?\b|overhead (?:service|conductors|wires|lines)\b|utility (?:drop|lines|wires)\b|(?:(?:meter(?:\s*\/\s*disconnect)?|service|disconnect)\s+)?(?<!(?:sink|lavatory|basin|vanity)\s)pedestal\b(?!\s+(?:sinks?|lavator(?:y|ies)|basins?|fans?)))`,
  /**
   * What goes wrong with a part of the service (common practice): damage, weathering, corrosion,
   * loose or leaning support, and conductors lying on or against something.
   */
  SERVICE_CONDITION: String.raw`(?:frayed|cracked|split|torn|brittle|abraded|chafed|(?:uv|sun)[- ]?degraded|degraded|deteriorat\w*|worn|weathered|damaged|broken|bent|bend in\b|lean(?:s|ing)\b|loose|(?:has\s+)?lost (?:\w+\s+){0,3}?(?:its\s+|the\s+)?(?:outer\s+)?(?:sheathing|jacket|insulation)|rock(?:s|ing)\b|corroded|(?:heavy|severe|some|visible)\s+(?:corrosion|rust)|corrosion\b|rust(?:ed|ing|y)?\b|rott(?:ed|ing)|rotten|sag(?:s|ging|ged)?\b|tangled|pull(?:ed|ing) (?:away|loose|free|tight|out)|separat(?:ed|ing) from|detached|stressed|(?:resting|rests?|lies?|lying|laying|lays?) (?:directly\s+)?(?:on|against|in)\b|water (?:staining|stains?|intrusion)|(?:not|un)[- ]?(?:strapped|secured|supported|sealed|clamped)|straps? (?:missing|broken|loose)|missing (?:straps?|support)|(?:too\s+)?low\s+(?:over|above|to)\b)`,
  /** Failure verbs after "did not", "would not" ... */
  FAILED: String.raw`(?:did\s?n[o']?t|does\s?n[o']?t|would\s?n[o']?t|will not|won'?t|failed to|fails to|fail to|could not|couldn't|wouldn't)`,
  /** "missing", "absent", "not installed" ... after the thing that is missing. */
  ABSENT: String.raw`(?:missing|absent|lacking|gone\b|not (?:present|installed|provided|observed|found|noted|visible|evident)|none (?:present|installed|found|observed|provided))`,
  /** "no", "missing", "lacks" ... before the thing that is missing. */
  NO: String.raw`(?:no|missing|lacks?|lacking|lacked|without|absent|absence of)`,
  BROKEN: String.raw`(?:broken|cracked|damaged|loose|missing)`,
  INOPERATIVE: String.raw`(?:inoperative|inoperable|non-?functional|non-?operational|defective|faulty|not (?:working|functioning|functional|operating|operational|responding))`,
  BE: String.raw`(?:(?:(?:is|are|was|were)\s+(?:found|observed|noted|determined|confirmed|reported|seen)\s+to\s+be|(?:appears?|appeared|seems?|seemed) to be|is|are|was|were|has been|have been)\s+)?`,
} as const;
