import { clauseIndexAt, clauseRanges, type Range } from './clause-splitter';
import type { CodeMatch } from './code-matcher';
import { CODE_RULES, type CodeRule } from './code-patterns';
import type { FindingCode } from './finding-code';
import { readWords, type Vocabulary, type WordTokens } from './word-tokens';

/**
 * Device and condition composition: a finding read from a device word and a condition word in one
 * clause ("the outlet behind the couch is scorched", "loose dimmer", "porch light hanging"), for the
 * wordings the phrase table does not have. The phrase table stays the first reader: a composed
 * finding is added only where no phrase of the sentence covers the same words, and never beside a
 * phrase finding of the same code in the same sentence (nor, in the report, after a finding of its
 * code or beside one of its code and room: see parseReport). Composed matches then go through the same
 * negation, places, counts and merging as phrase matches (they join `readBlock`'s matches), and
 * their findings carry the confidence `composed` so the review screen marks them.
 *
 * The vocabularies are the trade's words for each code (docs/parser.md, "Device and condition
 * composition"): the devices an inspector names and the conditions that make each one a defect.
 * A condition belongs to the nearest device word around it (a device word of another trade, a
 * window or a pipe, takes it away from ours), within a small window: up to DEVICE_BEFORE words
 * between a device and a condition after it ("the receptacle left of the sink is loose"), up to
 * DEVICE_AFTER between a condition and a device after it ("cracked wall receptacle").
 */

/** Most words between a device and the condition said of it after it. */
const DEVICE_BEFORE = 8;
/** Most words between a condition and the device it describes after it. */
const DEVICE_AFTER = 3;

/**
 * A device or a condition: its words (lower case, space-separated; articles and possessives may
 * stand between them), the codes it can give, and words that make it something else when they
 * stand right before (`notAfter`) or right after (`notBefore`) it.
 */
interface Term {
  readonly words: string;
  readonly notAfter?: readonly string[];
  readonly notBefore?: readonly string[];
  /** A condition that only stands right before its device ("no smoke alarm", never "smoke alarm ... no"). */
  readonly onlyRightBefore?: boolean;
}

interface CodeVocabulary {
  readonly code: FindingCode;
  readonly devices: ReadonlyArray<string | Term>;
  readonly conditions: ReadonlyArray<string | Term>;
}

// Shared word lists (the trade's words; common practice unless a code section is named).
const RECEPTACLES = ['receptacle', 'receptacles', 'outlet', 'outlets', 'duplex', 'duplexes', 'convenience outlet', 'wall outlet', 'wall receptacle', 'plug-in', 'plug in'];
const SWITCHES = ['switch', 'switches', 'light switch', 'light switches', 'wall switch', 'wall switches', 'dimmer', 'dimmers', 'dimmer switch', 'toggle', 'toggles', 'rocker switch', '3 way switch', 'three-way switch', 'three way switch', '3 way', 'three-way', 'three way', '4 way', 'four-way', 'four way'];
/** A switch that is no wiring device of a room: a transfer, pressure or disconnect switch, whose defects are other codes or not electrical line items. */
const NOT_WALL_SWITCH = ['transfer', 'pressure', 'float', 'limit', 'safety', 'main', 'service', 'disconnect', 'isolation', 'kill', 'emergency', 'tamper', 'door', 'reed', 'flow', 'sail', 'thermal', 'timer'];
/** Appliances and gas equipment that have a light of their own (common practice: that light is no light fixture). */
const APPLIANCE_WORDS = ['hood', 'range', 'oven', 'microwave', 'refrigerator', 'fridge', 'freezer', 'opener', 'appliance', 'pilot', 'indicator', 'warning', 'status', 'night', 'check', 'engine', 'exhaust', 'vent'];
/** "light rust", "light-duty": "light" as an adjective is no light. */
const LIGHT_AS_ADJECTIVE = ['rust', 'rusting', 'rusted', 'corrosion', 'corroded', 'stain', 'stains', 'staining', 'stained', 'duty', 'weight', 'wear', 'scratches', 'surface', 'gray', 'grey', 'brown', 'tan', 'color', 'colored', 'damage', 'use', 'traffic', 'switch', 'switches', 'fixture', 'bulb', 'bulbs'];
const LIGHTS = [
  'light', 'lights', 'light fixture', 'light fixtures', 'fixture', 'fixtures', 'luminaire', 'luminaires', 'chandelier', 'chandeliers',
  'pendant', 'pendants', 'sconce', 'sconces', 'lantern', 'lanterns', 'can light', 'can lights', 'recessed light', 'recessed lights', 'pot light', 'pot lights',
  'floodlight', 'floodlights', 'flood light', 'flood lights', 'spotlight', 'spotlights', 'lampholder', 'lampholders', 'lamp holder', 'lamp holders',
  'light strip', 'track light', 'track lighting', 'under-cabinet light', 'motion light', 'security light', 'coach light', 'ceiling light', 'wall light', 'porch light', 'porch lights',
];
const WIRES = ['cable', 'cables', 'wire', 'wires', 'wiring', 'nm', 'nm cable', 'nm-b', 'romex', 'sheathed cable', 'branch wiring'];
const CORDS = ['extension cord', 'extension cords', 'zip cord', 'zip cords', 'lamp cord', 'lamp cords', 'cord', 'cords', 'power strip', 'power strips'];
/** Wires whose defects are other codes (service, grounding, legacy wiring) or not line-voltage wiring at all. */
const NOT_BRANCH_WIRE = [
  'ground', 'grounding', 'bonding', 'bond', 'service', 'entrance', 'drop', 'aluminum', 'aluminium', 'knob', 'tube', 'k&t', 'doorbell', 'thermostat', 'phone',
  'telephone', 'knob-and-tube', 'knob-tube', 'coax', 'coaxial', 'tv', 'speaker', 'data', 'alarm', 'antenna', 'low-voltage', 'voltage', 'network', 'ethernet', 'cat5', 'cat6', 'satellite', 'fence', 'sprinkler',
  'irrigation', 'control', 'signal', 'communication', 'internet', 'cable tv', 'landscape', 'lighting', 'appliance', 'dryer', 'range', 'power', 'vacuum', 'charger',
];
const BOXES = ['junction box', 'junction boxes', 'j-box', 'j-boxes', 'jbox', 'jboxes', 'box', 'boxes', 'splice box', 'pull box', 'electrical box', 'ceiling box'];
const SPLICES = ['splice', 'splices', 'wire nut', 'wire nuts', 'wire splice', 'wire splices', 'spliced wires', 'spliced conductors'];
const NOT_JUNCTION_BOX = ['fan-rated', 'breaker', 'fuse', 'meter', 'mail', 'window', 'fan', 'switch', 'outlet', 'receptacle', 'device', 'electrical panel', 'panel', 'service', 'control', 'shower', 'valve', 'sprinkler', 'irrigation', 'cable', 'tv', 'phone', 'telephone', 'junction'];
const PANELS = [
  'panel', 'panels', 'panelboard', 'electrical panel', 'main panel', 'service panel', 'breaker panel', 'sub panel', 'subpanel', 'sub-panel', 'distribution panel',
  'load center', 'breaker box', 'fuse box', 'fuse panel', 'dead front', 'deadfront', 'dead-front', 'panel cover', 'inner cover', 'panel enclosure',
  // Parts inside the panel whose rust or water damage is the panel's defect (common practice).
  'neutral bar', 'neutral bars', 'ground bar', 'ground bars', 'bus bar', 'bus bars', 'busbar', 'bus',
];
const NOT_ELECTRICAL_PANEL = ['solar', 'access', 'door', 'control', 'wood', 'wall', 'alarm', 'security', 'fire', 'siding', 'fence', 'ceiling', 'radiant', 'glass', 'side', 'roof', 'hvac', 'furnace', 'thermostat', 'spa', 'pool', 'generator', 'sliding', 'raised', 'insulated', 'fiberglass', 'vinyl', 'metal', 'acoustic', 'mirror', 'window'];
const ALARMS = [
  'smoke alarm', 'smoke alarms', 'smoke detector', 'smoke detectors', 'co alarm', 'co alarms', 'co detector', 'co detectors', 'carbon monoxide alarm',
  'carbon monoxide alarms', 'carbon monoxide detector', 'carbon monoxide detectors', 'smoke/co alarm', 'smoke/co detector', 'combination alarm', 'smokes', 'smoke det', 'smoke dets', 'co det', 'co dets',
  { words: 'alarm', notAfter: ['security', 'burglar', 'intrusion', 'car', 'pool', 'gate', 'door', 'sump', 'high', 'water', 'leak', 'septic', 'float', 'radon', 'freeze', 'temperature', 'pump', 'alarm'] },
  { words: 'detector', notAfter: ['motion', 'leak', 'water', 'flood', 'radon', 'gas', 'metal', 'stud', 'voltage', 'tick'] },
];

