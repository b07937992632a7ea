import { PlatingInputError } from './errors';
import { FormulaError, metalFraction } from '../chemistry/formula';
import {
  requireFraction,
  requireFiniteResults,
  requireNonNegative,
  requirePercent,
  requirePositive,
  requirePositiveInteger,
} from './validate';

// Estimator's practice: the shop-floor arithmetic around Faraday's law.

export type Loading = 'rack' | 'barrel';

// Thickness distribution is stated as a ratio r = minimum ÷ average, in (0, 1]: the thinnest
// significant surface gets r times the average. Time and metal scale with the average
// (reference §8). Defaults are common practice: rack 0.7 (average ≈ 1.43 × minimum) and barrel 0.5
// (average = 2 × minimum), inside the 1.2–2.5 average/minimum range the reference gives.
export const DISTRIBUTION_RATIO_DEFAULTS: Readonly<Record<Loading, number>> = Object.freeze({
  rack: 0.7, // common practice
  barrel: 0.5, // common practice
});

export function averageThicknessUm(minimumUm: number, distributionRatio: number): number {
  const min = requirePositive('minimumThicknessUm', 'Minimum thickness (µm)', minimumUm);
  const r = requireFraction('distributionRatio', 'Distribution ratio (minimum ÷ average)', distributionRatio);
  const average = min / r;
  // A vanishingly small ratio would divide to Infinity: refuse it here, where the division is.
  requireFiniteResults({ averageThicknessUm: average }, { minimumThicknessUm: min, distributionRatio: r });
  return average;
}

export type LoadPlanInput = {
  quantity: number;
  areaPerPartDm2: number;
  partsPerLoad: number; // rack or barrel capacity in parts
  rectifierMaxA: number;
  currentDensityAdm2: number;
};

export type LoadPlan = {
  partsPerLoad: number; // what one load can actually take
  limitedBy: 'capacity' | 'rectifier';
  loads: number;
  partsInLastLoad: number;
  currentPerLoadA: number; // for a full load
};

// A load holds as many parts as the rack or barrel takes, unless the rectifier cannot drive that
// much area at the chosen current density.
export function planLoads(input: LoadPlanInput): LoadPlan {
  const quantity = requirePositiveInteger('quantity', 'Quantity', input.quantity);
  const area = requirePositive('areaPerPartDm2', 'Area per part (dm²)', input.areaPerPartDm2);
  const capacity = requirePositiveInteger('partsPerLoad', 'Parts per load', input.partsPerLoad);
  const maxA = requirePositive('rectifierMaxA', 'Rectifier maximum current (A)', input.rectifierMaxA);
  const j = requirePositive('currentDensityAdm2', 'Current density (A/dm²)', input.currentDensityAdm2);

  const ampsPerPart = area * j;
  const byRectifier = Math.floor(maxA / ampsPerPart);
  if (!(byRectifier >= 1)) {
    throw new PlatingInputError(
      'rectifierMaxA',
      `One part needs ${ampsPerPart.toPrecision(3)} A at ${j} A/dm², more than the rectifier's ${maxA} A.`,
    );
  }
  const limitedBy = byRectifier < capacity ? 'rectifier' : 'capacity';
  const partsPerLoad = Math.min(capacity, byRectifier);
  const loads = Math.ceil(quantity / partsPerLoad);
  const plan = {
    partsPerLoad,
    limitedBy,
    loads,
    partsInLastLoad: quantity - (loads - 1) * partsPerLoad,
    currentPerLoadA: Math.min(partsPerLoad, quantity) * ampsPerPart,
  } as const;
  requireFiniteResults(
    { currentPerLoadA: plan.currentPerLoadA },
    { quantity, areaPerPartDm2: area, currentDensityAdm2: j },
  );
  return plan;
}

export type MetalUseInput = {
  depositMassG: number;
  areaDm2: number; // area carried out of the tank (drag-out is per area)
  dragOutLPerM2: number;
  bathMetalGPerL: number;
  anodeLossPercent?: number; // soluble anodes: stubs, sludge, bags; on top of what dissolves
};

export type MetalUse = { depositG: number; dragOutG: number; anodeLossG: number; totalG: number };

const DM2_PER_M2 = 100;

// Metal consumed = deposit + drag-out (L/m² × m² × g/L) + anode losses as a percentage of the two
// (reference §5 and §11).
export function metalConsumed(input: MetalUseInput): MetalUse {
  const depositG = requireNonNegative('depositMassG', 'Deposit mass (g)', input.depositMassG);
  const area = requirePositive('areaDm2', 'Area (dm²)', input.areaDm2);
  const dragOut = requireNonNegative('dragOutLPerM2', 'Drag-out (L/m²)', input.dragOutLPerM2);
  const bath = requireNonNegative('bathMetalGPerL', 'Bath metal (g/L)', input.bathMetalGPerL);
  const lossPct = requirePercent('anodeLossPercent', 'Anode loss (%)', input.anodeLossPercent ?? 0);

  const dragOutG = dragOut * (area / DM2_PER_M2) * bath;
  const anodeLossG = ((depositG + dragOutG) * lossPct) / 100;
  const use = { depositG, dragOutG, anodeLossG, totalG: depositG + dragOutG + anodeLossG };
  requireFiniteResults(use, {
    depositMassG: depositG,
    areaDm2: area,
    dragOutLPerM2: dragOut,
    bathMetalGPerL: bath,
  });
  return use;
}

// With insoluble anodes the metal comes from a salt: salt = metal ÷ w, w = M_metal/M_salt
// computed from IUPAC atomic weights (reference §5: NiSO₄·6H₂O is 22.33 % Ni).
export function saltForMetal(input: { metalG: number; saltFormula: string; element: string }): {
  saltG: number;
  metalFraction: number;
} {
  const metalG = requireNonNegative('metalG', 'Metal needed (g)', input.metalG);
  let fraction: number;
  try {
    fraction = metalFraction(input.saltFormula, input.element);
  } catch (err) {
    // One error type out of the engine: the chemistry module's message, named for its field.
    if (err instanceof FormulaError) throw new PlatingInputError(err.fieldErrors?.element ? 'element' : 'formula', err.message);
    throw err;
  }
  return { saltG: metalG / fraction, metalFraction: fraction };
}

export type EnergyInput = { tankVolts: number; ampHours: number; rectifierEfficiency: number };

// DC energy = V × A·h / 1000; drawn from the mains = DC ÷ rectifier efficiency (reference §11:
// 6 V × 1000 A·h at η 0.85 → 7.06 kWh).
export function energyKWh(input: EnergyInput): { dcKWh: number; acKWh: number } {
  const v = requirePositive('tankVolts', 'Tank voltage (V)', input.tankVolts);
  const ah = requirePositive('ampHours', 'Amp-hours', input.ampHours);
  const eta = requireFraction('rectifierEfficiency', 'Rectifier efficiency', input.rectifierEfficiency);
  const dcKWh = (v * ah) / 1000;
  const energy = { dcKWh, acKWh: dcKWh / eta };
  requireFiniteResults(energy, { tankVolts: v, ampHours: ah, rectifierEfficiency: eta });
  return energy;
}
