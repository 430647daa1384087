import { CODE_RULES } from './code-patterns';
import { requiredLiteralLists, requiredLiterals, requiredLiteralTest } from './phrase-literals';
import { gap, rx, T } from './term-lexicon';

/** Whether the text contains one of the literals, in lower case (as the matcher checks it). */
const containsOne = (literals: readonly string[], text: string) => literals.some((l) => text.toLowerCase().includes(l));

describe('requiredLiterals', () => {
  it('reads words, alternatives, optional letters and small classes', () => {
    expect(requiredLiterals(rx`reverse polarity`)).toEqual(['reverse polarity']);
    expect(requiredLiterals(/rec[ei]p|outlet/gi)).toEqual(expect.arrayContaining(['recep', 'recip', 'outlet']));
    expect(requiredLiterals(/(?:double|dual)[- ]?tap/gi)).toEqual(
      expect.arrayContaining(['doubletap', 'double-tap', 'double tap', 'dualtap', 'dual-tap', 'dual tap']),
    );
  });

  it('keeps the shortest of nested literals (a text with "gfcis" contains "gfci")', () => {
    expect(requiredLiterals(/gfcis?|gfi/gi)).toEqual(['gfi', 'gfci']);
  });

  it('skips zero-width parts and picks the most selective required part', () => {
    expect(requiredLiterals(/(?<![\w])ground(?!\s*fault)/gi)).toEqual(['ground']);
    expect(requiredLiterals(new RegExp(String.raw`(?:no|lacks?)\s+${gap(2)}(?:dead[- ]?front)`, 'gi'))).toEqual([
      'deadfront',
      'dead-front',
      'dead front',
    ]);
    expect(requiredLiterals(/(?:ab)+c/gi)).toEqual(['ab']);
  });

  it('lists every part a match needs, each as its own list of alternatives', () => {
    expect(requiredLiteralLists(new RegExp(String.raw`open\s+${gap(2)}grounds?`, 'gi'))).toEqual([['open'], ['ground']]);
    expect(requiredLiteralLists(/(?:no|missing)\s+(?:gfci|gfi)/gi)).toEqual([
      ['no', 'missing'],
      ['gfi', 'gfci'],
    ]);
    expect(requiredLiteralLists(/\d+\s+\w+/gi)).toEqual([]);
  });

  it('takes a rare sign alone as a literal ("k & t", "n/g"), never a single letter', () => {
    expect(requiredLiterals(/\bk\s?&\s?t\b|\bknt\b/gi)).toEqual(['&', 'knt']);
    expect(requiredLiterals(/\bn\s*(?:&|\/)\s*g\b/gi)).toEqual(['&', '/']);
    expect(requiredLiteralLists(/\bk\s?x\s?t\b|\bknt\b/gi)).toEqual([]);
  });

  it('gives null where nothing can be required', () => {
    expect(requiredLiterals(/\w+\s+\d/gi)).toBeNull(); // only classes
    expect(requiredLiterals(/ground|\d+/gi)).toBeNull(); // one alternative has no word
    expect(requiredLiterals(/(?:ground)?/gi)).toBeNull(); // optional
    expect(requiredLiterals(/k\s?x\s?t/gi)).toBeNull(); // pieces of one letter are too common to check
    expect(requiredLiterals(/ground/g)).toBeNull(); // case-sensitive: not read
    expect(requiredLiterals(/ground/giu)).toBeNull(); // unicode case folding: not read
    expect(requiredLiterals(/café/gi)).toEqual(['caf']); // a non-ASCII letter is not read, the rest is
  });

  // Soundness on report phrasing (fictional examples): wherever a phrase of the table matches, the
  // sentence contains one of its required literals. The corpus check (test/unit/corpus.spec.ts)
  // does the same through matchCodes on every corpus sentence.
  it('never rules out a sentence that a phrase of the table matches', () => {
    const sentences = [
      'GFCI protection missing at the kitchen counter receptacles.',
      'Receptacles in the hall bath are not on a ground-fault circuit interrupter.',
      'The garage GFI would not reset; recommend installing G.F.C.I. protection.',
      'No arc-fault protection for the bedroom circuits.',
      'Rev. polarity at the den outlet; hot and neutral are reversed at the island.',
      'Three-prong receptacles on an ungrounded two-wire circuit; open grounds at 2 locations.',
      'Bootlegged ground observed: neutral jumpered to the ground screw.',
      'Loose, scorched and painted-over recepticals; plugs fall out of the worn contacts.',
      'The exterior receptacle lacks an in-use weatherproof cover; not weather-resistant.',
      'Missing cover plates and a cracked switch plate in the laundry.',
      'Open junction box in the attic; wire splices outside of an approved box.',
      'Exposed NM cable within reach; extension cord used as permanent wiring.',
      'Double-tapped breaker and a double lug neutral; two wires under one terminal screw.',
      '30 amp breaker protecting #12 AWG wire; oversized fuse at the subpanel.',
      'Dead-front cover screws missing; pointed screws at the panel; open knockouts; no directory.',
      'Neutrals and grounds share the bar in the detached garage subpanel; bonding screw present.',
      'Grounding electrode conductor loose at the rod; water pipe not bonded.',
      'Smoke alarms expired in the hallway; CO detector missing; recommend adding smoke detectors.',
      'Recessed light fixtures in contact with insulation; broken globe; bare bulbs in the closet.',
      'Ceiling fan wobbles and is mounted to a standard light box.',
      'Switch at the stairs is loose; function of the wall switch could not be determined.',
      'Single-strand aluminum branch circuit wiring observed.',
      'Knob-and-tube and cloth-insulated wiring in the attic.',
      'Service drop in contact with tree branches; weatherhead loose; low clearance over the roof.',
      'Recommend evaluation and repair by a licensed electrician.',
    ];
    let matched = 0;
    for (const rule of CODE_RULES) {
      for (const re of [rule.trigger, ...rule.patterns.map((p) => p.re)]) {
        const lists = requiredLiteralLists(re);
        for (const sentence of sentences) {
          if (!new RegExp(re.source, re.flags.replace('g', '')).test(sentence)) continue;
          matched++;
          for (const list of lists) expect([sentence, re.source, containsOne(list, sentence)]).toEqual([sentence, re.source, true]);
        }
      }
    }
    expect(matched).toBeGreaterThan(60);
  });

  it('finds required words for nearly every phrase of the table', () => {
    const phrases = CODE_RULES.flatMap((r) => r.patterns);
    const withWords = phrases.filter((p) => requiredLiterals(p.re) !== null);
    expect(withWords.length / phrases.length).toBeGreaterThan(0.95);
    expect(requiredLiterals(new RegExp(T.GFCI, 'gi'))).toEqual(expect.arrayContaining(['gfci', 'gfi', 'ground fault']));
  });
});

