import { distance } from 'fastest-levenshtein';
import type { Range } from './clause-splitter';
import type { MappedText } from './mapped-text';
import { readWords, type Vocabulary, type WordTokens } from './word-tokens';

/**
 * Normalisation before matching: inspectors' shorthand and abbreviations become the trade's full
 * words ("SE cable" → "service-entrance cable", "#12" → "12 AWG", "GFI" stays a GFCI word the
 * table knows), misspellings of trade words of 5+ letters are corrected by edit distance
 * ("recepticle", "junciton", "breker" → "breaker" is 1 edit), and number words become digits
 * ("forty amp" → "40 amp"). The result is a MappedText again: every character still knows where it
 * came from, so evidence and offsets stay exact substrings of the original report. `changed` lists
 * the stretches of the normalised text that differ from the source (a finding read through one of
 * them has `normalised` confidence).
 */
export interface NormalisedText extends MappedText {
  readonly changed: readonly Range[];
}

/** Whole-word shorthand → trade words (keys lower-case; matched case-insensitively). */
const SHORTHAND: Readonly<Record<string, string>> = {
  recpt: 'receptacle', recpts: 'receptacles', rcpt: 'receptacle', rcpts: 'receptacles', rcp: 'receptacle',
  recept: 'receptacle', recepts: 'receptacles', recep: 'receptacle', receps: 'receptacles',
  outl: 'outlet', otlt: 'outlet', otlts: 'outlets',
  gfi: 'GFCI', gfis: 'GFCIs', gfic: 'GFCI', gcfi: 'GFCI',
  afi: 'AFCI',
  ocpd: 'breaker', ocpds: 'breakers', brkr: 'breaker', brkrs: 'breakers', bkr: 'breaker', bkrs: 'breakers', cb: 'breaker',
  jct: 'junction', jcts: 'junctions', junc: 'junction', jbox: 'junction box', jboxes: 'junction boxes', jb: 'junction box', jbs: 'junction boxes', 'j.b.': 'junction box', 'j-box': 'junction box', 'j-boxes': 'junction boxes',
  'k&t': 'knob-and-tube', kt: 'knob-and-tube', knt: 'knob-and-tube',
  seu: 'service-entrance cable', sec: 'service-entrance cable', ser: 'service-entrance cable',
  pnl: 'panel', pnls: 'panels', subpnl: 'subpanel', 'sub-pnl': 'subpanel',
  svc: 'service', serv: 'service', elec: 'electrical', elect: 'electrical',
  ckt: 'circuit', ckts: 'circuits', cct: 'circuit', ccts: 'circuits',
  sw: 'switch', sws: 'switches', swtch: 'switch',
  lt: 'light', lts: 'lights', fixt: 'fixture', fixts: 'fixtures', fxtr: 'fixture', fxtrs: 'fixtures', lite: 'light', lites: 'lights',
  gnd: 'ground', grnd: 'ground', grd: 'ground', gnds: 'grounds', grnds: 'grounds', grds: 'grounds', gnded: 'grounded', grnded: 'grounded',
  grounde: 'ground', groundes: 'grounds',
  ungnd: 'ungrounded', ungrnd: 'ungrounded', ungrnded: 'ungrounded', "ungr'd": 'ungrounded', ungrd: 'ungrounded',
  neut: 'neutral', neuts: 'neutrals', cond: 'conductor', conds: 'conductors',
  alm: 'alarm', alms: 'alarms', perm: 'permanent', 'perm.': 'permanent', mfd: 'manufactured', 'mfd.': 'manufactured',
  det: 'detector', dets: 'detectors', smk: 'smoke', sd: 'smoke detector', sds: 'smoke detectors',
  inop: 'inoperative', 'inop.': 'inoperative', inopr: 'inoperative', nw: 'not working', 'n/w': 'not working',
  dmg: 'damaged', dmgd: 'damaged', dmged: 'damaged', brkn: 'broken', broke: 'broken', msng: 'missing', "miss'g": 'missing',
  'w/o': 'without', 'w/out': 'without', 'w/': 'with',
  reqd: 'required', "req'd": 'required', rcmd: 'recommend', recomm: 'recommend', recom: 'recommend',
  cvr: 'cover', cvrs: 'covers', cov: 'cover', plt: 'plate', plts: 'plates',
  wp: 'weatherproof', wr: 'weather-resistant', wx: 'weather',
  al: 'aluminum', alum: 'aluminum', aluminium: 'aluminum', cu: 'copper',
  ga: 'AWG', 'ga.': 'AWG', gauge: 'AWG', gage: 'AWG', guage: 'AWG', awg: 'AWG',
  obs: 'observed', 'obs.': 'observed', unk: 'unknown', 'unk.': 'unknown', clg: 'ceiling', btn: 'button', mfr: 'manufactured',
  // Spanish trade words in reports written in Spanish-influenced English (common practice in bilingual reports).
  quemado: 'scorched', quemada: 'scorched', quemados: 'scorched', quemadas: 'scorched', suelto: 'loose', suelta: 'loose', sueltos: 'loose', sueltas: 'loose',
  tapa: 'cover', tapas: 'covers', contacto: 'receptacle', contactos: 'receptacles', enchufe: 'receptacle', enchufes: 'receptacles',
  apagador: 'switch', apagadores: 'switches', abanico: 'fan', abanicos: 'fans',
  bsmt: 'basement', bsmnt: 'basement', bdrm: 'bedroom', bdrms: 'bedrooms', bedrm: 'bedroom', bedrms: 'bedrooms', brs: 'bedrooms', kit: 'kitchen', ktchn: 'kitchen',
  gar: 'garage', ba: 'bathroom', bth: 'bathroom', bthrm: 'bathroom', lndry: 'laundry', hwy: 'hallway', ext: 'exterior', extr: 'exterior',
};

