// Which safety cautions a quote's lines call for: each line's finish, as every other screen judges
// it (lib/finishes/hazards), and the relief bake where the line's cost includes one. Pure.
import type { CautionKind } from '@/components/ui/caution';
import type { ProcessFamilyId, ProcessStep } from '@/db/types';
import type { Hazard } from '@/lib/bath/hazards';
import { finishHazards } from '@/lib/finishes/hazards';

type HazardLine = {
  finishId?: string;
  finishName?: string;
  processRoute: ProcessStep[];
  specText: string;
  calculation: { input: { finish: { element: string; ionCharge: number; family?: ProcessFamilyId; familyParams?: Record<string, unknown> } } };
  cost: { bake: { applies: boolean } };
};

/** `bathHazards`: each finish's bath hazards (lib/finishes/bath-hazards.ts), by finish id. */
export function quoteHazards(lines: readonly HazardLine[], bathHazards: ReadonlyMap<string, readonly Hazard[]> = new Map()): CautionKind[] {
  const kinds = new Set<CautionKind>();
  for (const l of lines) {
    const f = l.calculation.input.finish;
    const found = finishHazards({
      family: f.family,
      familyParams: f.familyParams,
      element: f.element,
      ionCharge: f.ionCharge,
      route: l.processRoute,
      bakeRequired: l.cost.bake.applies,
      words: `${l.finishName ?? ''} ${l.specText}`,
      bathHazards: l.finishId ? bathHazards.get(l.finishId) : undefined,
    });
    for (const k of found) kinds.add(k);
  }
  return [...kinds];
}