describe('requiredLiteralTest', () => {
  const nameplate = /\b(?:(?:nameplate|data plate)\b[^.;]{0,30}?\bmax(?:imum)?|mocp)[^.;\d]{0,40}?(\d{2,3})\s?a\b/gi;
  const test = requiredLiteralTest(nameplate);

  it('passes every text the expression matches, in any case', () => {
    for (const text of ['The NAMEPLATE lists a maximum of 30 A.', 'MOCP 25 A', 'data plate: max breaker 40a']) {
      expect(nameplate.test(text)).toBe(true);
      nameplate.lastIndex = 0;
      expect(test(text)).toBe(true);
    }
  });

  it('rules out a text without the words the expression needs', () => {
    expect(test('The breaker is rated 30 A on 10 AWG copper.')).toBe(false);
  });

  it('needs a word of every list, and passes everything when none can be derived', () => {
    const both = requiredLiteralTest(/\bno\s+gfci\b/gi);
    expect(both('no protection')).toBe(false);
    expect(both('GFCI present')).toBe(false);
    expect(both('No GFCI')).toBe(true);
    expect(requiredLiteralTest(/\w+/g)('anything')).toBe(true);
  });

  it('searches for literals with characters special in expressions as written', () => {
    const slash = requiredLiteralTest(/\bn\/a\b/gi);
    expect(slash('N/A')).toBe(true);
    expect(slash('na')).toBe(false);
  });
});