/** Shorthand that is only expanded where the context says it is the trade word. */
const CONTEXTUAL = new Set(['nw', 'jb', 'jbs', 'al', 'cu', 'sd', 'sds', 'sec', 'ser', 'sw', 'lt', 'lts', 'cb', 'kt', 'ba', 'gar', 'kit', 'ext', 'wp', 'wr', 'wx', 'det', 'dets', 'cond', 'conds', 'ga', 'ga.', 'gauge', 'gage', 'guage', 'awg']);

const NUMBER_WORDS: Readonly<Record<string, number>> = {
  two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
  thirteen: 13, fourteen: 14, fifteen: 15, sixteen: 16, seventeen: 17, eighteen: 18, nineteen: 19, twenty: 20,
  thirty: 30, forty: 40, fifty: 50, sixty: 60, seventy: 70, eighty: 80, ninety: 90, hundred: 100,
};

/**
 * Every key a word can reach in NUMBER_WORDS, its own and those it inherits from Object: a Set
 * lookup first is much cheaper than an object lookup with an arbitrary word, and gives the same.
 */
const NUMBER_WORD_KEYS = new Set([...Object.keys(NUMBER_WORDS), ...Object.getOwnPropertyNames(Object.prototype)]);
/** SHORTHAND's own keys, for the same reason. */
const SHORTHAND_KEYS = new Set(Object.keys(SHORTHAND));
/** Every word (lower case) that a rule of replacementFor other than the spelling check looks for. */
const SPECIAL_WORDS: ReadonlySet<string> = new Set([...NUMBER_WORD_KEYS, ...SHORTHAND_KEYS, 'too', 'ext', 'extn']);

/**
 * Trade words that misspellings are corrected to (inflections listed so that a correct inflected
 * word is never "corrected" to another form). Only words of 5+ letters are corrected; short words
 * and any word within the distance of none of these are left as written.
 */
