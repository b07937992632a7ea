import { PlatingInputError } from './errors';
import { plateCalc } from './faraday';
import { getMetal } from './metals';
import {
  averageThicknessUm,
  DISTRIBUTION_RATIO_DEFAULTS,
  energyKWh,
  metalConsumed,
  planLoads,
  saltForMetal,
  type Loading,
  type MetalUse,
} from './practice';
import { requireFiniteResults, requireFraction, requirePositive } from './validate';

// A whole job from the estimator's inputs: area, quantity, process and minimum thickness in;
// time, loads, metal and energy out, plus the same figures at a 5-point lower efficiency, since
// efficiency is the input an estimator is least sure of.

export const ESTIMATE_CAUTION =
  'Estimates only. Bath values are typical; the supplier data sheet, the safety data sheets, the ' +
  "customer's specification, local codes and licensed practice govern.";

const SENSITIVITY_STEP = 0.05;

export type JobProcess = {
  element: string;
  charge: number;
  currentDensityAdm2: number;
  efficiency: number; // cathode current efficiency, fraction in (0, 1]
  loading: Loading;
  distributionRatio?: number; // minimum ÷ average; defaults by loading (common practice)
  partsPerLoad: number;
  tankVolts: number;
  rectifierMaxA: number;
  rectifierEfficiency: number;
  dragOutLPerM2: number;
  bathMetalGPerL: number;
  anodes?: 'soluble' | 'insoluble'; // default soluble
  anodeLossPercent?: number; // soluble anodes only
  replenishmentSalt?: string; // insoluble anodes: the salt that supplies the metal, e.g. "CrO3"
};

export type JobInput = {
  areaPerPartDm2: number;
  quantity: number;
  minimumThicknessUm: number;
  process: JobProcess;
};

export type JobFigures = {
  efficiency: number;
  ampHoursPerLoad: number; // a full load
  ampHoursLot: number;
  minutesPerLoad: number;
  totalTankMinutes: number; // plating time only: loading, rinsing and unloading are extra
  metal: MetalUse;
  salt: { formula: string; grams: number; metalFraction: number } | null;
  energy: { dcKWh: number; acKWh: number };
};

export type JobEstimate = {
  metal: { key: string; name: string; ion: string };
  quantity: number;
  areaPerPartDm2: number;
  areaPerLotDm2: number;
  minimumThicknessUm: number;
  averageThicknessUm: number;
  distributionRatio: number;
  distributionRatioIsDefault: boolean;
  depositMassPerPartG: number;
  depositMassLotG: number;
  partsPerLoad: number;
  loadLimitedBy: 'capacity' | 'rectifier';
  loads: number;
  partsInLastLoad: number;
  currentPerLoadA: number;
  nominal: JobFigures;
  lowerEfficiency: JobFigures | null;
  lowerEfficiencyNote: string | null;
  cautions: string[];
};

function requireLoading(loading: unknown): Loading {
  if (loading !== 'rack' && loading !== 'barrel') {
    throw new PlatingInputError('loading', `Loading must be "rack" or "barrel"; got "${String(loading)}".`);
  }
  return loading;
}

function replenishment(formula: string | undefined, metalG: number, element: string): JobFigures['salt'] {
  if (!formula) return null;
  const { saltG, metalFraction } = saltForMetal({ metalG, saltFormula: formula, element });
  return { formula, grams: saltG, metalFraction };
}