/** The devices a cover plate closes over. */
const DEVICES_WITH_PLATES = [...RECEPTACLES, ...SWITCHES];
/** An absence word that only reads as a defect right before the device it denies ("no smoke alarm", "without cover"). */
const NO: Term = { words: 'no', onlyRightBefore: true };
const WITHOUT: Term = { words: 'without', onlyRightBefore: true };

/**
 * The vocabularies, one row per code where a device and a condition read naturally (docs/parser.md);
 * a code may have two rows when some of its devices take only some of its conditions (a receptacle
 * takes "cover missing" as a cover-plate defect, not a bare "missing").
 */
const VOCABULARY: readonly CodeVocabulary[] = [
  {
    code: 'gfci-inoperative',
    devices: ['gfci', 'gfcis', 'gfi', 'gfis', 'gfci receptacle', 'gfci outlet', 'gfci breaker', 'ground fault', 'ground-fault', 'ground fault receptacle', 'ground fault outlet'],
    // NFPA 70 (NEC) 2023, 406.4(D)(3) and the listing's monthly test: a GFCI that does not trip or reset has failed.
    conditions: [
      'did not trip', 'does not trip', "didn't trip", "doesn't trip", 'would not trip', "wouldn't trip", 'will not trip', "won't trip", 'failed to trip', 'fails to trip', 'failed', 'fails',
      'did not reset', 'does not reset', "didn't reset", "doesn't reset", 'would not reset', "wouldn't reset", 'will not reset', "won't reset", 'failed to reset', 'fails to reset', 'not resetting',
      'not tripping', 'refused to trip', 'refuses to trip', 'refused to reset', 'refuses to reset', 'inoperative', 'inoperable', 'defective', 'faulty', 'not working', 'not functioning', 'non-functional', 'nonfunctional', 'worn out', 'failed test', 'failed the test',
      'did not respond', 'does not respond', 'no response', 'unresponsive', 'stuck', 'test button stuck',
    ],
  },
  {
    code: 'reversed-polarity',
    devices: RECEPTACLES,
    // NFPA 70 (NEC) 2023, 200.11: the grounded conductor goes to the identified (silver) terminal.
    conditions: ['reversed', 'reverse polarity', 'reversed polarity', 'polarity reversed', 'polarity is reversed', 'wired backwards', 'wired backward', 'wired in reverse', 'hot and neutral reversed', 'hot/neutral reversed', 'hot neutral reversed', 'rp'],
  },
  {
    code: 'open-ground',
    devices: RECEPTACLES,
    // NFPA 70 (NEC) 2023, 406.4(D)(2): a grounding-type receptacle needs an equipment ground.
    conditions: ['ungrounded', 'not grounded', 'no ground', 'open ground', 'open grounds', 'no equipment ground', 'lacks ground', 'lacks a ground', 'missing ground', 'without ground', 'without a ground', 'ground missing', 'ground open', 'no grounding', 'no egc', 'open gnd', 'no gnd', 'og'],
  },
  {
    code: 'false-ground',
    devices: RECEPTACLES,
    // NFPA 70 (NEC) 2023, 250.142(B): a neutral jumpered to the grounding terminal.
    conditions: ['bootleg', 'bootlegged', 'bootleg ground', 'false ground', 'false grounded', 'jumpered', 'jumper to ground', 'jumper to the ground'],
  },
  {
    code: 'receptacle-damaged',
    devices: RECEPTACLES,
    conditions: [
      'loose', 'loosely', 'wobbly', 'wobbles', 'wiggles', 'wiggling', 'cracked', 'broken', 'damaged', 'chipped', 'burnt', 'burned', 'burn marks', 'burn mark', 'scorched', 'scorch marks',
      'scorching', 'charred', 'melted', 'melting', 'blackened', 'discolored', 'discoloured', 'discoloration', 'discolouration', 'smoking', 'smoke marks', 'arc marks', 'arcing', 'sparks', 'sparking', 'buzzing', 'buzzes', 'humming',
      'warm', 'warm to the touch', { words: 'hot', notBefore: ['and', '&', '/', 'wire', 'wires', 'conductor', 'conductors', 'leg', 'legs', 'side', 'terminal', 'terminals', 'neutral', 'tub', 'tubs', 'water', 'slot'] }, 'hot to the touch', 'overheating', 'overheated',
      'dead', 'no power', 'without power', 'not energized', 'de-energized', 'not powered', 'inoperative', 'inoperable', 'not working', 'not functioning', 'non-functional', 'nonfunctional', 'defective', 'faulty', 'intermittent', 'intermittently',
      "won't hold", 'will not hold', 'does not hold', "doesn't hold", 'did not hold', "didn't hold", 'would not hold', 'no tension', 'weak tension', 'poor tension', 'worn', 'worn out',
      'painted', 'painted over', 'paint-covered', 'pulled out', 'pulling out', 'pulled away', 'pulling away', 'hanging', 'dangling', 'recessed', 'sunken', 'set back', 'pushed in', 'not secured', 'unsecured', 'not fastened',
    ],
  },
  {
    code: 'weather-cover-missing',
    devices: ['in-use cover', 'in-use covers', 'in use cover', 'bubble cover', 'bubble covers', 'weather cover', 'weather covers', 'weatherproof cover', 'weatherproof covers', 'weather-proof cover', 'wp cover', 'wr cover', 'weather-resistant cover', 'while-in-use cover', 'flip cover', 'flip lid'],
    // NFPA 70 (NEC) 2023, 406.9(B)(1): a wet location needs a cover weatherproof with a plug in.
    conditions: ['missing', 'absent', 'gone', 'broken', 'cracked', 'damaged', 'not installed', 'removed', 'broken off', NO, 'lacks', 'lacking', WITHOUT, 'does not close', 'will not close', "won't close", 'not closing'],
  },
  {
    code: 'cover-plate-missing',
    devices: ['cover plate', 'cover plates', 'coverplate', 'coverplates', 'faceplate', 'faceplates', 'face plate', 'face plates', 'wall plate', 'wall plates', 'wallplate', 'switch plate', 'switch plates', 'outlet cover', 'outlet covers', 'receptacle cover', 'receptacle covers', 'switch cover', 'switch covers', 'plate', 'plates', 'trim plate'],
    // NFPA 70 (NEC) 2023, 406.6 and 404.9(B): receptacles and switches have their faceplates.
    // A cover "removed" or "off" is most often the inspector's own doing, to look inside (common practice): not a condition.
    conditions: ['missing', 'absent', 'gone', 'broken', 'cracked', 'damaged', 'not installed', 'never installed', NO, WITHOUT],
  },
  {
    code: 'cover-plate-missing',
    devices: DEVICES_WITH_PLATES,
    conditions: ['missing cover', 'missing cover plate', 'missing plate', 'no cover', 'no cover plate', 'no plate', 'no faceplate', 'cover missing', 'plate missing', 'without cover', 'without cover plate', 'without plate', 'lacks cover', 'lacks plate', 'uncovered', 'cover broken', 'cover cracked', 'plate cracked', 'plate broken', 'cover plate missing', 'cover plate broken', 'cover plate cracked'],
  },
  {
    code: 'open-junction-box',
    devices: BOXES.map((words) => ({ words, notAfter: NOT_JUNCTION_BOX })),
    // NFPA 70 (NEC) 2023, 314.28(C): a cover on every box; 314.29: boxes stay accessible.
    conditions: [
      'open', 'uncovered', 'no cover', 'missing cover', 'cover missing', 'without cover', 'without blank cover', 'no blank cover', 'missing blank cover', 'blank cover missing',
      'no lid', 'lid missing', 'missing lid', 'cover off', 'lid off', 'not covered', 'lacks cover', 'needs cover', 'needs blank cover',
      'loose connector', 'missing connector', 'no connector', 'no cable connector', 'missing cable connector', 'no clamp', 'missing clamp', 'no cable clamp', 'missing cable clamp', 'buried in the wall', 'buried in wall', 'covered over', 'drywalled over',
    ],
  },
  {
    code: 'exposed-wiring',
    devices: WIRES.map((words) => ({ words, notAfter: NOT_BRANCH_WIRE, notBefore: ['nut', 'nuts', 'gauge', 'size', 'tie', 'ties', 'mesh', 'connector', 'connectors', 'clamp', 'clamps', 'staples'] })),
    // NFPA 70 (NEC) 2023, 334.15(B) and 334.30 (NM cable protected and secured), 400.12 (cords are no substitute for fixed wiring).
    conditions: [
      'exposed', 'unprotected', 'unsecured', 'unsupported', 'unstapled', 'not secured', 'not supported', 'not stapled', 'not strapped', 'not fastened', 'not protected', 'improperly secured', 'improperly supported',
      'loose', 'dangling', 'hanging', 'draped', 'lying on', 'laying on', 'lies on', 'on the floor', 'on the ground', 'subject to damage', 'subject to physical damage', 'exposed to damage', 'within reach',
      'frayed', 'chewed', 'nicked', 'damaged', 'sheathing damaged', 'damaged sheathing', 'stripped',
    ],
  },
  {
    code: 'exposed-wiring',
    devices: CORDS,
    // NFPA 70 (NEC) 2023, 400.12: a flexible cord is no substitute for the fixed wiring of a structure, nor run through walls or fastened to surfaces.
    conditions: [
      'run across', 'running across', 'strung', 'stapled', 'nailed', 'tacked', 'taped', 'run through', 'runs through', 'through the wall', 'through a wall', 'through the ceiling', 'through the floor', 'under the rug', 'under a rug', 'under the carpet',
      'used as permanent wiring', 'as permanent wiring', 'in place of permanent wiring', 'instead of permanent wiring', 'used as fixed wiring', 'permanent wiring', 'permanently installed', 'daisy chained', 'daisy-chained', 'spliced', 'frayed', 'damaged',
    ],
  },
  {
    code: 'double-tap',
    devices: ['breaker', 'breakers', 'circuit breaker', 'circuit breakers', 'lug', 'lugs', 'terminal', 'terminals', 'breaker terminal', 'fuse', 'fuses'],
    // NFPA 70 (NEC) 2023, 110.14(A) and 408.41: one conductor per terminal unless the terminal is listed for more.
    conditions: ['double tapped', 'double-tapped', 'double tap', 'double-tap', 'double lugged', 'double-lugged', 'doubled up', 'two wires', 'two conductors', '2 wires', '2 conductors', 'two circuits', 'multiple wires', 'multiple conductors', 'three wires', 'three conductors', 'more than one conductor', 'more than one wire'],
  },
  {
    code: 'panel-deficiency',
    devices: PANELS.map((words) => ({ words, notAfter: NOT_ELECTRICAL_PANEL })),
    // NFPA 70 (NEC) 2023, 110.12(A) (openings closed), 408.4(A) (circuit directory), 110.26 (working space), 408.7 (unused openings).
    conditions: [
      'rust', 'rusted', 'rusty', 'rusting', 'corroded', 'corrosion', 'water stains', 'water staining', 'moisture', 'water damage', 'missing screws', 'screws missing', 'missing screw', 'screw missing',
      'pointed screws', 'sharp screws', 'sheet metal screws', 'drywall screws', 'wrong screws', 'improper screws', 'open knockout', 'open knockouts', 'knockouts open', 'missing knockout', 'missing knockouts',
      'open slot', 'open slots', 'open space', 'open spaces', 'missing filler', 'missing fillers', 'missing blank', 'missing blanks', 'no filler', 'no fillers', 'no blanks', 'missing twistouts', 'missing twist-outs',
      'unlabeled', 'unlabelled', 'not labeled', 'not labelled', 'no directory', 'directory missing', 'no labels', 'labels missing', 'no legend', 'incomplete directory', 'directory incomplete', 'blank directory', 'directory blank',
      'blocked', 'obstructed', 'no clearance', 'inadequate clearance', 'insufficient clearance', 'insufficient working space', 'dented', 'damaged', 'missing cover', 'no cover', 'cover missing', 'missing dead front', 'no dead front',
      'under water', 'underwater', 'submerged', 'flooded', 'silt', 'water entry', 'water intrusion',
    ],
  },
  {
    code: 'grounding-electrode',
    devices: [
      'ground rod', 'ground rods', 'grounding rod', 'grounding rods', 'grounding electrode', 'grounding electrodes', 'grounding electrode conductor', 'gec', 'ground wire', 'grounding wire',
      'grounding conductor', 'ground clamp', 'grounding clamp', 'ground rod clamp', 'rod clamp', 'gec clamp', 'water pipe clamp', 'acorn clamp', 'water pipe bond', 'water bond', 'bonding jumper', 'bonding clamp', 'bond wire', 'bonding wire', 'gas bond', 'gas line bond', 'gas pipe bond', 'jumper',
    ],
    // NFPA 70 (NEC) 2023, 250.50 and 250.68 (electrode and its connection), 250.104 (piping bonded).
    conditions: ['loose', 'disconnected', 'not connected', 'not attached', 'detached', 'cut', 'severed', 'broken', 'corroded', 'damaged', 'missing', 'absent', 'not bonded', 'unbonded', 'no clamp', 'clamp missing', 'missing clamp', 'loose clamp', 'clamp loose', 'hanging', 'dangling', 'not secured', 'unattached', 'removed'],
  },
  {
    code: 'smoke-co-alarm',
    devices: ALARMS,
    // Common practice (NFPA 72 from memory): alarms are replaced ten years from manufacture and must sound on test.
    conditions: [
      'missing', 'absent', 'not installed', NO, 'lacking', 'lacks', 'chirping', 'chirps', 'chirped', 'beeping', 'beeps', 'expired', 'outdated', 'out of date', 'end of life', 'end-of-life', 'past its life', 'past their life',
      'inoperative', 'inoperable', 'not working', 'not functioning', 'non-functional', 'nonfunctional', 'did not sound', 'does not sound', "didn't sound", 'failed to sound', 'did not respond', 'does not respond', 'no response', 'unresponsive', 'silent',
      'hanging by its wires', 'hanging from its wires', 'hanging by wires', 'hangs by its wires', 'dangling by its wires',
      'dead', 'no battery', 'battery missing', 'missing battery', 'batteries missing', 'battery removed', 'batteries removed', 'disconnected', 'removed', 'hanging', 'dangling', 'painted', 'painted over', 'covered', 'bagged', 'failed',
    ],
  },
  {
    code: 'light-fixture',
    devices: LIGHTS.map((words) => ({ words, notAfter: APPLIANCE_WORDS, notBefore: LIGHT_AS_ADJECTIVE })),
    // NFPA 70 (NEC) 2023, 410.36 (supported), 410.116 (clearance from insulation); inoperative lights and missing globes are common practice.
    conditions: [
      'loose', 'hanging', 'dangling', 'dangles', 'hangs', 'hanging by its wires', 'hanging from its wires', 'hanging by wires', 'hangs by its wires', 'dangling by its wires', 'pulled away', 'pulling away', 'pulled loose', 'detached', 'falling', 'falling down', 'not secured', 'unsecured', 'not attached', 'not mounted', 'unsupported',
      'inoperative', 'inoperable', 'not working', 'not functioning', 'non-functional', 'nonfunctional', 'not operating', 'does not work', 'did not work', "doesn't work", "didn't work", 'does not operate', 'did not operate', 'does not light', 'did not light', "won't light", 'would not light', 'does not come on', 'did not come on', "doesn't come on", "didn't come on", 'did not turn on', 'does not turn on', 'dead', 'defective', 'faulty',
      // Not "flickers": a light that flickers is most often its switch's or a connection's symptom (common practice).
      'buzzing', 'buzzes', 'broken', 'cracked', 'damaged', 'scorched', 'melted', 'discolored', 'burnt', 'burned', 'rusted', 'rusty', 'corroded', 'water in', 'water inside', 'moisture in',
      'missing globe', 'no globe', 'globe missing', 'without globe', 'missing lens', 'no lens', 'lens missing', 'missing shade', 'no shade', 'missing diffuser', 'no diffuser', 'missing cover', 'no cover', 'cover missing', 'no canopy', 'canopy missing', 'missing canopy', 'canopy loose', 'canopy not secured',
      'exposed bulb', 'exposed bulbs', 'bare bulb', 'bare bulbs', 'open bulb', 'exposed lamp', 'exposed wires', 'wires exposed',
      'in contact with insulation', 'touching insulation', 'covered with insulation', 'covered by insulation', 'buried in insulation', 'under insulation', 'insulation against', 'insulation on top',
    ],
  },
  {
    code: 'fan-support',
    devices: [
      { words: 'fan', notAfter: ['exhaust', 'bath', 'bathroom', 'vent', 'ventilation', 'attic', 'range', 'hood', 'furnace', 'inducer', 'condenser', 'house', 'gable', 'inline', 'blower', 'kitchen', 'dryer', 'whole', 'window', 'box', 'radiator', 'cooling', 'circulation', 'heater', 'laundry', 'roof'] },
      { words: 'fans', notAfter: ['exhaust', 'bath', 'bathroom', 'vent', 'attic', 'range', 'gable', 'inline', 'roof'] },
      'ceiling fan', 'ceiling fans', 'paddle fan', 'paddle fans', 'fan/light', 'fan light', 'fan/light combination',
    ],
    // NFPA 70 (NEC) 2023, 314.27(C) and 422.18: a ceiling fan hangs from a box or system listed for it.
    conditions: ['wobbles', 'wobbling', 'wobbly', 'wobble', 'shakes', 'shaking', 'shaky', 'sways', 'swaying', 'rocks', 'rocking', 'unstable', 'loose', 'not secured', 'not supported', 'improperly mounted', 'improperly supported', 'not fan rated', 'not fan-rated', 'non-fan-rated', 'not rated for a fan', 'no fan brace', 'no brace', 'no fan-rated box', 'no fan rated box'],
  },
  {
    code: 'switch-issue',
    devices: SWITCHES.map((words) => ({ words, notAfter: NOT_WALL_SWITCH })),
    // NFPA 70 (NEC) 2023, 404.9 (faceplates), 404.10 (mounting); a warm, buzzing or dead switch is common practice.
    conditions: [
      'warm', 'warm to the touch', 'hot', 'hot to the touch', 'buzzing', 'buzzes', 'buzz', 'humming', 'hums', 'crackling', 'crackles', 'sparks', 'sparking', 'sparked', 'arcing', 'arcs',
      'inoperative', 'inoperable', 'not working', 'not functioning', 'non-functional', 'nonfunctional', 'does not work', 'did not work', "doesn't work", "didn't work", 'does nothing', 'did nothing', 'defective', 'faulty', 'intermittent', 'intermittently',
      'flickers', 'flickering', 'loose', 'wiggles', 'wiggling', 'broken', 'cracked', 'damaged', 'scorched', 'melted', 'discolored', 'burnt', 'burned', 'stuck', 'sticks', 'sticking', 'jammed', 'sloppy',
      'unknown function', 'no known function', 'unknown purpose', 'no apparent function', 'function unknown', 'purpose unknown', 'undetermined function', 'unknown use',
    ],
  },
  {
    code: 'service-equipment',
    devices: [
      'service mast', 'mast', 'riser', 'service riser', 'weatherhead', 'weather head', 'service head', 'drip loop', 'drip loops', 'service drop', 'service wires', 'service conductors', 'service entrance cable',
      'service entrance conductors', 'service-entrance cable', 'se cable', 'seu cable', 'service cable', 'meter base', 'meter socket', 'meter box', 'meter can', 'meter enclosure', 'meter', 'electric meter', 'overhead wires', 'overhead conductors',
      'utility wires', 'utility drop', 'service lateral', 'service pedestal', 'meter pedestal', 'mast head', 'masthead', 'mast strap', 'mast straps',
    ],
    // NFPA 70 (NEC) 2023, 230.24 (clearances), 230.28 (mast supports), 230.54 (drip loops and service heads).
    conditions: [
      'leaning', 'leans', 'bent', 'bowed', 'loose', 'damaged', 'frayed', 'deteriorated', 'deteriorating', 'worn', 'weathered', 'cracked', 'split', 'torn', 'brittle', 'corroded', 'rusted', 'rusty',
      'pulled away', 'pulling away', 'separated', 'separating', 'detached', 'not secured', 'unsecured', 'not strapped', 'unstrapped', 'unsupported', 'missing strap', 'missing straps', 'straps missing', 'no straps',
      'too low', 'low clearance', 'insufficient clearance', 'inadequate clearance', 'not enough clearance', 'in contact with', 'rubbing', 'touching', 'resting on', 'rests on', 'resting against', 'lying on', 'growing through', 'grown through', 'in the tree', 'through the tree', 'through tree', 'tree limbs', 'branches', 'overgrown', 'vegetation',
      'sagging', 'sags', 'sagged', 'no drip loop', 'missing drip loop', 'not sealed', 'unsealed', 'missing sealant', 'no sealant', 'gap', 'gaps', 'exposed conductors', 'missing insulation', 'jacket damaged', 'damaged jacket', 'sheathing damaged', 'pulled out',
    ],
  },
];