const VOCABULARY: readonly string[] = [
  'receptacle', 'receptacles', 'outlet', 'outlets', 'breaker', 'breakers', 'junction', 'electrical', 'electric',
  'electrician', 'electricians', 'conductor', 'conductors', 'aluminum', 'copper', 'ungrounded', 'grounded',
  'grounding', 'polarity', 'reversed', 'reverse', 'fixture', 'fixtures', 'inoperative', 'inoperable',
  'detector', 'detectors', 'detected', 'splice', 'splices', 'spliced', 'exposed', 'missing', 'damaged',
  'protection', 'protected', 'unprotected', 'interrupter', 'circuit', 'circuits', 'switch', 'switches',
  'bonding', 'bonded', 'electrode', 'service', 'entrance', 'neutral', 'neutrals', 'double', 'oversized',
  'undersized', 'extension', 'wiring', 'knockout', 'knockouts', 'directory', 'corrosion', 'corroded',
  'cracked', 'scorched', 'installed', 'install', 'evaluate', 'evaluation', 'evaluated', 'recommend',
  'recommended', 'replace', 'replaced', 'licensed', 'qualified', 'contractor', 'bathroom', 'bathrooms',
  'kitchen', 'garage', 'basement', 'bedroom', 'bedrooms', 'exterior', 'laundry', 'hallway', 'crawlspace',
  'countertop', 'countertops', 'weatherproof', 'ceiling', 'wobbles', 'wobbling', 'secured', 'unsecured',
  'terminal', 'terminals', 'nameplate', 'maximum', 'tripped', 'tripping', 'inspection', 'inspector',
  'observed', 'functional', 'defective', 'connected', 'disconnected', 'corrected', 'properly', 'improperly',
  'grounds', 'present', 'alarms', 'carbon', 'permanent', 'manufactured', 'expired', 'monoxide', 'luminaire', 'insulation', 'recessed', 'dead-front',
  'deadfront', 'subpanel', 'panelboard', 'jumpered', 'bootleg', 'knob-and-tube', 'tandem', 'ampacity',
  'conduit', 'energized', 'discolored', 'melted', 'loose', 'unknown', 'function', 'inoperable', 'cover',
  'plates', 'covers', 'panel', 'panels', 'labeled', 'labelled', 'unlabeled', 'identified', 'clearance',
  'weathered', 'deteriorated', 'drip', 'meter', 'overhead', 'supported', 'unsupported', 'protect',
  'weatherhead', 'weatherheads', 'masthead',
];
const VOCAB_SET = new Set(VOCABULARY);
/** Candidates by first letter, so a word is compared with a dozen words rather than all of them. */
const BY_FIRST = (() => {
  const map = new Map<string, string[]>();
  for (const w of VOCABULARY) {
    if (w.length < 5) continue;
    map.set(w[0], [...(map.get(w[0]) ?? []), w]);
  }
  return map;
})();

/** Ordinary English words near a trade word that must not be "corrected". */
const KEEP = new Set([
  'placed', 'plated', 'slates', 'source', 'services', 'serviced', 'servicing', 'switched', 'ground', 'rounds',
  'detects', 'defected', 'expose', 'exposes', 'damages', 'dammed', 'misting', 'kissing', 'mission', 'panes',
  'panels', 'paneled', 'coverage', 'covered', 'covering', 'coves', 'lovers', 'circuitry', 'receipt',
  'receipts', 'receptor', 'reception', 'outline', 'outlay', 'outlast', 'breaking', 'breaks',
  'bleaker', 'breakfast', 'doubled', 'doubles', 'trouble', 'treated', 'tripod', 'tripled', 'installer',
  'installs', 'evaluates', 'recommends', 'replaces', 'replica', 'present', 'presents', 'presence', 'prevent',
  'resent', 'carton', 'carbons', 'meters', 'metered', 'matter', 'letter', 'neutrally', 'natural', 'function',
  'functions', 'junctions', 'alarmed', 'alarm', 'claims', 'coppers', 'chopper', 'copies', 'hopper', 'proper',
  'wiping', 'wiring', 'hiring', 'firing', 'tiring', 'bonding', 'binding', 'bending', 'banding', 'founding',
  'sounding', 'rounding', 'pounding', 'grinding', 'grounding', 'grunting', 'garages', 'gargle', 'kitchens',
  'corrosive', 'corrodes', 'correct', 'corrects', 'connect', 'connects', 'collected', 'conducted', 'protests',
  'protects', 'inspected', 'inspections', 'inspectors', 'observe', 'observes', 'absorbed', 'observer',
  'exterior', 'interior', 'inferior', 'bathrooms', 'bedrooms', 'supports', 'supporter', 'loosen', 'loosely',
  'lessee', 'unknowns', 'secure', 'secures', 'securely', 'second', 'tandem', 'terminals', 'terminate',
  'terminated', 'germinal', 'identify', 'identifies', 'cleared', 'clearances', 'weather', 'deterred',
  'meltdown', 'melting', 'belted', 'molted', 'energize', 'conduct', 'conducts', 'conduits', 'panelled',
  'labels', 'labeled', 'labored', 'unlabelled', 'directly', 'direction', 'directors', 'directed', 'extensive',
  'extended', 'extending', 'oversize', 'undersize', 'entrances', 'entranced', 'services', 'swatch', 'swatches',
  'snitch', 'stitch', 'stitches', 'twitch', 'switchgear', 'dribble', 'dripping', 'dripped', 'drips', 'overhang',
  'overheat', 'overheated', 'overhaul', 'maximal', 'maxima', 'minimum', 'namely', 'tapped', 'taped', 'topped',
  'loosed', 'plates', 'plated', 'planes', 'places', 'platen', 'slated', 'recess', 'recesses', 'recessed',
  'damage', 'connector', 'connectors', 'manufacturer', 'manufacturers', 'trapped', 'functioned', 'isolation',
  'contacted', 'insertion', 'manufacture', 'manufacturing',
]);

