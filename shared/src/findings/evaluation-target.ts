/**
 * What a general evaluation is asked for (the lead's decision on evaluation counts, docs/parser.md):
 * an evaluation of one named device or installation ("evaluate the panel", "this breaker", "the
 * generator and transfer switch") counts 1; an evaluation of the system, the wiring or of nothing
 * named has no count. A panel, its breakers or its dead front evaluated is at the panel.
 */

/** The evaluation verb or noun and what follows it. */
const EVALUATION = /\b(?:evaluat(?:e|ed|ion)|re-?evaluate|assess(?:ment)?|examin(?:e|ation)|inspect(?:ion)?|diagnos(?:e|is)|check(?:ed)?|look\s+(?:at|over)|review)\b(?:\s+(?:of|on))?/gi;
/** "open and evaluate the panel": a verb joined before the evaluation keeps the same object. */
const DETERMINER = /^\s*(?:(?:and|&)\s+\w+\s+)?(?:the|this|that|its|their|his|her)\s+/i;
/** One device or installation of the panel. */
const PANEL_DEVICE = /^(?:(?:[\w-]+\s+){0,2}?)(?:(?:main|electrical|service|distribution|breaker|fuse)\s+)?(?:sub-?\s?)?(?:pan+el(?:board)?|load cent(?:er|re)|breaker|fuse box|dead[- ]?front)(?![\w-])(?!\s+(?:schedules?|directory))/i;
/** One device or installation elsewhere ("the generator and transfer switch installation", "this fixture"). */
const OTHER_DEVICE = /^(?:(?:[\w-]+\s+){0,2}?)(?:generator|transfer switch|fixture|receptacle|outlet|switch|light|fan|heater|disconnect|meter(?: base)?|service (?:drop|mast|entrance)|circuit)(?![\w-])(?!\s+and\s+(?:its\s+)?(?:wiring|system)\b)/i;
/** A plural object or the whole system: no count ("the panels", "the wiring", "the system", "these circuits"). */
const NOT_ONE = /^(?:(?:[\w-]+\s+){0,2}?)(?:system|wiring|house|home|circuits|receptacles|outlets|fixtures|panels|breakers(?!\s))\b/i;
/** "should evaluate it" after a panel named earlier in the sentence. */
const IT_OBJECT = /^\s+it\b/i;
const PANEL_NAMED = /\b(?:sub-?\s?)?pan+el\b|\bbreaker\b|\bfuse box\b|\bload cent(?:er|re)\b/i;

export interface EvaluationTarget {
  readonly quantity: 1;
  readonly isPanel: boolean;
}

/** The single device a general evaluation in `text` (from `from` on) is of, or null when it is of the system or of more than one. */
export function evaluationTarget(text: string, from = 0): EvaluationTarget | null {
  EVALUATION.lastIndex = from;
  for (let m = EVALUATION.exec(text); m; m = EVALUATION.exec(text)) {
    const after = text.slice(m.index + m[0].length);
    if (IT_OBJECT.test(after)) return PANEL_NAMED.test(text.slice(0, m.index)) ? { quantity: 1, isPanel: true } : null;
    const det = DETERMINER.exec(after);
    if (!det) continue;
    const object = after.slice(det[0].length);
    if (NOT_ONE.test(object)) return null;
    if (PANEL_DEVICE.test(object)) return { quantity: 1, isPanel: true };
    if (OTHER_DEVICE.test(object)) return { quantity: 1, isPanel: false };
    return null;
  }
  return null;
}
