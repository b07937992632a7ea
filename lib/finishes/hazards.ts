// Which safety cautions a finish needs, from its metal and its process route. Pure.
// Cyanide metals and hexavalent chromium are flagged by the engine's metal list (lib/plating/metals.ts);
// the route is read for the words a shop writes for those steps.
import { findMetal } from '@/lib/plating';
import type { CautionKind } from '@/components/ui/caution';
import type { ProcessFamilyId } from '@/db/types';
import { getFamily } from '@/lib/families';
import { cautionKindsOf, type Hazard } from '@/lib/bath/hazards';

export type RouteStep = { step: string; note?: string };

const CYANIDE = /cyanide/i;
const HEXAVALENT = /hexavalent|chromic acid|dichromate|\bcr\s*\(?vi\)?\b|yellow chromate|chromate conversion/i;
// "free of hexavalent chromium", "trivalent", "non-hexavalent" describe the safer process.
const NOT_HEXAVALENT = /\bfree\b|\bnon-?hex|trivalent|without|cr\s*\(?iii\)?/i;

// The bath's own chemistry, where the finish's name, specification or route says it.
const CAUSTIC_BATH = /alkaline (zinc|tin|copper)|stannate|caustic|sodium hydroxide|potassium hydroxide/i;
const ACID_BATH = /acid (copper|zinc|tin|nickel|gold)|copper sulfate|sulfate copper|chloride zinc|zinc chloride|sulfuric|hydrochloric|pickl|acid dip/i;

/**
 * The cautions an electroplating bath of this metal carries (reference §12): current and the
 * hydrogen it makes at the work for every bath; nickel salts; acid copper sulfate, chromic acid and
 * acid tin; cyanide copper's free caustic; alkaline zinc or stannate tin where the words say so (a
 * zinc bath may be acid or alkaline, so the metal alone does not tell).
 */
export function platingCautions(element: string, ionCharge: number, words = ''): CautionKind[] {
  const kinds = new Set<CautionKind>(['electrical', 'hydrogen']);
  const key = `${element}${ionCharge}+`;
  if (element === 'Ni') kinds.add('nickel');
  if (key === 'Cu2+' || key === 'Cr6+') kinds.add('acid');
  if (key === 'Cr6+') kinds.add('heat');
  if (key === 'Cu1+') kinds.add('caustic');
  if (key === 'Sn4+') kinds.add('caustic');
  if (key === 'Sn2+' && !CAUSTIC_BATH.test(words)) kinds.add('acid');
  if (CAUSTIC_BATH.test(words)) kinds.add('caustic');
  if (ACID_BATH.test(words)) kinds.add('acid');
  return [...kinds];
}

export function finishHazards(finish: {
  family?: ProcessFamilyId;
  familyParams?: unknown;
  element: string;
  ionCharge: number;
  route: readonly RouteStep[];
  bakeRequired: boolean;
  /** The finish's name and specification: "Alkaline zinc …" tells the bath's chemistry. */
  words?: string;
  /** The hazards of the bath that runs the finish (its tank's template), where known. */
  bathHazards?: readonly Hazard[];
}): CautionKind[] {
  const kinds = new Set<CautionKind>();
  const family = getFamily(finish.family);
  const params = family.paramsSchema.safeParse(finish.familyParams ?? family.defaultParams);
  for (const k of family.cautions(params.success ? params.data : family.defaultParams)) kinds.add(k);
  const texts = [finish.words ?? '', ...finish.route.map((s) => `${s.step} ${s.note ?? ''}`)];
  if (family.id === 'electroplating') for (const k of platingCautions(finish.element, finish.ionCharge, texts.join(' '))) kinds.add(k);
  for (const k of cautionKindsOf(finish.bathHazards ?? [])) kinds.add(k);
  const metal = findMetal(finish.element, finish.ionCharge);
  if (metal?.caution && CYANIDE.test(metal.caution)) kinds.add('cyanide');
  if (metal?.element === 'Cr' && metal.charge === 6) kinds.add('hexavalent-chromium');
  for (const text of texts) {
    if (CYANIDE.test(text)) kinds.add('cyanide');
    if (HEXAVALENT.test(text) && !NOT_HEXAVALENT.test(text)) kinds.add('hexavalent-chromium');
  }
  if (finish.bakeRequired) kinds.add('high-strength-steel-bake');
  return [...kinds];
}

/** The route as the form's text: one step a line, a note after "|". */
export function routeToText(route: readonly RouteStep[]): string {
  return route.map((s) => (s.note ? `${s.step} | ${s.note}` : s.step)).join('\n');
}

export function routeFromText(text: string): RouteStep[] {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter(Boolean)
    .map((line) => {
      const at = line.indexOf('|');
      if (at < 0) return { step: line };
      const step = line.slice(0, at).trim();
      const note = line.slice(at + 1).trim();
      return note ? { step, note } : { step };
    });
}
