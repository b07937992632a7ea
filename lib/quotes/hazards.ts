// Which safety cautions a quote's lines call for. Pure.
import type { CautionKind } from '@/components/ui/caution';
import type { ProcessStep } from '@/db/types';

type HazardLine = { processRoute: ProcessStep[]; specText: string; calculation: { input: { finish: { element: string; ionCharge: number } } }; cost: { bake: { applies: boolean } } };

export function quoteHazards(lines: readonly HazardLine[]): CautionKind[] {
  const kinds = new Set<CautionKind>();
  for (const l of lines) {
    const text = `${l.specText} ${l.processRoute.map((s) => `${s.step} ${s.note ?? ''}`).join(' ')}`;
    if (/cyanide/i.test(text)) kinds.add('cyanide');
    const f = l.calculation.input.finish;
    if (f.element === 'Cr' && f.ionCharge === 6) kinds.add('hexavalent-chromium');
    if (l.cost.bake.applies) kinds.add('high-strength-steel-bake');
  }
  return [...kinds];
}