/** Non-electrical things that take the same condition words: a condition nearest to one of them is about it. */
const OTHER_THINGS = [
  'window', 'windows', 'door', 'doors', 'glass', 'pane', 'sink', 'faucet', 'toilet', 'tub', 'shower', 'pipe', 'pipes', 'piping', 'drain', 'duct', 'ducts', 'ductwork', 'vent', 'vents',
  'roof', 'shingle', 'shingles', 'gutter', 'gutters', 'downspout', 'siding', 'railing', 'rail', 'handrail', 'step', 'steps', 'stair', 'stairs', 'deck', 'floor', 'flooring', 'tile', 'tiles',
  'counter', 'countertop', 'drywall', 'wall', 'walls', 'ceiling', 'trim', 'paint', 'heater', 'furnace', 'boiler', 'water heater', 'dishwasher', 'disposal', 'disposer', 'refrigerator', 'fridge',
  'range', 'oven', 'stove', 'cooktop', 'microwave', 'hood', 'dryer', 'washer', 'opener', 'thermostat', 'doorbell', 'fence', 'gate', 'hose', 'bib', 'spigot', 'tank', 'pump', 'compressor',
  'condenser', 'motor', 'battery', 'batteries', 'bulb', 'bulbs', 'lamp', 'lamps', 'insulation', 'tree', 'trees', 'limb', 'limbs', 'chimney', 'foundation', 'slab', 'soffit', 'fascia',
  // The face of a box or device is a part of it: what is said of the face is not said of a box ("the box face is open").
  'face', 'faces', 'cabinet', 'cabinets', 'mirror', 'fan blade', 'blade', 'blades', 'screen', 'screens', 'hinge', 'knob', 'handle', 'latch', 'lock', 'valve', 'filter', 'flue', 'joist', 'joists', 'rafter', 'rafters',
  'stud', 'studs', 'beam', 'post', 'brick', 'mortar', 'stucco', 'grout', 'caulk', 'caulking', 'seal', 'weatherstrip', 'carpet', 'rug', 'ground', 'grade', 'soil', 'yard', 'driveway', 'walkway', 'sidewalk', 'patio',
  'breaker', 'breakers', 'fuse', 'fuses', 'gfci', 'afci', 'conductor', 'conductors', 'neutral', 'neutrals', 'bus', 'bar', 'screw', 'screws', 'knockout', 'knockouts',
];

