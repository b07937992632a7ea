// Bath corrections: additions to bring a component up to target, decant-and-replace dilution
// when a component is high, amp-hour replenishment of additives, and the combined plan.
// Formulas per reference §5. Results are never negative: a component at or above target
// needs no addition. Volume change from added salts is ignored (reference §5: fine below about
// 5 % of the bath mass); the plan warns above that.
import type { ElementSymbol } from '../chemistry/atomic-weights';
import { metalFraction } from '../chemistry/formula';
import { requireSalt, type Salt } from '../chemistry/salts';
import { badInput, finiteResult, requireNumber } from './checks';

type Change = { volumeL: number; measured: number; target: number };

function readChange(c: Change): Change {
  return {
    volumeL: requireNumber(c.volumeL, 'volumeL', 'Bath volume', { positive: true }),
    measured: requireNumber(c.measured, 'measured', 'Measured concentration', { min: 0 }),
    target: requireNumber(c.target, 'target', 'Target concentration', { min: 0 }),
  };
}

/** kg of a component added as itself: (C_target − C_measured) g/L × V L ÷ 1000. */
export function additionAsMeasuredKg(change: Change): number {
  const { volumeL, measured, target } = readChange(change);
  return Math.max(0, ((target - measured) * volumeL) / 1000);
}

/** kg of a salt when the analysis is the metal: metal kg ÷ metal fraction w. */
export function saltAdditionKg(change: Change & { metalFraction: number }): number {
  const w = requireNumber(change.metalFraction, 'metalFraction', 'Metal fraction', { positive: true, max: 1 });
  return finiteResult(additionAsMeasuredKg(change) / w, 'Salt addition');
}

/** L of a liquid concentrate: Δ g/L × V ÷ concentrate g/L. */
export function concentrateAdditionL(change: Change & { contentGramsPerLitre: number }): number {
  const c = requireNumber(change.contentGramsPerLitre, 'contentGramsPerLitre', 'Concentrate strength', { positive: true });
  return finiteResult((additionAsMeasuredKg(change) * 1000) / c, 'Concentrate addition');
}

/** Litres to decant and replace with water so a high component falls to target: X = V(C − Ct)/C. */
export function decantForDilutionL(change: Change): number {
  const { volumeL, measured, target } = readChange(change);
  if (measured <= target) return 0;
  // Clamped: rounding must never ask for more than the whole bath.
  return Math.min(volumeL, (volumeL * (measured - target)) / measured);
}

/** Amp-hour replenishment: mL = A·h ÷ 1000 × rate (mL per kA·h). */
export function ampHourAdditionMl(input: { ampHours: number; rateMlPerKAh: number }): number {
  const ah = requireNumber(input.ampHours, 'ampHours', 'Amp-hours since the last addition', { min: 0 });
  const rate = requireNumber(input.rateMlPerKAh, 'rateMlPerKAh', 'Replenishment rate', { min: 0 });
  return (ah / 1000) * rate;
}

/** How a component is put back: as itself, as a salt carrying the analysed metal, or as a concentrate. */
export type Supply =
  | { kind: 'as_measured'; name: string }
  | { kind: 'salt'; saltId: string }
  | { kind: 'salt_formula'; name: string; formula: string; element: ElementSymbol }
  | { kind: 'concentrate'; saltId: string };

export type ComponentState = { key: string; name: string; measured: number; target: number; supply: Supply };

export type PlannedAddition = {
  key: string;
  material: string;
  amount: number;
  unit: 'kg' | 'L';
  /** Concentration after any dilution, before the addition (g/L). */
  afterDilution: number;
};

export type CorrectionPlan = {
  decantL: number;
  dilutedFor: string | null;
  additions: PlannedAddition[];
  notes: string[];
};

