import { AdderEffect } from '@cc/shared';

/** What a site condition does to labour, in words (`+30 min per unit`, `labour ×1.3`). */
export function adderEffectLabel(effect: AdderEffect): string {
  switch (effect.kind) {
    case 'minutes-per-unit':
      return `+${effect.minutes} min per unit`;
    case 'minutes-per-visit':
      return `+${effect.minutes} min once per visit`;
    case 'labour-multiplier':
      return `labour ×${(effect.multiplierBp / 10_000).toLocaleString('en-US', { maximumFractionDigits: 4 })}`;
  }
}
