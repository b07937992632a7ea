// Bath chemistry templates: the starting point a shop copies for a new tank. Values are typical
// (reference §2–3 with their sources, or marked "from memory"); the supplier's data sheet governs.
import { TEMPLATE_NOTE, type BathTemplate } from './types';
import type { Hazard } from '../hazards';
import { FAMILIES } from '@/lib/families';
import { getMethod } from '../methods';

export * from './types';

/** Every family's templates (lib/families registers them). */
export const BATH_TEMPLATES: readonly BathTemplate[] = FAMILIES.flatMap((f) => f.templates);

export function getTemplate(id: string): BathTemplate | null {
  return BATH_TEMPLATES.find((t) => t.id === id) ?? null;
}

/** A template's hazard tags (a copy); none for an unknown or absent template. */
export function templateHazards(id: string | null | undefined): Hazard[] {
  return [...((id ? getTemplate(id)?.hazards : undefined) ?? [])];
}

/** Consistency problems in a template (also used when a supervisor edits a copy). */
export function validateTemplate(t: BathTemplate): string[] {
  const problems: string[] = [];
  const keys = new Set<string>();
  if (t.note !== TEMPLATE_NOTE) problems.push('The supplier data sheet note is missing.');
  if (t.efficiencyPercent) {
    const { low, typical, high } = t.efficiencyPercent;
    if (!(low > 0 && low <= typical && typical <= high && high <= 100)) problems.push('Efficiency range is not ordered within 0–100 %.');
  }
  if (t.currentDensityAdm2 && !(t.currentDensityAdm2.low > 0 && t.currentDensityAdm2.low < t.currentDensityAdm2.high)) {
    problems.push('Current density range is not ordered.');
  }
  for (const a of t.analytes) {
    const where = `${t.name} / ${a.name}`;
    if (keys.has(a.key)) problems.push(`${where}: duplicate key.`);
    keys.add(a.key);
    if (!getMethod(a.methodId)) problems.push(`${where}: unknown method "${a.methodId}".`);
    if (a.lowerControl === undefined && a.upperControl === undefined) problems.push(`${where}: no control limit.`);
    if (a.lowerControl !== undefined && a.target < a.lowerControl) problems.push(`${where}: target below the lower control limit.`);
    if (a.upperControl !== undefined && a.target > a.upperControl) problems.push(`${where}: target above the upper control limit.`);
    if (a.lowerSpec !== undefined && a.lowerControl !== undefined && a.lowerSpec > a.lowerControl) {
      problems.push(`${where}: lower specification limit inside the control band.`);
    }
    if (a.upperSpec !== undefined && a.upperControl !== undefined && a.upperSpec < a.upperControl) {
      problems.push(`${where}: upper specification limit inside the control band.`);
    }
    if (!(a.frequencyHours > 0)) problems.push(`${where}: analysis frequency must be positive.`);
    if (a.additiveRateMlPerKAh !== undefined && !(a.additiveRateMlPerKAh > 0)) problems.push(`${where}: additive rate must be positive.`);
    for (const v of [a.target, a.lowerControl, a.upperControl, a.lowerSpec, a.upperSpec]) {
      if (v !== undefined && !Number.isFinite(v)) problems.push(`${where}: a limit is not a number.`);
    }
  }
  return problems;
}
