/**
 * A quantity with its rate-book unit, in words: "1 device", "3 devices", "2 boxes", "2 each".
 * Units are free text in the rate book; the plural follows ordinary English rules, and short forms
 * ("ea", "ft", "hr") and words already plural or uncountable stay as they are.
 */
const UNCHANGED = new Set(['each', 'ea', 'ft', 'lf', 'hr', 'hrs', 'min', 'pcs', 'lot', 'set of', 'per']);
const IRREGULAR: Record<string, string> = { foot: 'feet', man: 'men', person: 'people', inch: 'inches' };

export function pluralUnit(unit: string): string {
  const trimmed = unit.trim();
  const match = /^(.*?)([A-Za-z]+)$/.exec(trimmed);
  if (!match) return trimmed;
  const [, before, word] = match;
  const lower = word.toLowerCase();
  if (UNCHANGED.has(lower) || word.length <= 2 || word === word.toUpperCase()) return trimmed;
  if (IRREGULAR[lower]) return before + IRREGULAR[lower];
  if (/(s|x|z|ch|sh)$/.test(lower)) return `${before}${word}es`;
  if (/[^aeiou]y$/.test(lower)) return `${before}${word.slice(0, -1)}ies`;
  return `${before}${word}s`;
}

export function quantityLabel(quantity: number | null, unit: string | null | undefined): string {
  if (quantity === null) return unit ? `quantity to confirm (per ${unit.trim()})` : 'quantity to confirm';
  if (!unit || !unit.trim()) return String(quantity);
  return `${quantity} ${quantity === 1 ? unit.trim() : pluralUnit(unit)}`;
}
