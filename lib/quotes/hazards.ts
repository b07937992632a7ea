// Which safety cautions a quote's lines call for. Pure.
import type { CautionKind } from '@/components/ui/caution';
import type { ProcessFamilyId, ProcessStep } from '@/db/types';
import { getFamily } from '@/lib/families';

type HazardLine = {
  processRoute: ProcessStep[];
  specText: string;
  calculation: { input: { finish: { element: string; ionCharge: number; family?: ProcessFamilyId; familyParams?: Record<string, unknown> } } };
  cost: { bake: { applies: boolean } };
};

export function quoteHazards(lines: readonly HazardLine[]): CautionKind[] {
  const kinds = new Set<CautionKind>();
  for (const l of lines) {
    const text = `${l.specText} ${l.processRoute.map((s) => `${s.step} ${s.note ?? ''}`).join(' ')}`;
    if (/cyanide/i.test(text)) kinds.add('cyanide');
    const f = l.calculation.input.finish;
    const family = getFamily(f.family);
    const params = family.paramsSchema.safeParse(f.familyParams ?? family.defaultParams);
    for (const k of family.cautions(params.success ? params.data : family.defaultParams)) kinds.add(k);
    if (f.element === 'Cr' && f.ionCharge === 6) kinds.add('hexavalent-chromium');
    if (l.cost.bake.applies) kinds.add('high-strength-steel-bake');
  }
  return [...kinds];
}
