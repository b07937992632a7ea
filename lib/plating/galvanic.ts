import { PlatingInputError } from './errors';
import {
  CONTACT_LIMITS_V,
  GALVANIC_MATERIALS,
  STANDARD_POTENTIALS,
  type GalvanicMaterial,
  type ServiceEnvironment,
} from './galvanic-data';

// Galvanic judgements from the anodic index. For a plated part only the coating counts, and
// chromate or phosphate films are ignored (MIL-DTL-14072 §3.13.1, reference §9.1).

export function getGalvanicMaterial(id: string) {
  if (!Object.prototype.hasOwnProperty.call(GALVANIC_MATERIALS, id)) {
    throw new PlatingInputError(
      'material',
      `Unknown material "${id}". Known materials: ${Object.keys(GALVANIC_MATERIALS).join(', ')}.`,
    );
  }
  return GALVANIC_MATERIALS[id as GalvanicMaterial];
}

// Index values are in hundredths of a volt and E° in tenths of a millivolt; rounding to that keeps
// 0.40 − 0.25 from reading 0.15000000000000002 and failing a ≤ 0.15 V limit.
const roundVolts = (v: number) => Math.round(v * 10_000) / 10_000;

function standardPotential(material: ReturnType<typeof getGalvanicMaterial>): number | null {
  return material.couple ? STANDARD_POTENTIALS[material.couple].volts : null;
}

export type CoatingCheck = {
  protection: 'sacrificial' | 'barrier' | 'equal';
  // anodic index of coating minus that of substrate: positive means the coating corrodes first
  differenceV: number;
  coatingIndexV: number;
  substrateIndexV: number;
  // E°(coating) − E°(substrate), for explanation only; null where a couple is not listed
  standardPotentialDifferenceV: number | null;
  explanation: string;
};

export function galvanicCheck(input: { coating: string; substrate: string }): CoatingCheck {
  const coating = getGalvanicMaterial(input.coating);
  const substrate = getGalvanicMaterial(input.substrate);
  const differenceV = roundVolts(coating.anodicIndexV - substrate.anodicIndexV);
  const eCoating = standardPotential(coating);
  const eSubstrate = standardPotential(substrate);
  const protection = differenceV > 0 ? 'sacrificial' : differenceV < 0 ? 'barrier' : 'equal';
  const explanation = {
    sacrificial:
      `${coating.name} is anodic to ${substrate.name.toLowerCase()}: it corrodes first and ` +
      'protects the substrate at scratches and pores.',
    barrier:
      `${coating.name} is cathodic to ${substrate.name.toLowerCase()}: it protects only while ` +
      'unbroken; at pores and scratches the substrate corrodes, so thickness and porosity matter.',
    equal: 'Coating and substrate sit at the same anodic index: no galvanic drive either way.',
  }[protection];
  return {
    protection,
    differenceV,
    coatingIndexV: coating.anodicIndexV,
    substrateIndexV: substrate.anodicIndexV,
    standardPotentialDifferenceV:
      eCoating === null || eSubstrate === null ? null : roundVolts(eCoating - eSubstrate),
    explanation,
  };
}

export type ContactCheck = {
  differenceV: number;
  limitV: number;
  exceedsLimit: boolean;
  anodicMember: 'a' | 'b' | null; // the one that corrodes
  note: string;
};

export function contactCheck(input: { a: string; b: string; environment: ServiceEnvironment }): ContactCheck {
  const a = getGalvanicMaterial(input.a);
  const b = getGalvanicMaterial(input.b);
  if (!Object.prototype.hasOwnProperty.call(CONTACT_LIMITS_V, input.environment)) {
    throw new PlatingInputError(
      'environment',
      `Environment must be one of ${Object.keys(CONTACT_LIMITS_V).join(', ')}; got "${String(input.environment)}".`,
    );
  }
  const limitV = CONTACT_LIMITS_V[input.environment];
  const differenceV = roundVolts(Math.abs(a.anodicIndexV - b.anodicIndexV));
  const anodicMember = a.anodicIndexV === b.anodicIndexV ? null : a.anodicIndexV > b.anodicIndexV ? 'a' : 'b';
  const exceedsLimit = differenceV > limitV;
  const anode = anodicMember === 'a' ? a.name : anodicMember === 'b' ? b.name : null;
  const note = exceedsLimit
    ? `${differenceV.toFixed(2)} V exceeds the ${limitV.toFixed(2)} V allowed in a ${input.environment} environment; ` +
      `${anode} would corrode. Choose closer materials, plate one member, or insulate the joint.`
    : `${differenceV.toFixed(2)} V is within the ${limitV.toFixed(2)} V allowed in a ${input.environment} environment.` +
      (anode ? ` Keep the anodic member (${anode}) the larger area.` : '');
  return { differenceV, limitV, exceedsLimit, anodicMember, note };
}
