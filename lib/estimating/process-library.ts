// The workbench's process library: each finish the shop runs, completed with its tank's
// rectifier, bath metal and anodes (lib/quotes/process.ts), and the starting values of a free
// process for a metal the library does not list. Pure: the caller passes the rows.
import { PlatingInputError, type JobProcess, type Loading } from '@/lib/plating';
import type { Hazard } from '@/lib/bath/hazards';
import { BATH_TEMPLATES, templateHazards } from '@/lib/bath/templates';
import {
  bathMetalGPerL,
  DEFAULT_DRAG_OUT_L_PER_M2,
  DEFAULT_RECTIFIER_EFFICIENCY,
  processForFinish,
  type TankFacts,
} from '@/lib/quotes/process';
import { finishProcess } from '@/lib/quotes/pricing';

// Common practice: the finishes table's own default tank voltage.
export const DEFAULT_TANK_VOLTS = 6;
// Common practice (from memory): a mid-size job-shop rectifier, assumed when no tank is known.
export const DEFAULT_RECTIFIER_MAX_A = 1000;

// Salts commonly used to put metal back when the anodes do not dissolve (common practice, from
// memory); the bath supplier's data sheet names the right one for a given bath.
export const REPLENISHMENT_SALTS: Readonly<Record<string, string>> = {
  Ni: 'NiSO4·6H2O',
  Cu: 'CuSO4·5H2O',
  Zn: 'ZnO',
  Cr: 'CrO3',
  Sn: 'SnSO4',
  Ag: 'KAg(CN)2',
  Au: 'KAu(CN)2',
  Pd: 'Pd(NH3)4Cl2',
  Rh: 'Rh2(SO4)3',
};

export type LibraryProcess = {
  finishId: string;
  code: string;
  name: string;
  specText: string;
  minimumThicknessUm: number;
  process: JobProcess;
  tankCode: string | null;
  note: string | null;
  /** The hazards of the bath that runs it (its tank's template), for the workbench's cautions. */
  bathHazards: Hazard[];
};

export type FinishFacts = {
  id: string;
  code: string;
  name: string;
  specText: string;
  element: string;
  ionCharge: number;
  minThicknessUm: number;
  method: Loading;
  currentDensityAdm2: number;
  efficiency: number;
  distributionRatio: number;
  tankVolts: number;
  partsPerLoad: number;
  lineId: string | null;
};

export function libraryProcessFrom(finish: FinishFacts, tanks: readonly TankFacts[]): LibraryProcess {
  const base = finishProcess(finish);
  let tankCode: string | null = null;
  let note: string | null = null;
  let bathHazards: Hazard[] = [];
  let shop: Omit<JobProcess, keyof typeof base>;
  try {
    const resolved = processForFinish({ element: finish.element, ionCharge: finish.ionCharge, method: finish.method, lineId: finish.lineId }, tanks);
    tankCode = resolved.tankCode;
    shop = resolved.process;
    bathHazards = templateHazards(tanks.find((t) => t.id === resolved.tankId)?.templateId);
  } catch (e) {
    if (!(e instanceof PlatingInputError)) throw e;
    note = `${e.message} A ${DEFAULT_RECTIFIER_MAX_A} A rectifier is assumed here.`;
    shop = { ...freeShopDefaults(finish.element, finish.method), rectifierMaxA: DEFAULT_RECTIFIER_MAX_A };
  }
  const process: JobProcess = { ...base, ...shop };
  if (process.anodes === 'insoluble') process.replenishmentSalt = REPLENISHMENT_SALTS[finish.element];
  return {
    finishId: finish.id,
    code: finish.code,
    name: finish.name,
    specText: finish.specText,
    minimumThicknessUm: finish.minThicknessUm,
    process,
    tankCode,
    note,
    bathHazards,
  };
}

/** The first bath template that deposits this metal (not as an alloy): the bath a free process is figured from. */
function freeProcessTemplate(element: string, charge: number) {
  return BATH_TEMPLATES.find((t) => t.deposit?.element === element && t.deposit.charge === charge && !t.deposit.alloyWith);
}

/** The hazards of that bath. */
export function freeProcessHazards(element: string, charge: number): Hazard[] {
  return templateHazards(freeProcessTemplate(element, charge)?.id);
}

// Chromium is plated on insoluble (lead-alloy) anodes, its metal made up from chromic acid
// (reference, "Anode metal consumed": insoluble anodes for Cr).
const INSOLUBLE_ANODE_METALS: ReadonlySet<string> = new Set(['Cr']);

function freeShopDefaults(element: string, loading: Loading) {
  return {
    rectifierEfficiency: DEFAULT_RECTIFIER_EFFICIENCY,
    dragOutLPerM2: DEFAULT_DRAG_OUT_L_PER_M2[loading],
    bathMetalGPerL: 0,
    anodes: INSOLUBLE_ANODE_METALS.has(element) ? ('insoluble' as const) : ('soluble' as const),
    anodeLossPercent: 0,
    replenishmentSalt: REPLENISHMENT_SALTS[element],
  };
}

/**
 * A free process for a metal and ion: typical efficiency, current density and bath metal from the
 * first bath template that deposits it (lib/bath/templates, sources there), else plain defaults.
 */
export function freeProcessFor(element: string, charge: number, loading: Loading = 'rack'): JobProcess {
  const template = freeProcessTemplate(element, charge);
  const cd = template?.currentDensityAdm2;
  // Without a template, 90 % is only a starting value for the estimator to overwrite (common practice).
  const efficiency = template?.efficiencyPercent ? template.efficiencyPercent.typical / 100 : 0.9;
  return {
    element,
    charge,
    currentDensityAdm2: cd ? Math.round(((cd.low + cd.high) / 2) * 10) / 10 : 2,
    efficiency,
    loading,
    partsPerLoad: loading === 'rack' ? 40 : 1000,
    tankVolts: DEFAULT_TANK_VOLTS,
    rectifierMaxA: DEFAULT_RECTIFIER_MAX_A,
    ...freeShopDefaults(element, loading),
    bathMetalGPerL: template ? bathMetalGPerL(template.id, element) : 0,
  };
}