export function estimateJob(input: JobInput): JobEstimate {
  const p = input.process;
  const metal = getMetal(p.element, p.charge);
  const loading = requireLoading(p.loading);
  const anodes = p.anodes ?? 'soluble';
  if (anodes !== 'soluble' && anodes !== 'insoluble') {
    throw new PlatingInputError('anodes', `Anodes must be "soluble" or "insoluble"; got "${String(anodes)}".`);
  }
  const efficiency = requireFraction('efficiency', 'Cathode current efficiency', p.efficiency);
  const distributionRatio = p.distributionRatio ?? DISTRIBUTION_RATIO_DEFAULTS[loading];
  const averageUm = averageThicknessUm(input.minimumThicknessUm, distributionRatio);
  const plan = planLoads({
    quantity: input.quantity,
    areaPerPartDm2: input.areaPerPartDm2,
    partsPerLoad: p.partsPerLoad,
    rectifierMaxA: p.rectifierMaxA,
    currentDensityAdm2: p.currentDensityAdm2,
  });
  const areaPerPartDm2 = input.areaPerPartDm2;
  const areaPerLotDm2 = areaPerPartDm2 * input.quantity;
  const loadAreaDm2 = Math.min(plan.partsPerLoad, input.quantity) * areaPerPartDm2;
  requireFiniteResults({ areaPerLotDm2 }, { areaPerPartDm2, quantity: input.quantity });
  requirePositive('tankVolts', 'Tank voltage (V)', p.tankVolts);
  requireFraction('rectifierEfficiency', 'Rectifier efficiency', p.rectifierEfficiency);

  const figuresAt = (eff: number): JobFigures => {
    const common = { element: p.element, charge: p.charge, thicknessUm: averageUm, efficiency: eff };
    const load = plateCalc({ ...common, areaDm2: loadAreaDm2, currentDensityAdm2: p.currentDensityAdm2 });
    const lot = plateCalc({ ...common, areaDm2: areaPerLotDm2, currentDensityAdm2: p.currentDensityAdm2 });
    const metalUse = metalConsumed({
      depositMassG: lot.depositMassG,
      areaDm2: areaPerLotDm2,
      dragOutLPerM2: p.dragOutLPerM2,
      bathMetalGPerL: p.bathMetalGPerL,
      // insoluble anodes do not dissolve, so there is no anode metal to lose
      anodeLossPercent: anodes === 'soluble' ? (p.anodeLossPercent ?? 0) : 0,
    });
    const salt =
      anodes === 'insoluble' ? replenishment(p.replenishmentSalt, metalUse.totalG, metal.element) : null;
    return {
      efficiency: eff,
      ampHoursPerLoad: load.ampHours,
      ampHoursLot: lot.ampHours,
      minutesPerLoad: load.minutes,
      totalTankMinutes: load.minutes * plan.loads,
      metal: metalUse,
      salt,
      energy: energyKWh({ tankVolts: p.tankVolts, ampHours: lot.ampHours, rectifierEfficiency: p.rectifierEfficiency }),
    };
  };

  const nominal = figuresAt(efficiency);
  // Rounded so 0.95 − 0.05 reads 0.9, not 0.8999999999999999.
  const lowerEff = Math.round((efficiency - SENSITIVITY_STEP) * 1e9) / 1e9;
  const lowerEfficiency = lowerEff > 0 ? figuresAt(lowerEff) : null;

  return {
    metal: { key: metal.key, name: metal.name, ion: metal.ion },
    quantity: input.quantity,
    areaPerPartDm2,
    areaPerLotDm2,
    minimumThicknessUm: input.minimumThicknessUm,
    averageThicknessUm: averageUm,
    distributionRatio,
    distributionRatioIsDefault: p.distributionRatio === undefined,
    depositMassPerPartG: nominal.metal.depositG / input.quantity,
    depositMassLotG: nominal.metal.depositG,
    partsPerLoad: plan.partsPerLoad,
    loadLimitedBy: plan.limitedBy,
    loads: plan.loads,
    partsInLastLoad: plan.partsInLastLoad,
    currentPerLoadA: plan.currentPerLoadA,
    nominal,
    lowerEfficiency,
    lowerEfficiencyNote:
      lowerEfficiency === null
        ? `No lower-efficiency row: ${efficiency} is already at or below ${SENSITIVITY_STEP}.`
        : null,
    cautions: [...(metal.caution ? [metal.caution] : []), ESTIMATE_CAUTION],
  };
}