/**
 * Answers already known: null for every vocabulary and kept word (they are never corrected), and
 * the answers computed so far (a pure function of the word; cleared past MEMO_LIMIT).
 */
const MEMO = new Map<string, string | null>();
const MEMO_LIMIT = 20_000 + VOCAB_SET.size + KEEP.size;
function resetMemo(): void {
  MEMO.clear();
  for (const w of VOCAB_SET) MEMO.set(w, null);
  for (const w of KEEP) MEMO.set(w, null);
}
resetMemo();

/** The trade word a misspelt word stands for, or null (5+ letters; 1 edit up to 7 letters, 2 from 8). */
export function correctSpelling(word: string): string | null {
  return correctLowerSpelling(word.toLowerCase());
}

/** correctSpelling of a word already in lower case. */
function correctLowerSpelling(lower: string): string | null {
  if (lower.length < 5) return null;
  // Vocabulary and kept words answer null from the same map as the remembered answers.
  const cached = MEMO.get(lower);
  if (cached !== undefined) return cached;
  const limit = lower.length >= 8 ? 2 : 1;
  let best: string | null = null;
  let bestDistance = limit + 1;
  for (const candidate of BY_FIRST.get(lower[0]) ?? []) {
    if (Math.abs(candidate.length - lower.length) > limit) continue;
    // Two swapped neighbours ("wobbels", "junciton") count as one edit, as a typist makes them.
    const d = isTransposition(lower, candidate) ? 1 : distance(lower, candidate);
    if (d < bestDistance && d <= (candidate.length >= 8 ? 2 : 1)) {
      best = candidate;
      bestDistance = d;
    }
  }
  // A plural or a past form of a vocabulary word is not a misspelling of it.
  if (best !== null && (lower === `${best}s` || lower === `${best}es` || lower === `${best}ed` || lower === `${best}d` || `${lower}s` === best)) best = null;
  // Another form of the same word ("correctly" beside "corrected") is not a misspelling of it.
  if (best !== null && stem(lower) === stem(best)) best = null;
  if (MEMO.size > MEMO_LIMIT) resetMemo();
  MEMO.set(lower, best);
  return best;
}

/** A word without its common ending ("correctly", "corrected" → "correct"). */
function stem(word: string): string {
  return word.replace(/(?:ly|ing|ed|es|s|ions?)$/, '');
}

/** Whether `a` is `b` with two neighbouring letters swapped. */
function isTransposition(a: string, b: string): boolean {
  if (a.length !== b.length) return false;
  let i = 0;
  while (i < a.length && a[i] === b[i]) i++;
  return i + 1 < a.length && a[i] === b[i + 1] && a[i + 1] === b[i] && a.slice(i + 2) === b.slice(i + 2);
}

