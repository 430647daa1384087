/**
 * The electrical finding codes a report can produce: one row per code with the plain-language
 * label shown to agents and sellers, the usual correction, the default severity and the NFPA 70
 * (NEC) sections that usually govern the correction. Section numbers are from memory of the
 * 2017-2023 editions; the locally adopted edition and the authority having jurisdiction decide.
 */
export const SEVERITIES = ['safety', 'repair', 'upgrade', 'evaluate'] as const;
export type Severity = (typeof SEVERITIES)[number];

export interface FindingCodeInfo {
  /** What the report says, in plain words. */
  readonly label: string;
  /** The correction a contractor usually prices. */
  readonly correction: string;
  readonly severity: Severity;
  /**
   * The published rules that govern the correction: NFPA 70 (NEC) sections by number ("210.8(A)"), or
   * another document by its name ("NFPA 72") and "local code" where the local rules decide. Written
   * for reading by `codeReferenceText` ("NEC 210.8(A), 406.4(D)(3)", "NFPA 72 and local code").
   */
  readonly necRefs: readonly string[];
}

export const FINDING_CODE_TABLE = {
  'gfci-missing': {
    label: 'No ground-fault (GFCI) protection where it is expected',
    correction: 'Install a GFCI receptacle or GFCI breaker at the first device of the run',
    severity: 'safety',
    necRefs: ['210.8(A)', '406.4(D)(3)'],
  },
  'gfci-inoperative': {
    label: 'GFCI does not trip, will not reset, or is worn',
    correction: 'Replace the GFCI device',
    severity: 'safety',
    necRefs: ['406.4(D)(3)', '110.3(B)'],
  },
  'afci-missing': {
    label: 'No arc-fault (AFCI) protection on bedroom or living-area circuits',
    correction: 'AFCI breaker or outlet-branch-circuit AFCI device (often an upgrade in older homes)',
    severity: 'upgrade',
    necRefs: ['210.12', '406.4(D)(4)'],
  },
  'reversed-polarity': {
    label: 'Hot and neutral reversed at a receptacle',
    correction: 'Re-terminate the conductors on the correct terminals',
    severity: 'safety',
    necRefs: ['200.11', '406.4'],
  },
  'open-ground': {
    label: 'Three-slot receptacle with no equipment ground',
    correction: 'Restore the ground path, or GFCI-protect and label "No Equipment Ground", or fit a two-slot device',
    severity: 'safety',
    necRefs: ['406.4(D)(2)', '250.146'],
  },
  'false-ground': {
    label: 'Neutral jumpered to the ground terminal ("bootleg" ground)',
    correction: 'Remove the jumper; then correct as an open ground',
    severity: 'safety',
    necRefs: ['250.142(B)', '406.4(D)(2)'],
  },
  'receptacle-damaged': {
    label: 'Loose, cracked, scorched, painted-over, worn or dead receptacle',
    correction: 'Replace the receptacle',
    severity: 'repair',
    necRefs: ['406.4', '110.12'],
  },
  'weather-cover-missing': {
    label: 'Exterior or wet-location receptacle without an in-use cover or weather-resistant device',
    correction: 'Install an in-use cover and a weather-resistant device',
    severity: 'repair',
    necRefs: ['406.9'],
  },
  'cover-plate-missing': {
    label: 'Missing or broken cover plate on a receptacle or switch',
    correction: 'Install a cover plate',
    severity: 'repair',
    necRefs: ['406.6', '404.9'],
  },
  'open-junction-box': {
    label: 'Junction box without a cover, or splices outside a box',
    correction: 'Install a box and/or blank cover; enclose the splices',
    severity: 'safety',
    necRefs: ['314.28(C)', '300.15'],
  },
  'exposed-wiring': {
    label: 'Unprotected or unsecured wiring, or an extension cord used as permanent wiring',
    correction: 'Protect, secure or replace with a proper wiring method',
    severity: 'safety',
    necRefs: ['334.15', '334.30', '400.12'],
  },
  'double-tap': {
    label: 'Two conductors under one breaker terminal not listed for it',
    correction: 'Add a pigtail, a tandem breaker where permitted, or a separate breaker',
    severity: 'repair',
    necRefs: ['110.14', '408.41'],
  },
  'overcurrent-mismatch': {
    label: 'Breaker or fuse larger than the conductor it protects',
    correction: 'Replace the breaker or fuse with the correct rating',
    severity: 'safety',
    necRefs: ['240.4(D)'],
  },
  'panel-deficiency': {
    label: 'Panel defect: screws, open knockouts or fillers, directory, corrosion or blocked clearance',
    correction: 'Correct the listed panel defect',
    severity: 'repair',
    necRefs: ['110.12(A)', '408.4', '110.26'],
  },
  'subpanel-bonding': {
    label: 'Neutrals and grounds not separated in a subpanel, or neutral bonded downstream of the service',
    correction: 'Separate neutrals and grounds; remove the bonding screw or strap',
    severity: 'safety',
    necRefs: ['250.24(A)(5)', '250.142(B)'],
  },
  'grounding-electrode': {
    label: 'Missing or loose grounding electrode conductor, water-pipe or gas-pipe bond',
    correction: 'Install or repair grounding and bonding',
    severity: 'safety',
    necRefs: ['250.50', '250.104'],
  },
  'smoke-co-alarm': {
    label: 'Smoke or carbon-monoxide alarms missing, expired or inoperative',
    correction: 'Install or replace alarms (often a local fire-code or transfer requirement)',
    severity: 'safety',
    // Not an NEC rule: NFPA 72 (National Fire Alarm and Signaling Code, chapter 29 for dwelling alarms)
    // and the locally adopted residential or fire code (IRC R314 and R315 where adopted; from memory).
    necRefs: ['NFPA 72', 'local code'],
  },
  'light-fixture': {
    label: 'Inoperative or unsecured light, missing closet globe, or recessed light against insulation',
    correction: 'Repair or replace the fixture',
    severity: 'repair',
    necRefs: ['410.16', '410.116'],
  },
  'fan-support': {
    label: 'Ceiling fan wobbling or not on a fan-rated box',
    correction: 'Install a fan-rated box or support',
    severity: 'repair',
    necRefs: ['314.27(C)', '422.18'],
  },
  'switch-issue': {
    label: 'Switch inoperative, loose, or of unknown function',
    correction: 'Repair or replace the switch',
    severity: 'repair',
    necRefs: ['404.9'],
  },
  'aluminum-branch-wiring': {
    label: 'Solid-conductor aluminum branch-circuit wiring',
    correction: 'Evaluation; pigtail with connectors listed for aluminum to copper',
    severity: 'evaluate',
    necRefs: ['110.14'],
  },
  'knob-and-tube': {
    label: 'Knob-and-tube or other ungrounded legacy wiring in use',
    correction: 'Evaluation; replacement of the circuits',
    severity: 'evaluate',
    necRefs: ['394'],
  },
  'service-equipment': {
    label: 'Service mast, drip loop, meter base or service-entrance cable damage or clearance problem',
    correction: 'Repair the service equipment (with the utility)',
    severity: 'safety',
    necRefs: ['230'],
  },
  'evaluate-general': {
    label: 'General recommendation to have a licensed electrician evaluate, with no specific defect',
    correction: 'Evaluation visit',
    severity: 'evaluate',
    necRefs: [],
  },
} as const satisfies Record<string, FindingCodeInfo>;

export type FindingCode = keyof typeof FINDING_CODE_TABLE;

/** All codes in table order; the order also breaks ties between overlapping phrase matches. */
export const FINDING_CODES = Object.keys(FINDING_CODE_TABLE) as FindingCode[];

export function findingCodeInfo(code: FindingCode): FindingCodeInfo {
  return FINDING_CODE_TABLE[code];
}
