/**
 * Lines that are items of their own although no number or bullet starts them (ninth round):
 * - a capitalised label and a dash before the note ("KIT - GFCI NONE AT SINK", "PNL (GAR) -- OPEN KO"),
 *   the verbless capitals of terse reports, in which every line is one observation;
 * - a rating code in brackets before the row ("[D]  Dock - receptacle ...", "[S]  Service - ..."),
 *   a condition-rated checklist whose codes a legend defines.
 * The label stays in the item's text (it names the place); a rating code does not.
 */
const LABEL_DASH = /^\s*(?=[\p{Lu}\d][\p{Lu}\d./()+&' ]{0,28}?\s(?:-{1,2}|–|—)\s+\S)/u;
const RATING_CODE = /^\s*\[(?:[A-Z]{1,3}\*?)\]\s+(?=\S)/;
/** A checkbox ("[X]", "[ ]") is a form's own mark, read elsewhere. */
const CHECKBOX = /^\s*\[\s?[xX ]?\]/;

/** The start marker of a line that is an item of its own, or null. */
export function lineItemMarker(line: string): RegExpExecArray | null {
  if (CHECKBOX.test(line)) return null;
  return RATING_CODE.exec(line) ?? LABEL_DASH.exec(line);
}
