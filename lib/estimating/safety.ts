// What the workbench warns about for a job: cyanide and hexavalent-chromium processes, and
// high-strength steel that needs a hydrogen-embrittlement relief bake; plus the galvanic checks of
// the coating on its substrate and of the finished part against a mating material. Pure.
import {
  contactCheck,
  galvanicCheck,
  findMetal,
  PlatingInputError,
  type CoatingCheck,
  type ContactCheck,
  type GalvanicMaterial,
  type ServiceEnvironment,
  type SubstrateId,
} from '@/lib/plating';
import { bakeRequirement, type BakeRequirement } from '@/lib/quality/bake';
import { AppError } from '@/lib/errors';

export type SafetyKind = 'cyanide' | 'hexavalent-chromium' | 'high-strength-steel-bake';
export type SafetyNote = { kind: SafetyKind; detail: string };

// Cu⁺, Ag⁺ and Au⁺ are plated from cyanide complexes; cadmium baths are usually cyanide too
// (reference §12; the engine's metal table carries the same cautions).
const CYANIDE_METALS = new Set(['Cu1+', 'Ag1+', 'Au1+', 'Cd2+']);
const HEXAVALENT_CHROMIUM = 'Cr6+';

export const STEEL_SUBSTRATES: ReadonlySet<SubstrateId> = new Set<SubstrateId>(['carbon-steel', 'stainless-304']);

// The metal a coating of each element is judged as in the anodic-index table.
const COATING_MATERIAL: Partial<Record<string, GalvanicMaterial>> = {
  Ni: 'nickel', Cu: 'copper', Zn: 'zinc', Cr: 'chromium', Sn: 'tin', Ag: 'silver', Au: 'gold', Cd: 'cadmium', Pb: 'lead', Rh: 'rhodium',
};
const SUBSTRATE_MATERIAL: Record<SubstrateId, GalvanicMaterial> = {
  'carbon-steel': 'steel',
  'stainless-304': 'stainless-steel',
  brass: 'brass',
  copper: 'copper',
  aluminium: 'aluminium',
  'zinc-die-cast': 'zinc',
};

/** The relief-bake requirement (ASTM B849/B850 via lib/quality/bake.ts) for a steel part; null otherwise. */
export function bakeFor(substrate: SubstrateId, hardnessHrc: number | null, tensileMpa: number | null): BakeRequirement | null {
  if (!STEEL_SUBSTRATES.has(substrate) || (hardnessHrc === null && tensileMpa === null)) return null;
  try {
    return bakeRequirement({ hardnessHrc: hardnessHrc ?? undefined, tensileMpa: tensileMpa ?? undefined });
  } catch (e) {
    // One error type out of the workbench's calculation: the quality module's message, same field.
    if (e instanceof AppError && e.fieldErrors) {
      const [field, messages] = Object.entries(e.fieldErrors)[0] ?? ['hardnessHrc', [e.message]];
      throw new PlatingInputError(field, messages[0] ?? e.message);
    }
    throw e;
  }
}

export function safetyNotes(element: string, charge: number, bake: BakeRequirement | null): SafetyNote[] {
  const notes: SafetyNote[] = [];
  const metal = findMetal(element, charge);
  if (metal && CYANIDE_METALS.has(metal.key)) notes.push({ kind: 'cyanide', detail: metal.caution ?? '' });
  if (metal?.key === HEXAVALENT_CHROMIUM) notes.push({ kind: 'hexavalent-chromium', detail: metal.caution ?? '' });
  if (bake?.required) {
    const hours = bake.minHours === null ? "the time the customer's specification sets" : `at least ${bake.minHours} h`;
    const detail = [
      `Relief bake ${hours} at ${bake.minTempC}–${bake.maxTempC} °C, starting within ${bake.windowHours} h of plating (ASTM B850).`,
      ...bake.notes,
      bake.caution,
    ].join(' ');
    notes.push({ kind: 'high-strength-steel-bake', detail });
  }
  return notes;
}

export type CoatingVerdict = CoatingCheck & { coating: GalvanicMaterial; substrate: GalvanicMaterial };
export type ContactVerdict = ContactCheck & { coating: GalvanicMaterial; other: GalvanicMaterial; environment: ServiceEnvironment };

export function coatingMaterialOf(element: string): GalvanicMaterial | null {
  return Object.hasOwn(COATING_MATERIAL, element) ? (COATING_MATERIAL[element] ?? null) : null;
}

/** Is the coating sacrificial to the substrate or only a barrier? null where the table has no row. */
export function coatingVerdict(element: string, substrate: SubstrateId): CoatingVerdict | null {
  const coating = coatingMaterialOf(element);
  if (!coating) return null;
  const base = SUBSTRATE_MATERIAL[substrate];
  return { ...galvanicCheck({ coating, substrate: base }), coating, substrate: base };
}

/** The finished part (its coating) touching another material in service. */
export function contactVerdict(
  element: string,
  contact: { material: GalvanicMaterial; environment: ServiceEnvironment } | null,
): ContactVerdict | null {
  const coating = coatingMaterialOf(element);
  if (!coating || !contact) return null;
  return { ...contactCheck({ a: coating, b: contact.material, environment: contact.environment }), coating, other: contact.material, environment: contact.environment };
}
