// An electroless bath's age in metal turnovers: the nickel put back since make-up over the nickel
// the bath held at make-up (common practice). Pure: the server sums the additions, this judges.
import type { AnalyteSupply } from '@/lib/bath/templates/supplies';
import { getSalt, saltMetalFraction } from '@/lib/chemistry/salts';
import { metalFraction } from '@/lib/chemistry/formula';
import { metalTurnoversFromReplenishment } from '@/lib/plating';
import { enTankSettings } from '.';

export type NickelAddition = { amount: number; unit: 'kg' | 'L'; supply: AnalyteSupply | null };

/** Grams of nickel an addition put in: a salt by its formula, a concentrate by its stated content. */
export function nickelGrams(a: NickelAddition): number {
  const s = a.supply;
  if (!s) return 0;
  if (s.kind === 'salt' || s.kind === 'concentrate') {
    const salt = getSalt(s.saltId);
    if (!salt || salt.metal !== 'Ni') return 0;
    if (salt.kind === 'solid') return a.unit === 'kg' ? a.amount * 1000 * saltMetalFraction(salt) : 0;
    if (a.unit !== 'L') return 0;
    return a.amount * (salt.contentBasis === 'metal' ? salt.contentGramsPerLitre : salt.contentGramsPerLitre * metalFraction(salt.formula, 'Ni'));
  }
  if (s.kind === 'salt_formula' && s.element === 'Ni' && a.unit === 'kg') return a.amount * 1000 * metalFraction(s.formula, 'Ni');
  return 0;
}

export type BathAge = { metalTurnovers: number; endOfLifeMto: number; atEndOfLife: boolean; text: string };

export function bathAge(input: { additions: readonly NickelAddition[]; volumeL: number; settings: Record<string, unknown> }): BathAge {
  const settings = enTankSettings(input.settings);
  const grams = input.additions.reduce((s, a) => s + nickelGrams(a), 0);
  const mto = metalTurnoversFromReplenishment({ nickelReplenishedG: grams, bathVolumeL: input.volumeL, nickelMakeUpGPerL: settings.nickelMakeUpGPerL });
  return {
    metalTurnovers: mto,
    endOfLifeMto: settings.endOfLifeMto,
    atEndOfLife: mto >= settings.endOfLifeMto,
    text: `${mto.toFixed(2)} of ${settings.endOfLifeMto} metal turnovers`,
  };
}
