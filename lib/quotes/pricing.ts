// A quote line's price, built up cost by cost from the engine's job estimate. Pure.
//
// Rounding rule (applied everywhere, stated once): each cost component is computed exactly and
// rounded half-up to whole cents; the subtotal is the sum of the rounded components; margin and
// the rush uplift are computed from whole-cent figures and rounded half-up to whole cents; unit
// prices (per piece, per basis) are the line total divided out and rounded half-up to 4 decimal
// places of a cent. A value within a millionth of a cent below a half counts as the half, so
// binary floating-point noise cannot flip a rounding.
import { estimateJob, PlatingInputError, type CorrosivityCategory, type JobEstimate, type JobProcess } from '@/lib/plating';
import type { PricingBasis, ProcessFamilyId } from '@/db/types';
import { basisQuantity, roundUnitCents, unitPriceCents, type BasisFacts } from './basis';
import { bakeDecision, type BakeDecision } from './bake-rule';

export type PricedPart = {
  areaDm2: number;
  weightG: number | null;
  hardnessHrc: number | null;
  tensileMpa: number | null;
  /** The environment the customer states (ISO 9223), and the life asked for, where given. */
  corrosivityCategory?: CorrosivityCategory | null;
  designLifeYears?: number | null;
  /** ± on a finished diameter, µm, from the drawing. */
  sizeToleranceUm?: number | null;
};

export type PricedFinish = {
  family?: ProcessFamilyId;
  /** The family's own figures for the finish (validated by the family's schema). */
  familyParams?: Record<string, unknown>;
  element: string;
  ionCharge: number;
  minThicknessUm: number;
  method: 'rack' | 'barrel';
  /** Electroplating and anodizing; 0 where the family runs without current. */
  currentDensityAdm2: number;
  /** Electroplating only; 1 elsewhere (no cathode efficiency applies). */
  efficiency: number;
  distributionRatio: number;
  tankVolts: number;
  partsPerLoad: number;
  handlingMinutesPerLoad: number;
  maskingPerPieceCents: number;
  bakeRequired: boolean;
  bakeThresholdHrc: number | null;
};

/** What the shop's tank and practice add to the finish (see process.ts for where each comes from). */
export type ShopProcess = {
  /** The tank's volume and its family's own settings (make-up nickel, end of life …). */
  tank?: { volumeL: number; settings: Record<string, unknown> };
  rectifierMaxA: number;
  rectifierEfficiency: number;
  dragOutLPerM2: number;
  bathMetalGPerL: number;
  anodeLossPercent: number;
  anodes: 'soluble' | 'insoluble';
};

export type PricingRates = {
  labourPerHourCents: number;
  tankHourRackCents: number;
  tankHourBarrelCents: number;
  metalPerKgCents: Record<string, number>;
  additivesPerKahCents: number;
  powerPerKwhCents: number;
  bakePerLoadCents: number;
  lotChargeCents: number;
  minimumChargeCents: number;
  rushMultiplierPct: number;
  marginPct: number;
};

export type PricingInput = {
  /** The shop's own data for the finish's family (lib/families/shop-data), e.g. its passivation windows. */
  familyData?: Record<string, unknown>;
  part: PricedPart;
  finish: PricedFinish;
  process: ShopProcess;
  rates: PricingRates;
  quantity: number;
  isRush: boolean;
  basis: PricingBasis;
};

export type CostKey = 'metal' | 'additives' | 'power' | 'labour' | 'tankTime' | 'masking' | 'bake' | 'bathLife';

/** One row of the build-up: quantity × rate = cents. */
export type CostComponent = { key: CostKey; label: string; quantity: number; unit: string; rateCents: number; exactCents: number; cents: number };

export type JobSummary = {
  loads: number;
  partsPerLoad: number;
  loadLimitedBy: 'capacity' | 'rectifier';
  averageThicknessUm: number;
  minimumThicknessUm: number;
  distributionRatio: number;
  ampHours: number;
  minutesPerLoad: number;
  tankHours: number;
  labourHours: number;
  metalKg: number;
  acKWh: number;
  areaPerLotDm2: number;
};

export type LinePrice = {
  components: CostComponent[];
  subtotalCents: number;
  marginPct: number;
  marginCents: number;
  lotChargeCents: number;
  beforeMinimumCents: number;
  minimumChargeCents: number;
  minimumApplied: boolean;
  rushMultiplierPct: number;
  rushCents: number;
  totalCents: number;
  perPieceCents: number;
  basis: PricingBasis;
  basisQuantity: number;
  unitPriceCents: number;
  bake: BakeDecision;
  job: JobSummary;
  cautions: string[];
  /** The process family that priced the line (absent on lines priced before families existed). */
  family?: ProcessFamilyId;
  /** The family's own figures, in storage units, for the quote and the workbench to show. */
  figures?: FamilyFigure[];
};

