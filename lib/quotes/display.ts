// Cost build-up figures in the reader's unit system. Pure; money stays in cents until formatted.
import { formatNumber, fromStorage, type UnitSystem } from '@/lib/plating';
import { formatRate } from './format';
import type { CostComponent } from './pricing';

const KG_PER_LB = 0.45359237; // Source: NIST SP 811 App. B.8 (1 lb = 0.453 592 37 kg)

export function componentFigures(c: CostComponent, system: UnitSystem): { quantity: string; rate: string } {
  if (c.unit === 'kg' && system === 'us') {
    const lb = fromStorage(c.quantity * 1000, 'lb');
    return { quantity: `${formatNumber(lb, 4)} lb`, rate: `${formatRate(c.rateCents * KG_PER_LB)}/lb` };
  }
  const per = c.unit === 'pc' ? 'piece' : c.unit;
  // Pieces and loads are counts: no decimals.
  const amount = Number.isInteger(c.quantity) ? c.quantity.toLocaleString('en-US') : formatNumber(c.quantity, 4);
  return { quantity: `${amount} ${c.unit}`, rate: `${formatRate(c.rateCents)}/${per}` };
}
