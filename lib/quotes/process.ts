// What the shop's own tanks add to a finish when a job is priced: which tank runs it, how much
// current its rectifier gives, what the bath holds, and the practice figures no record carries.
// Pure: the caller passes the tanks.
import { metalFraction } from '@/lib/chemistry/formula';
import { getTemplate } from '@/lib/bath/templates';
import type { ProcessFamilyId } from '@/db/types';
import { familyOfTemplate, familyParams, getFamily } from '@/lib/families';
import { PlatingInputError } from '@/lib/plating';
import type { ShopProcess } from './pricing';

// Common practice (reference §11, from memory): rectifiers run at about 75–95 % efficiency;
// 0.85 is the reference's worked example.
export const DEFAULT_RECTIFIER_EFFICIENCY = 0.85;

// Common practice (reference §5, from memory): well-drained rack work carries out about
// 0.02–0.05 L/m², barrel work about 0.2–1 L/m². The low end of each is assumed.
export const DEFAULT_DRAG_OUT_L_PER_M2 = { rack: 0.05, barrel: 0.2 } as const;

export type TankFacts = {
  id: string;
  code: string;
  lineId: string;
  templateId: string;
  element: string | null;
  ionCharge: number | null;
  efficiency: number | null;
  rectifierMaxA: number | null;
  anodeType: 'soluble' | 'insoluble' | 'none';
  isActive: boolean;
  volumeL: number;
  familySettings: Record<string, unknown>;
};

export type FinishFacts = {
  family?: ProcessFamilyId;
  familyParams?: unknown;
  element: string;
  ionCharge: number;
  method: 'rack' | 'barrel';
  lineId: string | null;
};

// Bath analytes that hold the metal itself, or a salt of it (converted with its metal fraction).
const METAL_ANALYTE: Record<string, string> = { Ni: 'nickel', Zn: 'zinc', Sn: 'tin', Ag: 'silver', Au: 'gold', Cu: 'copper', Cr: 'chromium' };
const SALT_ANALYTE: Record<string, { key: string; formula: string }> = {
  Cu: { key: 'copperSulfate', formula: 'CuSO4·5H2O' },
  Cr: { key: 'chromicAcid', formula: 'CrO3' },
};

/** The bath's target metal content from its template, in g/L; 0 when the template says nothing. */
export function bathMetalGPerL(templateId: string, element: string): number {
  const template = getTemplate(templateId);
  if (!template) return 0;
  const metal = template.analytes.find((a) => a.key === METAL_ANALYTE[element] && a.unit === 'g/L');
  if (metal) return metal.target;
  const salt = SALT_ANALYTE[element];
  const saltRow = salt ? template.analytes.find((a) => a.key === salt.key && a.unit === 'g/L') : undefined;
  // To 0.1 g/L, as a bath is made up and analysed: 250 g/L CrO3 is 130 g/L chromium, not 129.9986.
  return salt && saltRow ? Math.round(saltRow.target * metalFraction(salt.formula, element) * 10) / 10 : 0;
}

/** Active tanks that can run the finish (its family decides), those on the finish's own line first. */
export function tanksForFinish<T extends TankFacts>(finish: FinishFacts, tanks: readonly T[]): T[] {
  const family = getFamily(finish.family);
  const params = familyParams(family.id, finish.familyParams);
  return tanks
    .filter((t) => t.isActive && familyOfTemplate(t.templateId) === family.id && family.tankServes(t, { element: finish.element, ionCharge: finish.ionCharge, params }))
    .sort((a, b) => Number(b.lineId === finish.lineId) - Number(a.lineId === finish.lineId) || a.code.localeCompare(b.code));
}

export type ResolvedProcess = { process: ShopProcess; tankId: string; tankCode: string };

export function processForFinish(finish: FinishFacts, tanks: readonly TankFacts[]): ResolvedProcess {
  const family = getFamily(finish.family);
  const tank = tanksForFinish(finish, tanks).find((t) => !family.runsWithCurrent || t.rectifierMaxA !== null);
  if (!tank) {
    const what = family.metal ? `${family.label.toLowerCase()} for this finish` : `${finish.element} for this finish`;
    throw new PlatingInputError('finish', `No active tank${family.runsWithCurrent ? ' with a rectifier' : ''} runs ${what}. Add or activate one before pricing.`);
  }
  return {
    tankId: tank.id,
    tankCode: tank.code,
    process: {
      tank: { volumeL: tank.volumeL, settings: tank.familySettings },
      rectifierMaxA: tank.rectifierMaxA ?? 0,
      rectifierEfficiency: DEFAULT_RECTIFIER_EFFICIENCY,
      dragOutLPerM2: DEFAULT_DRAG_OUT_L_PER_M2[finish.method],
      bathMetalGPerL: bathMetalGPerL(tank.templateId, finish.element),
      // No anode-loss allowance: the shop has not recorded one.
      anodeLossPercent: 0,
      anodes: tank.anodeType === 'insoluble' ? 'insoluble' : 'soluble',
    },
  };
}