/** Plural device nouns, and words that come before them, after which "too" is a misspelt "two". */
const TOO_PLURAL = /^(?:receptacles|recepticles|outlets|plates|covers|breakers|lights|fixtures|switches|alarms|detectors|fans|boxes|cords|bulbs|screws|taps)$/;
const TOO_MODIFIER = /^(?:cover|face|wall|switch|outlet|receptacle|light|smoke|ceiling|gfci|junction|extension|open|double)$/;

/** Words after which "Al"/"Cu" are metals, and gauge words that follow a size. */
const WIRE_CONTEXT = /^(?:\d{1,2}|#\d{1,2}|awg|ga\.?|gauge|gage|guage|wire|wires|wiring|conductors?|branch|circuits?|cable|solid|stranded|and|or|\/)$/i;
const SIZE = /^(?:#\s?)?(\d{1,2})$/;

function capitalised(original: string, replacement: string): string {
  // A capital on a short abbreviation ("Cu", "Kit") is the abbreviation's, not a sentence start's.
  return original.length > 3 && /^[A-Z][a-z]/.test(original) && /^[a-z]/.test(replacement) ? replacement[0].toUpperCase() + replacement.slice(1) : replacement;
}

/** What the normaliser reads off a word once per vocabulary word (see wordTokens' `Vocabulary`). */
interface WordInfo {
  /** The word in lower case without a trailing full stop. */
  readonly bare: string;
  /** Whether a rule of replacementFor other than the spelling check looks for it. */
  readonly special: boolean;
  /** The spelling check's answer for `bare` (a trade word in lower case), or null. */
  readonly spelling: string | null;
}

const WORD_INFO = Symbol('normaliser word info');

/** The word-info table of the vocabulary read last (looked up once per vocabulary, not per word). */
let infoVocabulary: Vocabulary | null = null;
let infoTable: Array<WordInfo | undefined> = [];

function wordInfo(tokens: WordTokens, id: number): WordInfo {
  if (tokens.vocabulary !== infoVocabulary) {
    infoVocabulary = tokens.vocabulary;
    infoTable = infoVocabulary.table<WordInfo>(WORD_INFO);
  }
  const table = infoTable;
  const known = table[id];
  if (known !== undefined) return known;
  const lower = tokens.vocabulary.words[id];
  const bare = lower.endsWith('.') ? lower.slice(0, -1) : lower;
  const info: WordInfo = {
    bare,
    special: SPECIAL_WORDS.has(bare) || (bare !== lower && SPECIAL_WORDS.has(lower)),
    spelling: bare.length < 5 || !isAsciiLetters(bare) ? null : correctLowerSpelling(bare),
  };
  table[id] = info;
  return info;
}

/** The lower-case form of word k, or '' past either end. */
function lowerAt(tokens: WordTokens, k: number): string {
  return k >= 0 && k < tokens.count ? tokens.vocabulary.words[tokens.id[k]] : '';
}

/** The replacement for token i, or null to keep it as written. */
function replacementFor(tokens: WordTokens, i: number, source: string): string | null {
  const info = wordInfo(tokens, tokens.id[i]);
  const first = source.charCodeAt(tokens.start[i]);
  // Most words are none of the words the rules below look for: they go straight to the spelling check.
  if (!info.special && first !== 35 && !(first >= 48 && first <= 57)) return info.spelling === null ? null : capitalised(source.slice(tokens.start[i], tokens.end[i]), info.spelling);
  const text = source.slice(tokens.start[i], tokens.end[i]);
  const lower = tokens.vocabulary.words[tokens.id[i]];
  const prev = lowerAt(tokens, i - 1);
  const next = lowerAt(tokens, i + 1);
  // "#12" → "12 AWG"; "12 ga", "12-gauge", "12g" → "12 AWG".
  const hash = first === 35 /* # */ ? /^#\s?(\d{1,2})$/.exec(text) : null;
  // "Bkr #6", "slot #14": after an index word the number names the device, not a wire size.
  if (hash && /^\s+$/.test(gapBefore(tokens, i, source)) && /^(?:bkrs?|brkrs?|breakers?|ckts?|circuits?|slots?|positions?|spaces?|no\.?|units?|items?|photos?|fuses?|cb)$/.test(prev)) return null;
  if (hash) return `${hash[1]} AWG`;
  const glued = first >= 48 && first <= 57 ? /^(\d{1,2})(?:ga|g|awg)$/i.exec(text) : null;
  if (glued) return `${glued[1]} AWG`;
  const { bare } = info;
  if (!info.special) return info.spelling === null ? null : capitalised(text, info.spelling);
  const number = NUMBER_WORD_KEYS.has(bare) ? NUMBER_WORDS[bare] : undefined;
  // "the north bedroom two receptacles": a number word after a room word stays a word, so the count
  // reader can tell it from an index ("bedroom 2").
  if (number !== undefined && /^(?:bed\s?rooms?|bath(?:room)?s?|rooms?|halls?|hallways?|kitchen|garage|basement)$/.test(prev)) return null;
  if (number !== undefined && (bare !== 'hundred' || /^\d/.test(prev))) {
    return bare === 'hundred' ? null : String(number);
  }
  // "missing too cover plates": "too" before a plural device noun is the number two.
  if (bare === 'too' && (TOO_PLURAL.test(next.replace(/\.$/, '')) || (TOO_MODIFIER.test(next) && TOO_PLURAL.test(lowerAt(tokens, i + 2).replace(/\.$/, ''))))) return '2';
  // "ext cord", "ext. cords": an extension cord, not the exterior.
  if ((bare === 'ext' || bare === 'extn') && /^cords?$/.test(next)) return 'extension';
  if (SHORTHAND_KEYS.has(lower) || SHORTHAND_KEYS.has(bare)) {
    const gap = gapBefore(tokens, i, source);
    // "Report #KT-24-0917", "Unit GFI-2": letters glued to a number by a hyphen, or after "#", are an identifier.
    if (isIdentifier(source, tokens.end[i], gap)) return null;
    const key = SHORTHAND_KEYS.has(lower) ? lower : bare;
    const word = SHORTHAND[key];
    if (CONTEXTUAL.has(key) && !contextAllows(key, prev, next, gap, text)) return null;
    return word.toLowerCase() === lower ? null : capitalised(text, word);
  }
  return spellingFor(text, bare);
}

/**
 * A misspelt word, even at the end of a sentence ("tested as ungrouded."), corrected without its
 * stop: five or more ASCII letters, then perhaps a full stop (`bare` is then the word in lower case
 * without it).
 */
function spellingFor(text: string, bare: string): string | null {
  if (bare.length < 5 || !isAsciiLetters(bare)) return null;
  const fixed = correctLowerSpelling(bare);
  return fixed === null ? null : capitalised(text, fixed);
}

/** The text between token i and the one before it (' ' before the first). */
function gapBefore(tokens: WordTokens, i: number, source: string): string {
  return i > 0 ? source.slice(tokens.end[i - 1], tokens.start[i]) : ' ';
}

/** Whether a lower-case word consists of the letters a-z only. */
function isAsciiLetters(lower: string): boolean {
  for (let k = 0; k < lower.length; k++) {
    const code = lower.charCodeAt(k);
    if (code < 97 || code > 122) return false;
  }
  return true;
}

function isIdentifier(source: string, end: number, gapBefore: string): boolean {
  const next = source.charCodeAt(end + 1);
  if (source[end] === '-' && next >= 48 && next <= 57) return true;
  const gap = gapBefore.trimEnd();
  return gap.length > 0 && gap[gap.length - 1] === '#';
}

function contextAllows(key: string, prev: string, next: string, gapBefore: string, original: string): boolean {
  switch (key) {
    case 'al':
    case 'cu':
      // "#10 Al", "Al branch wiring", "12 AWG Cu" — not "Al" as a name.
      return WIRE_CONTEXT.test(prev) || WIRE_CONTEXT.test(next) || SIZE.test(prev);
    case 'ga':
    case 'ga.':
    case 'gauge':
    case 'gage':
    case 'guage':
    case 'awg':
      return SIZE.test(prev) && /^[\s-]*$/.test(gapBefore);
    case 'sd':
    case 'sds':
    case 'jb':
    case 'jbs':
      // "JB", "JBs", "SDs": capitals, with a lower-case plural "s" at most.
      return original === original.toUpperCase() || /^[A-Z]+s$/.test(original);
    case 'det':
    case 'dets':
      return /^(?:smoke|co|sd)$/.test(prev);
    case 'sec':
    case 'ser':
      return original === original.toUpperCase() && original.length === 3;
    case 'nw':
      // "rcpt nw", "GFCI NW" — not "Bedroom (NW)" or "NW corner" (north-west).
      return original !== 'NW' || (/^(?:rcpt|rcpts|recpt|recep|receptacle|receptacles|outlet|outlets|gfci|gfi|afci|light|lights|lt|lts|fixture|fixt|sw|switch|fan|fans|alarm|smoke|sd|det|detector|bell|doorbell|device)$/.test(prev) && !/^\s*\(/.test(gapBefore));
    case 'sw':
      // "sw by slider", "lt sw inop" — not "SW" (south-west).
      return original !== 'SW' || /^(?:lt|light|wall|3-way|dimmer)$/.test(prev);
    case 'lt':
    case 'lts':
      return /^(?:sw|fixt|fixture|inop|nw|out|loose|missing|cover)/.test(next) || /^(?:closet|porch|ceiling|exterior|ext|can|vanity)$/.test(prev);
    case 'cb':
      return original === 'CB' || original === 'cb';
    case 'kt':
      return original === 'KT';
    case 'ba':
    case 'gar':
    case 'kit':
    case 'ext':
      return original.length <= 4 && /^[A-Z]/.test(original);
    case 'wx':
      return /^(?:cover|covers|cvr|cvrs|lid|lids|hood|hoods)$/.test(next);
    case 'wp':
    case 'wr':
      return /^(?:cover|covers|lid|lids|rcpt|receptacle|recep|outlet|device|in-use|bubble)/.test(next) || /^(?:not|non|no)$/.test(prev);
    case 'cond':
    case 'conds':
      return /^(?:\d|#|awg|al|cu|aluminum|copper|ground|neutral)/.test(prev);
    default:
      return true;
  }
}

/** Normalises one sentence (or any mapped text); unchanged text comes back with `changed` empty. */
export function normaliseText(m: MappedText): NormalisedText {
  const source = m.text;
  const tokens = readWords(source);
  let text = '';
  const offsets: number[] = [];
  const changed: Range[] = [];
  let copied = 0;
  for (let i = 0; i < tokens.count; i++) {
    const replacement = replacementFor(tokens, i, source);
    if (replacement === null) continue;
    const start = tokens.start[i];
    const end = tokens.end[i];
    // A trailing full stop of an abbreviation ("inop.", "recep.") stays in the text as written,
    // unless the sentence goes on in lower case ("ext. cord", "perm. wiring"): then it is the
    // abbreviation's own and goes with the word.
    const keepsStop = source[end - 1] === '.' && !replacement.endsWith('.') && !/^\s+[a-z]/.test(source.slice(end, end + 2));
    const wordEnd = keepsStop ? end - 1 : end;
    text += source.slice(copied, start);
    for (let k = copied; k < start; k++) offsets.push(m.offsets[k]);
    changed.push({ start: text.length, end: text.length + replacement.length });
    text += replacement;
    // The first character stands for the word's start and the last for its end, so a sentence
    // that starts or ends with a normalised word still maps to the whole word as written.
    for (let k = 0; k < replacement.length; k++) offsets.push(k > 0 && k === replacement.length - 1 ? m.offsets[wordEnd - 1] : m.offsets[start]);
    copied = wordEnd;
  }
  if (changed.length === 0) return { text: m.text, offsets: m.offsets, changed };
  text += source.slice(copied);
  for (let k = copied; k < source.length; k++) offsets.push(m.offsets[k]);
  return { text, offsets, changed };
}