function addFor(volumeL: number, c: ComponentState, from: number): PlannedAddition {
  const change = { volumeL, measured: from, target: c.target };
  const s = c.supply;
  if (s.kind === 'as_measured') {
    return { key: c.key, material: s.name, amount: additionAsMeasuredKg(change), unit: 'kg', afterDilution: from };
  }
  if (s.kind === 'salt_formula') {
    const w = metalFraction(s.formula, s.element);
    return { key: c.key, material: s.name, amount: saltAdditionKg({ ...change, metalFraction: w }), unit: 'kg', afterDilution: from };
  }
  const salt: Salt = requireSalt(s.saltId);
  if (s.kind === 'concentrate') {
    if (salt.kind !== 'liquid') throw badInput('supply', `${salt.name} is not a liquid concentrate.`);
    const amount = concentrateAdditionL({ ...change, contentGramsPerLitre: salt.contentGramsPerLitre });
    return { key: c.key, material: salt.name, amount, unit: 'L', afterDilution: from };
  }
  if (salt.kind !== 'solid' || !salt.metal) throw badInput('supply', `${salt.name} is not a solid salt of a plating metal.`);
  const amount = saltAdditionKg({ ...change, metalFraction: metalFraction(salt.formula, salt.metal) });
  return { key: c.key, material: salt.name, amount, unit: 'kg', afterDilution: from };
}

/**
 * Combined correction: decant and replace with water for the component furthest above its
 * target (or the one named), then add the others back to target from their diluted values.
 * Diluting for the largest measured/target ratio guarantees nothing is left above target.
 */
export function planCorrection(input: { volumeL: number; components: ComponentState[]; diluteFor?: string }): CorrectionPlan {
  const volumeL = requireNumber(input.volumeL, 'volumeL', 'Bath volume', { positive: true });
  if (!Array.isArray(input.components) || input.components.length === 0) {
    throw badInput('components', 'List at least one component to correct.');
  }
  const comps = input.components.map((c) => ({ ...c, ...readChange({ volumeL, measured: c.measured, target: c.target }) }));
  const keys = new Set(comps.map((c) => c.key));
  if (keys.size !== comps.length) throw badInput('components', 'Each component may appear only once.');

  let dilutedFor: ComponentState | null = null;
  if (input.diluteFor !== undefined) {
    dilutedFor = comps.find((c) => c.key === input.diluteFor) ?? null;
    if (!dilutedFor) throw badInput('diluteFor', `No component "${input.diluteFor}" to dilute for.`);
  } else {
    let worst = 1;
    for (const c of comps) {
      const ratio = c.target > 0 ? c.measured / c.target : c.measured > 0 ? Infinity : 0;
      if (ratio > worst) {
        worst = ratio;
        dilutedFor = c;
      }
    }
  }

  const notes: string[] = [];
  let decantL = 0;
  if (dilutedFor) {
    if (dilutedFor.target === 0) throw badInput('diluteFor', `${dilutedFor.name} has a target of zero: dilution cannot reach it.`);
    decantL = decantForDilutionL({ volumeL, measured: dilutedFor.measured, target: dilutedFor.target });
    if (decantL > 0) notes.push(`Decant ${decantL.toFixed(1)} L and make back up to ${volumeL} L with water first.`);
  }
  const kept = (volumeL - decantL) / volumeL;
  const additions = comps.map((c) => addFor(volumeL, c, c.measured * kept));
  for (const a of additions) {
    const c = comps.find((x) => x.key === a.key) as ComponentState;
    if (a.afterDilution > c.target) notes.push(`${c.name} stays above target (${a.afterDilution.toFixed(2)} g/L) after this dilution.`);
  }
  const solidsKg = additions.filter((a) => a.unit === 'kg').reduce((s, a) => s + a.amount, 0);
  // Bath mass taken as about 1 kg/L: the check only needs to catch large additions.
  if (solidsKg > 0.05 * volumeL) {
    notes.push('Solid additions exceed about 5 % of the bath mass: re-measure the volume after dissolving.');
  }
  return { decantL, dilutedFor: dilutedFor && decantL > 0 ? dilutedFor.key : null, additions, notes };
}