/** One figure a family shows beside the price: a value in storage units and its quantity for display. */
export type FamilyFigure = {
  key: string;
  label: string;
  value: number | string;
  /** A physical quantity shown in the reader's unit system (lib/plating/units). */
  quantity?: 'thickness' | 'area' | 'currentDensity' | 'temperature' | 'volume' | 'mass';
  /** A unit shown as it is (min, A, A·h, %, MTO …). */
  unit?: string;
  /** A quantity per hour (a deposition rate): shown in the reader's unit with "/h". */
  perHour?: boolean;
  /** Decimal places for a counted unit; a quantity follows the unit module's own precision. */
  digits?: number;
  /** A plain-words warning when the figure crosses a limit. */
  warning?: string;
};

/** The engine's process fields a finish fixes; the shop's tank supplies the rest (ShopProcess). */
export function finishProcess(finish: Pick<PricedFinish, 'element' | 'ionCharge' | 'method' | 'currentDensityAdm2' | 'efficiency' | 'distributionRatio' | 'partsPerLoad' | 'tankVolts'>) {
  return {
    element: finish.element,
    charge: finish.ionCharge,
    currentDensityAdm2: finish.currentDensityAdm2,
    efficiency: finish.efficiency,
    loading: finish.method,
    distributionRatio: finish.distributionRatio,
    partsPerLoad: finish.partsPerLoad,
    tankVolts: finish.tankVolts,
  } satisfies Partial<JobProcess>;
}

/** Half-up to whole cents (see the rounding rule above). */
export function roundCents(exact: number): number {
  if (!Number.isFinite(exact) || exact < 0) throw new PlatingInputError('cost', `A cost must be a finite amount of at least zero; got ${exact}.`);
  const cents = Math.floor(exact + 0.5 + 1e-6);
  if (!Number.isSafeInteger(cents)) throw new PlatingInputError('cost', 'The amount is too large to price; check the quantity and rates.');
  return cents;
}

/** A whole-cent amount times a whole percentage, rounded half-up, in integer arithmetic. */
export function percentOf(cents: number, pct: number): number {
  return Math.floor((cents * pct + 50) / 100);
}

function requireCents(field: string, label: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 0) {
    throw new PlatingInputError(field, `${label} must be a whole number of cents, at least 0; got ${String(value)}.`);
  }
  return value;
}

function requirePct(field: string, label: string, value: unknown, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new PlatingInputError(field, `${label} must be a whole percentage from ${min} to ${max}; got ${String(value)}.`);
  }
  return value;
}

/** The rates every family's price uses, checked once. */
export function checkRates(r: PricingRates): void {
  for (const [field, label] of [
    ['labourPerHourCents', 'Labour rate'],
    ['tankHourRackCents', 'Rack tank-hour rate'],
    ['tankHourBarrelCents', 'Barrel tank-hour rate'],
    ['additivesPerKahCents', 'Salts and additives rate'],
    ['powerPerKwhCents', 'Power price'],
    ['bakePerLoadCents', 'Bake charge'],
    ['lotChargeCents', 'Lot charge'],
    ['minimumChargeCents', 'Minimum charge'],
  ] as const) {
    requireCents(field, label, r[field]);
  }
  requirePct('marginPct', 'Margin', r.marginPct, 0, 500);
  requirePct('rushMultiplierPct', 'Rush multiplier', r.rushMultiplierPct, 100, 500);
}

/** The rate set's price of a metal per kg; a family that consumes metal cannot be priced without it. */
export function metalRate(r: PricingRates, element: string): number {
  const metal = r.metalPerKgCents[element];
  if (metal === undefined) {
    throw new PlatingInputError('metalPerKgCents', `The rate set has no metal price for ${element}. Add one under Rates before pricing this finish.`);
  }
  return requireCents('metalPerKgCents', `Metal price for ${element}`, metal);
}

/** The finish's own charges, checked the same way for every family. */
export function checkFinishCharges(finish: Pick<PricedFinish, 'maskingPerPieceCents' | 'handlingMinutesPerLoad'>): void {
  requireCents('maskingPerPieceCents', 'Masking charge', finish.maskingPerPieceCents);
  if (!(finish.handlingMinutesPerLoad >= 0) || !Number.isFinite(finish.handlingMinutesPerLoad)) {
    throw new PlatingInputError('handlingMinutesPerLoad', 'Handling minutes per load must be a finite number of at least 0.');
  }
}

export function bakeFor(input: PricingInput): BakeDecision {
  const { part, finish } = input;
  return bakeDecision({ finishRequiresBake: finish.bakeRequired, finishThresholdHrc: finish.bakeThresholdHrc, hardnessHrc: part.hardnessHrc, tensileMpa: part.tensileMpa });
}

