import type { LineLabourAdders } from './price-line';
import type { SiteAdder } from './rate-book.schema';
import { compoundMultipliers } from './rounding';

/** A site condition and its position in the rate book (multipliers compound in that order). */
export interface PositionedAdder {
  readonly adder: SiteAdder;
  readonly position: number;
}

/** No labour adders: the line's own minutes, no multiplier. */
export const NO_LABOUR_ADDERS: LineLabourAdders = { minutesPerUnit: 0, multiplierBp: null };

const byRateBookPosition = (x: PositionedAdder, y: PositionedAdder) => x.position - y.position;

/**
 * Folds the labour adders that apply to one time-and-materials line (each adder once) into what the
 * line uses: the sum of the minutes-per-unit adders, and the multipliers compounded in rate-book
 * order (R2). Per-visit adders are skipped: they count once for the visit, not per line.
 * `applied` is left as it is.
 */
export function foldLabourAdders(applied: readonly PositionedAdder[]): LineLabourAdders {
  if (applied.length === 0) return NO_LABOUR_ADDERS;
  const inBookOrder = applied.length === 1 ? applied : applied.slice().sort(byRateBookPosition);
  let minutesPerUnit = 0;
  const multipliersBp: number[] = [];
  for (let i = 0; i < inBookOrder.length; i++) {
    const effect = inBookOrder[i].adder.effect;
    if (effect.kind === 'minutes-per-unit') minutesPerUnit += effect.minutes;
    else if (effect.kind === 'labour-multiplier') multipliersBp.push(effect.multiplierBp);
  }
  return { minutesPerUnit, multiplierBp: multipliersBp.length === 0 ? null : compoundMultipliers(multipliersBp) };
}
