// What to do about one out-of-range reading: how much of the named salt, concentrate or additive
// to add, or how much to decant and replace with water. Pure (runs on the floor device too, so the
// plater sees it before saving, even offline). The arithmetic is lib/bath/additions (reference §5).
import type { UnitSystem } from '../plating/units';
import { additionAsMeasuredKg, decantForDilutionL, planCorrection } from './additions';
import { roundForDisplay, toDisplay } from './display';
import { supplyMaterial, type AnalyteSupply } from './templates/supplies';
import type { VerdictStatus } from './verdict';

export type AdviceAnalyte = { key: string; name: string; unit: string; target: number; supply: AnalyteSupply | null };

export type Recommendation =
  | { kind: 'add'; material: string; amount: number; unit: 'kg' | 'L'; notes: string[] }
  | { kind: 'decant'; decantL: number; volumeL: number; notes: string[] }
  | { kind: 'none'; reason: string };

// Grams per litre in one stored unit; the calculator works in g/L (or mL/L for additives).
const TO_GRAMS_PER_LITRE: Record<string, number> = { 'g/L': 1, 'mg/L': 0.001 };
const DILUTABLE_UNITS = new Set(['g/L', 'mg/L', 'mL/L']);

export function recommendCorrection(input: {
  analyte: AdviceAnalyte;
  volumeL: number;
  measured: number;
  verdict: VerdictStatus;
}): Recommendation {
  const { analyte, volumeL, measured, verdict } = input;
  if (verdict !== 'out_of_range') return { kind: 'none', reason: 'No correction needed.' };
  if (measured > analyte.target) {
    if (!DILUTABLE_UNITS.has(analyte.unit)) {
      return { kind: 'none', reason: `${analyte.name} is high: adjust it as the supplier's data sheet describes.` };
    }
    const decantL = decantForDilutionL({ volumeL, measured, target: analyte.target });
    return {
      kind: 'decant',
      decantL,
      volumeL,
      notes: ['Dilution lowers every other component too: analyse them again and add back what is needed.'],
    };
  }
  const supply = analyte.supply;
  if (!supply) return { kind: 'none', reason: `No addition calculator for ${analyte.name}: follow the supplier's data sheet.` };
  if (supply.kind === 'additive') {
    if (analyte.unit !== 'mL/L') return { kind: 'none', reason: `${analyte.name} is not measured in mL/L, so no dose can be worked out.` };
    // (target − measured) mL/L × V L ÷ 1000 = L of additive.
    const amount = additionAsMeasuredKg({ volumeL, measured, target: analyte.target });
    return { kind: 'add', material: supply.name, amount, unit: 'L', notes: [] };
  }
  const scale = TO_GRAMS_PER_LITRE[analyte.unit];
  if (scale === undefined) return { kind: 'none', reason: `${analyte.name} is not a concentration, so no addition can be worked out.` };
  const plan = planCorrection({
    volumeL,
    components: [{ key: analyte.key, name: analyte.name, measured: measured * scale, target: analyte.target * scale, supply }],
  });
  const a = plan.additions[0];
  if (!a || a.amount <= 0) return { kind: 'none', reason: 'No correction needed.' };
  return { kind: 'add', material: a.material || supplyMaterial(supply), amount: a.amount, unit: a.unit, notes: plan.notes };
}

/** One line for the plater: "Add 71.65 kg of Nickel sulfate hexahydrate." in their unit system. */
export function describeRecommendation(rec: Recommendation, system: UnitSystem): string {
  if (rec.kind === 'none') return rec.reason;
  if (rec.kind === 'add') {
    const shown = toDisplay(rec.amount, rec.unit, system);
    return `Add ${roundForDisplay(shown.value)} ${shown.unit} of ${rec.material}.`;
  }
  const out = toDisplay(rec.decantL, 'L', system);
  const full = toDisplay(rec.volumeL, 'L', system);
  return `Decant ${roundForDisplay(out.value)} ${out.unit} and make back up to ${roundForDisplay(full.value)} ${full.unit} with water.`;
}

/** Reads a stored recommendation (jsonb) back; anything unrecognised reads as none. */
export function readRecommendation(value: unknown): Recommendation | null {
  if (!value || typeof value !== 'object') return null;
  const v = value as Record<string, unknown>;
  if (v.kind === 'add' && typeof v.amount === 'number' && (v.unit === 'kg' || v.unit === 'L') && typeof v.material === 'string') {
    return { kind: 'add', material: v.material, amount: v.amount, unit: v.unit, notes: Array.isArray(v.notes) ? (v.notes as string[]) : [] };
  }
  if (v.kind === 'decant' && typeof v.decantL === 'number' && typeof v.volumeL === 'number') {
    return { kind: 'decant', decantL: v.decantL, volumeL: v.volumeL, notes: Array.isArray(v.notes) ? (v.notes as string[]) : [] };
  }
  if (v.kind === 'none' && typeof v.reason === 'string') return { kind: 'none', reason: v.reason };
  return null;
}