/** Labour, tank time, masking and bake: the costs every family has, from its loads and tank time. */
export function commonComponents(input: PricingInput, job: { loads: number; tankHours: number }, bake: BakeDecision): CostComponent[] {
  const { finish, rates } = input;
  const labourHours = (job.loads * finish.handlingMinutesPerLoad) / 60;
  const tankRate = finish.method === 'rack' ? rates.tankHourRackCents : rates.tankHourBarrelCents;
  return [
    costComponent('labour', 'Labour (loads × handling minutes)', labourHours, 'h', rates.labourPerHourCents),
    costComponent('tankTime', `Tank time (${finish.method})`, job.tankHours, 'tank-h', tankRate),
    costComponent('masking', 'Masking', input.quantity, 'pc', finish.maskingPerPieceCents),
    costComponent('bake', 'Relief bake', bake.applies ? job.loads : 0, 'load', rates.bakePerLoadCents),
  ];
}

/** From the cost components to the price: margin, lot charge, minimum, rush and the unit price. */
export function assembleLinePrice(
  input: PricingInput,
  parts: { components: CostComponent[]; bake: BakeDecision; job: JobSummary; cautions: string[]; family: ProcessFamilyId; figures: FamilyFigure[] },
): LinePrice {
  const { rates } = input;
  const subtotalCents = parts.components.reduce((s, c) => s + c.cents, 0);
  const marginCents = percentOf(subtotalCents, rates.marginPct);
  const beforeMinimumCents = subtotalCents + marginCents + rates.lotChargeCents;
  const minimumApplied = beforeMinimumCents < rates.minimumChargeCents;
  const afterMinimum = minimumApplied ? rates.minimumChargeCents : beforeMinimumCents;
  const rushMultiplierPct = input.isRush ? rates.rushMultiplierPct : 100;
  const rushCents = percentOf(afterMinimum, rushMultiplierPct - 100);
  const totalCents = afterMinimum + rushCents;
  if (!Number.isSafeInteger(totalCents)) throw new PlatingInputError('quantity', 'The line total is too large to price; check the quantity and rates.');
  const facts: BasisFacts = { quantity: input.quantity, areaPerPartDm2: input.part.areaDm2, weightPerPartG: input.part.weightG, loads: parts.job.loads };
  return {
    components: parts.components,
    subtotalCents,
    marginPct: rates.marginPct,
    marginCents,
    lotChargeCents: rates.lotChargeCents,
    beforeMinimumCents,
    minimumChargeCents: rates.minimumChargeCents,
    minimumApplied,
    rushMultiplierPct,
    rushCents,
    totalCents,
    perPieceCents: roundUnitCents(totalCents / input.quantity),
    basis: input.basis,
    basisQuantity: basisQuantity(input.basis, facts),
    unitPriceCents: unitPriceCents(totalCents, input.basis, facts),
    bake: parts.bake,
    job: parts.job,
    cautions: parts.cautions,
    family: parts.family,
    figures: parts.figures,
  };
}

function estimateFor(input: PricingInput): JobEstimate {
  const { part, finish, process } = input;
  return estimateJob({
    areaPerPartDm2: part.areaDm2,
    quantity: input.quantity,
    minimumThicknessUm: finish.minThicknessUm,
    process: { ...finishProcess(finish), ...process },
  });
}

export function costComponent(key: CostKey, label: string, quantity: number, unit: string, rateCents: number): CostComponent {
  const exactCents = quantity * rateCents;
  return { key, label, quantity, unit, rateCents, exactCents, cents: roundCents(exactCents) };
}

/**
 * An electroplated line's price: Faraday's law through the engine's job estimate. Other families
 * price through their own module (lib/families); priceFinishLine there picks the family.
 */
export function priceLine(input: PricingInput, figures: FamilyFigure[] = []): LinePrice {
  const { finish, rates } = input;
  checkRates(rates);
  const metal = metalRate(rates, finish.element);
  checkFinishCharges(finish);
  const e = estimateFor(input);
  const n = e.nominal;
  const bake = bakeFor(input);
  const tankHours = n.totalTankMinutes / 60;
  const components: CostComponent[] = [
    costComponent('metal', 'Metal', n.metal.totalG / 1000, 'kg', metal),
    costComponent('additives', 'Salts and additives', n.ampHoursLot / 1000, 'kA·h', rates.additivesPerKahCents),
    costComponent('power', 'Power', n.energy.acKWh, 'kWh', rates.powerPerKwhCents),
    ...commonComponents(input, { loads: e.loads, tankHours }, bake),
  ];
  return assembleLinePrice(input, {
    components,
    bake,
    family: 'electroplating',
    figures,
    cautions: e.cautions,
    job: {
      loads: e.loads,
      partsPerLoad: e.partsPerLoad,
      loadLimitedBy: e.loadLimitedBy,
      averageThicknessUm: e.averageThicknessUm,
      minimumThicknessUm: e.minimumThicknessUm,
      distributionRatio: e.distributionRatio,
      ampHours: n.ampHoursLot,
      minutesPerLoad: n.minutesPerLoad,
      tankHours,
      labourHours: (e.loads * finish.handlingMinutesPerLoad) / 60,
      metalKg: n.metal.totalG / 1000,
      acKWh: n.energy.acKWh,
      areaPerLotDm2: e.areaPerLotDm2,
    },
  });
}