/** Words that, between a device and its condition, make the condition something else than the device's state. */
const BETWEEN_STOPS = new Set([
  'no', 'not', 'none', 'never', 'nothing', 'neither', 'nor', "isn't", "aren't", "wasn't", "weren't", "don't", "doesn't", "didn't", 'isnt', 'arent', 'wasnt', 'werent', 'dont', 'doesnt', 'didnt',
  'without', 'if', 'unless', 'whether', 'should', 'would', 'could', 'may', 'might', 'free', 'and/or', 'check', 'checked', 'inspect', 'inspected', 'testing', 'evaluate', 'evaluated', 'verify', 'verified', 'than', 'instead', 'replaced', 'repaired', 'corrected',
  // A new subject between them: the condition is said of something else ("while testing the receptacles we heard a buzzing").
  'we', 'i', 'you',
]);
/** Words that may stand between the words of one term ("missing its globe", "hanging by the wires"). */
const FILLERS = new Set(['a', 'an', 'the', 'its', 'their', 'his', 'her', 'any', 'is', 'are', 'was', 'were', 'be', 'appear', 'appears', 'appeared', 'seem', 'seems', 'seemed', 'to']);

interface Entry {
  readonly words: readonly string[];
  /** The vocabulary rows the term belongs to (a device of no row is a thing of another trade). */
  readonly rows: readonly number[];
  readonly isCondition: boolean;
  readonly onlyRightBefore: boolean;
  readonly notAfter: ReadonlySet<string> | null;
  readonly notBefore: ReadonlySet<string> | null;
}

/** Every term by its first word, longest first. */
const BY_FIRST_WORD: ReadonlyMap<string, readonly Entry[]> = (() => {
  const merged = new Map<string, { words: string[]; rows: number[]; isCondition: boolean; onlyRightBefore: boolean; notAfter: Set<string> | null; notBefore: Set<string> | null }>();
  const add = (term: string | Term, row: number | null, isCondition: boolean) => {
    const t: Term = typeof term === 'string' ? { words: term } : term;
    // Inspectors drop the apostrophe ("doesnt work", "wont reset").
    if (t.words.includes("'")) add({ ...t, words: t.words.replace(/'/g, '') }, row, isCondition);
    const key = `${isCondition ? 'c' : 'd'}:${t.words}`;
    let entry = merged.get(key);
    if (!entry) {
      entry = { words: t.words.split(' '), rows: [], isCondition, onlyRightBefore: t.onlyRightBefore === true, notAfter: null, notBefore: null };
      merged.set(key, entry);
    }
    if (row !== null && !entry.rows.includes(row)) entry.rows.push(row);
    if (t.notAfter) entry.notAfter = new Set([...(entry.notAfter ?? []), ...t.notAfter]);
    if (t.notBefore) entry.notBefore = new Set([...(entry.notBefore ?? []), ...t.notBefore]);
  };
  VOCABULARY.forEach((row, r) => {
    for (const d of row.devices) add(d, r, false);
    for (const c of row.conditions) add(c, r, true);
  });
  for (const thing of OTHER_THINGS) add(thing, null, false);
  const byFirst = new Map<string, Entry[]>();
  for (const e of merged.values()) byFirst.set(e.words[0], [...(byFirst.get(e.words[0]) ?? []), e]);
  for (const list of byFirst.values()) list.sort((a, b) => b.words.length - a.words.length || Number(b.isCondition) - Number(a.isCondition));
  return byFirst;
})();

const RULE_BY_CODE = new Map(CODE_RULES.map((r) => [r.code, r]));

/** A word's lower-case form without an abbreviation's full stop. */
function bareWord(vocabulary: Vocabulary, id: number): string {
  const word = vocabulary.words[id];
  return word.endsWith('.') ? word.slice(0, -1) : word;
}

const TERMS_KEY = Symbol('device-condition terms');

/** The terms that can start at a word (by vocabulary id, looked up once per word). */
function termsAt(tokens: WordTokens, k: number): readonly Entry[] | null {
  const table = tokens.vocabulary.table<readonly Entry[] | null>(TERMS_KEY);
  const id = tokens.id[k];
  let terms = table[id];
  if (terms === undefined) {
    terms = BY_FIRST_WORD.get(bareWord(tokens.vocabulary, id)) ?? null;
    table[id] = terms;
  }
  return terms;
}

/** One device or condition found in a sentence: its words k..last (token indices) and its text span. */
interface Found {
  readonly entry: Entry;
  readonly first: number;
  readonly last: number;
  readonly start: number;
  readonly end: number;
}

/** The word index after term `entry` matched at k (fillers allowed between its words), or -1. */
function matchTerm(tokens: WordTokens, k: number, entry: Entry): number {
  let at = k + 1;
  for (let w = 1; w < entry.words.length; w++) {
    const isFiller = FILLERS.has(entry.words[w]);
    while (at < tokens.count && !isFiller && FILLERS.has(bareWord(tokens.vocabulary, tokens.id[at]))) at++;
    if (at < tokens.count && bareWord(tokens.vocabulary, tokens.id[at]) === entry.words[w]) at++;
    // An article of the term may be left out ("hot to touch").
    else if (!isFiller || w === entry.words.length - 1) return -1;
  }
  return at;
}

/** The devices and conditions of a sentence in reading order, each word in at most one (longest first). */
function findTerms(text: string, tokens: WordTokens): Found[] {
  const found: Found[] = [];
  for (let k = 0; k < tokens.count; k++) {
    const terms = termsAt(tokens, k);
    if (terms === null) continue;
    for (const entry of terms) {
      const next = matchTerm(tokens, k, entry);
      if (next < 0) continue;
      const before = k > 0 ? bareWord(tokens.vocabulary, tokens.id[k - 1]) : '';
      const after = next < tokens.count ? bareWord(tokens.vocabulary, tokens.id[next]) : '';
      if ((entry.notAfter && entry.notAfter.has(before)) || (entry.notBefore && entry.notBefore.has(after))) {
        // A device of another trade ("exhaust fan", "hot water"): it still takes the conditions near it.
        if (!entry.isCondition) found.push({ entry: OTHER, first: k, last: next - 1, start: tokens.start[k], end: tokens.end[next - 1] });
        k = next - 1;
        break;
      }
      found.push({ entry, first: k, last: next - 1, start: tokens.start[k], end: endOfWord(text, tokens.end[next - 1]) });
      k = next - 1;
      break;
    }
  }
  return found;
}
const OTHER: Entry = { words: [], rows: [], isCondition: false, onlyRightBefore: false, notAfter: null, notBefore: null };

/** A word's end without an abbreviation's full stop (a phrase ends before the sentence's stop). */
function endOfWord(text: string, end: number): number {
  return text.charCodeAt(end - 1) === 46 ? end - 1 : end;
}

/** Whether a stop word stands between word indices a and b (exclusive). */
function stopBetween(tokens: WordTokens, a: number, b: number): boolean {
  for (let k = a + 1; k < b; k++) if (BETWEEN_STOPS.has(bareWord(tokens.vocabulary, tokens.id[k]))) return true;
  return false;
}

/** A composed match: a CodeMatch read from a device and a condition. */
const COMPOSED = new WeakSet<CodeMatch>();

/** Whether a match was composed from a device and a condition (its findings carry the confidence `composed`). */
export function isComposed(match: CodeMatch): boolean {
  return COMPOSED.has(match);
}

/** The findings read from composed matches (whatever their confidence says: a composed finding may also have an inferred room). */
const COMPOSED_FINDINGS = new WeakSet<object>();

/** Marks a finding as read from a composed match. */
export function markComposedFinding(finding: object): void {
  COMPOSED_FINDINGS.add(finding);
}

/**
 * Whether a finding was read from a composed match. The report keeps such a finding only where no
 * finding of its code came before it: a defect the phrase table read once and the report tells again
 * in other words (a summary line, a quoted report, a re-inspection) is the same defect.
 */
export function isComposedFinding(finding: object): boolean {
  return COMPOSED_FINDINGS.has(finding);
}

/** Receptacles dead or without power in a sentence about a GFCI or "downstream": the GFCI's defect (common practice). */
const GFCI_CONTEXT = /\b(?:gfc?i|ground[- ]fault|downstream|reset|tripped)\b/i;
const NO_POWER_WORDS = new Set(['dead', 'no power', 'without power', 'not energized', 'de-energized', 'not powered']);
/** A wire near a box, splice, light or the service: its condition is that thing's defect. */
const WIRE_OF_OTHER = /\b(?:box(?:es)?|j-?box\w*|splices?|wire nuts?|fixtures?|luminaires?|chandeliers?|service|meter)\b/i;
/** A device's own box: its cover or opening is the device's defect, not an open junction box (common practice). */
const DEVICE_IN_CLAUSE = /\b(?:receptacles?|outlets?|switch(?:es)?|dimmers?|light|lights|fixtures?|luminaires?|fans?|canop(?:y|ies)|gfc?is?)\b/i;
/** A cover of a receptacle outdoors or in the weather is its weather cover (NFPA 70 (NEC) 2023, 406.9(B)(1)). */
const OUTDOOR_WORDS = /\b(?:weather\w*|in-use|bubble|outdoors?|outside|exterior|rain|wet)\b/i;
/** How far around a receptacle's missing cover an outdoor word is looked for (characters, within the clause): about one written statement. */
const OUTDOOR_REACH = 100;
/** A sentence that reports a defect as already put right: history, not a finding (common practice). */
const PUT_RIGHT = /\b(?:(?:has|have|had)\s+(?:since\s+)?been|was|were)\s+(?:corrected|repaired|fixed|replaced|resolved)\b/i;
/** Two-slot receptacles have no grounding terminal by design: no open ground (NFPA 70 (NEC) 2023, 406.4(D)(2)). */
const TWO_SLOT = /\b(?:two|2)[- ]?(?:slot|prong|wire)\b|\bnon-?grounding\b|\bpolarized\b/i;
/**
 * Words that put the device after them as a reference point or an object, not the subject a
 * condition after it is said of ("the junction box next to the fan has no cover", "the switch for
 * the hall light buzzes", "cable run to the shop lights, unsupported").
 */
const PLACE_WORDS = new Set([
  'at', 'near', 'by', 'beside', 'behind', 'under', 'underneath', 'over', 'above', 'below', 'beneath', 'next', 'adjacent', 'between', 'from', 'to', 'toward', 'towards',
  'on', 'off', 'into', 'feeding', 'feeds', 'serving', 'serves', 'for', 'controlling', 'controls', 'operating', 'operates', 'supplying', 'supplies', 'around', 'past', 'than', 'with', 'across', 'along', 'through', 'against', 'within', 'inside', 'outside', 'beyond',
]);
/** What may stand between a condition and the device after it ("scorch marks on the receptacle"): nothing else. */
const BEFORE_DEVICE_WORDS = new Set(['a', 'an', 'the', 'its', 'their', 'this', 'that', 'one', 'on', 'at', 'in', 'of', 'to', 'inside', 'around']);
/** A condition that is a predicate (a verb or "not ..."): said of the device before it, never of one after it ("does not operate the pendant"). */
const PREDICATE_START = new Set(['does', 'did', "doesn't", "didn't", 'doesnt', 'didnt', "won't", 'wont', 'will', 'would', "wouldn't", 'not', 'failed', 'fails', 'is', 'are', 'was', 'were', 'has', 'have', 'hangs', 'dangles']);
/** After "no <device>", words that make it a clean bill ("no smoke alarm issues"). */
const CLEAN_BILL = new Set(['issues', 'issue', 'problems', 'problem', 'concerns', 'concern', 'defects', 'defect', 'deficiencies', 'damage', 'noted', 'observed', 'found', 'seen']);
/** A clause that opens with a remedy: its composed finding is a recommendation, merged with the same defect told before it. */
const REMEDY_OPENING = /^\W*(?:please\s+)?(?:replace|repair|install|add|provide|secure|tighten|fasten|re-?secure|correct|fix|have|recommend\w*|suggest\w*|consider)\b/i;

/** Whether a device is a reference point or an object: a place word among the (up to) four words before it. */
function isReferenceDevice(text: string, tokens: WordTokens, device: Found): boolean {
  for (let k = device.first - 1; k >= Math.max(0, device.first - 4); k--) {
    // A label or a list ends the phrase ("Attic over the garage: octagon box").
    if (PHRASE_BREAK.test(text.slice(tokens.end[k], tokens.start[k + 1]))) return false;
    const word = bareWord(tokens.vocabulary, tokens.id[k]);
    if (PLACE_WORDS.has(word)) return true;
    if (NOUN_PHRASE_ENDS.has(word)) return false;
  }
  return false;
}

const PHRASE_BREAK = /[,:;()|\]\[]|\s-\s/;
/** Words that end the noun phrase before a device: a place word further back is not about it. */
const NOUN_PHRASE_ENDS = new Set(['and', 'or', 'but', 'is', 'are', 'was', 'were', 'be', 'been', 'has', 'have', 'had', 'when', 'while', 'then']);

function wordsBetweenAre(tokens: WordTokens, a: number, b: number, allowed: ReadonlySet<string>): boolean {
  for (let k = a + 1; k < b; k++) if (!allowed.has(bareWord(tokens.vocabulary, tokens.id[k]))) return false;
  return true;
}

/**
 * The phrase matches of a sentence with its composed matches added, in reading order. A composed
 * match covers its device and its condition; it is left out where it overlaps a phrase match, or
 * where the sentence has a phrase match of its code.
 */
export function withComposed(text: string, matches: CodeMatch[]): CodeMatch[] {
  const composed = composeMatches(text, matches);
  if (composed.length === 0) return matches;
  return [...matches, ...composed].sort((a, b) => a.start - b.start);
}

/** The composed matches of a sentence (see withComposed). */
export function composeMatches(text: string, phrases: readonly CodeMatch[]): CodeMatch[] {
  const tokens = readWords(text);
  const found = findTerms(text, tokens);
  let hasDevice = false;
  let hasCondition = false;
  for (const f of found) {
    if (f.entry.isCondition) hasCondition = true;
    else if (f.entry.rows.length > 0) hasDevice = true;
  }
  if (!hasDevice || !hasCondition) return [];
  const clauses: Range[] = clauseRanges(text);
  const clauseOf = (pos: number) => clauseIndexAt(clauses, pos);
  const out: CodeMatch[] = [];
  const used = new Set<Found>();
  found.forEach((cond, i) => {
    if (!cond.entry.isCondition) return;
    const clause = clauseOf(cond.start);
    const isPredicate = PREDICATE_START.has(cond.entry.words[0]) || (cond.entry.words[0] === 'no' && cond.entry.words[1] === 'response');
    // The subject before the condition: the nearest device in the clause that is no reference point.
    let left: Found | null = null;
    for (let j = i - 1; j >= 0; j--) {
      const f = found[j];
      if (f.entry.isCondition) continue;
      if (clauseOf(f.start) !== clause || cond.first - f.last - 1 > DEVICE_BEFORE) break;
      if (isReferenceDevice(text, tokens, f)) continue;
      left = f;
      break;
    }
    // The device the condition describes after it: right after, or after "on the", "at the" ...
    let right: Found | null = null;
    if (!isPredicate) {
      for (let j = i + 1; j < found.length; j++) {
        if (found[j].entry.isCondition) continue;
        const f = found[j];
        if (clauseOf(f.start) === clause && f.first - cond.last - 1 <= DEVICE_AFTER && wordsBetweenAre(tokens, cond.last, f.first, BEFORE_DEVICE_WORDS) && !PHRASE_BREAK.test(text.slice(cond.end, f.start))) right = f;
        break;
      }
    }
    const leftGap = left ? cond.first - left.last - 1 : Infinity;
    const rightGap = right ? right.first - cond.last - 1 : Infinity;
    const device = right && (rightGap <= 1 || rightGap < leftGap) ? right : left;
    if (device === null || device.entry.rows.length === 0) return;
    if (cond.entry.onlyRightBefore && (device !== right || rightGap > 0 || (device.last + 1 < tokens.count && CLEAN_BILL.has(bareWord(tokens.vocabulary, tokens.id[device.last + 1]))))) return;
    const [a, b] = device.first < cond.first ? [device, cond] : [cond, device];
    if (stopBetween(tokens, a.last, b.first)) return;
    const row = device.entry.rows.find((r) => cond.entry.rows.includes(r));
    if (row === undefined) return;
    const clauseText = text.slice(clauses[clause].start, clauses[clause].end);
    const near = text.slice(Math.max(clauses[clause].start, a.start - OUTDOOR_REACH), Math.min(clauses[clause].end, b.end + OUTDOOR_REACH));
    const code = VOCABULARY[row].code === 'cover-plate-missing' && VOCABULARY[row].devices === DEVICES_WITH_PLATES && OUTDOOR_WORDS.test(near) ? 'weather-cover-missing' : VOCABULARY[row].code;
    const condWords = cond.entry.words.join(' ');
    if (code === 'receptacle-damaged' && NO_POWER_WORDS.has(condWords) && GFCI_CONTEXT.test(text)) return;
    if (code === 'exposed-wiring' && WIRE_OF_OTHER.test(clauseText)) return;
    if (code === 'open-ground' && TWO_SLOT.test(clauseText)) return;
    if (code === 'open-junction-box' && DEVICE_IN_CLAUSE.test(clauseText)) return;
    if (PUT_RIGHT.test(text)) return;
    const start = used.has(device) ? cond.start : a.start;
    const end = used.has(device) ? cond.end : b.end;
    // The phrase table reads first: no composed match over a phrase, nor beside a phrase of its code in the sentence.
    if (phrases.some((p) => (start < p.end && p.start < end) || p.rule.code === code)) return;
    if (out.some((m) => (start < m.end && m.start < end) || (m.rule.code === code && clauseOf(m.start) === clause))) return;
    const rule: CodeRule | undefined = RULE_BY_CODE.get(code);
    if (!rule) return;
    const match: CodeMatch = { rule, start, end, isRecommendation: REMEDY_OPENING.test(clauseText) };
    COMPOSED.add(match);
    used.add(device);
    out.push(match);
  });
  return out;
}
