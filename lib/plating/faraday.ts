import { CM2_PER_DM2, CM_PER_UM, FARADAY_C_PER_MOL, SECONDS_PER_HOUR } from './constants';
import { PlatingInputError } from './errors';
import { getMetal, type PlatingMetal } from './metals';
import { requireFiniteResults, requireFraction, requirePositive } from './validate';

// Faraday's law as used in plating (reference §1.1):
//   mass (g) = A·h × ECE × CE,  ECE = M·3600/(n·F) in g/(A·h)
//   thickness (µm) = mass / (ρ × area)

// What Faraday's law needs to know about a deposit: a pure metal or an alloy.
export type Deposit = {
  readonly label: string;
  readonly eceGPerAh: number;
  readonly densityGPerCm3: number;
};

export function electrochemicalEquivalent(
  metal: Pick<PlatingMetal, 'molarMassGPerMol' | 'electrons'>,
): number {
  return (metal.molarMassGPerMol * SECONDS_PER_HOUR) / (metal.electrons * FARADAY_C_PER_MOL);
}

// µm/h at 1 A/dm² and 100 % current efficiency: 100·ECE/ρ (reference §1.1).
export function depositRateUmPerHour(
  metal: Pick<PlatingMetal, 'molarMassGPerMol' | 'electrons' | 'densityGPerCm3'>,
): number {
  return rateFromEce(electrochemicalEquivalent(metal), metal.densityGPerCm3);
}

function rateFromEce(eceGPerAh: number, densityGPerCm3: number): number {
  return eceGPerAh / (densityGPerCm3 * CM2_PER_DM2 * CM_PER_UM);
}

export function depositOfMetal(metal: PlatingMetal): Deposit {
  return {
    label: metal.name,
    eceGPerAh: electrochemicalEquivalent(metal),
    densityGPerCm3: metal.densityGPerCm3,
  };
}

export type AlloyComponent = { element: string; charge: number; massFraction: number };

const FRACTION_SUM_TOLERANCE = 1e-6;

function resolveAlloy(components: readonly AlloyComponent[]) {
  if (!Array.isArray(components) || components.length === 0) {
    throw new PlatingInputError('components', 'An alloy needs at least one component.');
  }
  const resolved = components.map((c, i) => ({
    metal: getMetal(c.element, c.charge),
    w: requireFraction(`components.${i}.massFraction`, 'Mass fraction', c.massFraction),
  }));
  const sum = resolved.reduce((s, c) => s + c.w, 0);
  if (Math.abs(sum - 1) > FRACTION_SUM_TOLERANCE) {
    throw new PlatingInputError(
      'components',
      `The mass fractions of an alloy must add up to 1; these add up to ${sum}.`,
    );
  }
  return resolved;
}

// ECE of an alloy deposit: 3600/F ÷ Σ(wᵢ·nᵢ/Mᵢ), wᵢ = mass fractions (reference §1.3).
export function alloyElectrochemicalEquivalent(components: readonly AlloyComponent[]): number {
  const molesOfElectronsPerGram = resolveAlloy(components).reduce(
    (s, { metal, w }) => s + (w * metal.electrons) / metal.molarMassGPerMol,
    0,
  );
  return SECONDS_PER_HOUR / FARADAY_C_PER_MOL / molesOfElectronsPerGram;
}

// Rule-of-mixtures density 1/Σ(wᵢ/ρᵢ): an approximation, since real alloy phases differ slightly
// (reference §1.3).
export function alloyDensity(components: readonly AlloyComponent[]): number {
  return 1 / resolveAlloy(components).reduce((s, { metal, w }) => s + w / metal.densityGPerCm3, 0);
}

export function alloyDeposit(components: readonly AlloyComponent[]): Deposit {
  const label = resolveAlloy(components)
    .map(({ metal, w }) => `${(w * 100).toPrecision(3)} % ${metal.element}`)
    .join(' / ');
  return {
    label: `Alloy ${label}`,
    eceGPerAh: alloyElectrochemicalEquivalent(components),
    densityGPerCm3: alloyDensity(components),
  };
}

export function depositRateForDeposit(deposit: Deposit): number {
  return rateFromEce(deposit.eceGPerAh, deposit.densityGPerCm3);
}

export type PlateParams = {
  areaDm2: number;
  thicknessUm: number;
  efficiency: number;
  currentDensityAdm2: number;
};

export type PlateResult = {
  ampHours: number;
  currentA: number;
  minutes: number;
  depositMassG: number;
};

// Mass of a deposit of given thickness: µm → cm, dm² → cm², × ρ.
function massForThickness(deposit: Deposit, thicknessUm: number, areaDm2: number): number {
  return thicknessUm * CM_PER_UM * areaDm2 * CM2_PER_DM2 * deposit.densityGPerCm3;
}

export function plateCalcFor(deposit: Deposit, params: PlateParams): PlateResult {
  const areaDm2 = requirePositive('areaDm2', 'Area (dm²)', params.areaDm2);
  const thicknessUm = requirePositive('thicknessUm', 'Thickness (µm)', params.thicknessUm);
  const efficiency = requireFraction('efficiency', 'Cathode current efficiency', params.efficiency);
  const currentDensityAdm2 = requirePositive(
    'currentDensityAdm2',
    'Current density (A/dm²)',
    params.currentDensityAdm2,
  );

  const depositMassG = massForThickness(deposit, thicknessUm, areaDm2);
  const ampHours = depositMassG / (deposit.eceGPerAh * efficiency);
  const currentA = currentDensityAdm2 * areaDm2;
  const minutes = (ampHours / currentA) * 60;
  const result = { ampHours, currentA, minutes, depositMassG };
  requireFiniteResults(result, { areaDm2, thicknessUm, efficiency, currentDensityAdm2 });
  return result;
}

export function plateCalc(
  params: PlateParams & { element: string; charge: number },
): PlateResult {
  return plateCalcFor(depositOfMetal(getMetal(params.element, params.charge)), params);
}

export type ChargeParams = { areaDm2: number; ampHours: number; efficiency: number };
export type ChargeResult = { thicknessUm: number; depositMassG: number };

export function thicknessFromChargeFor(deposit: Deposit, params: ChargeParams): ChargeResult {
  const areaDm2 = requirePositive('areaDm2', 'Area (dm²)', params.areaDm2);
  const ampHours = requirePositive('ampHours', 'Amp-hours', params.ampHours);
  const efficiency = requireFraction('efficiency', 'Cathode current efficiency', params.efficiency);

  const depositMassG = ampHours * deposit.eceGPerAh * efficiency;
  const thicknessUm =
    depositMassG / (deposit.densityGPerCm3 * areaDm2 * CM2_PER_DM2) / CM_PER_UM;
  const result = { thicknessUm, depositMassG };
  requireFiniteResults(result, { areaDm2, ampHours, efficiency });
  return result;
}

export function thicknessFromCharge(
  params: ChargeParams & { element: string; charge: number },
): ChargeResult {
  return thicknessFromChargeFor(depositOfMetal(getMetal(params.element, params.charge)), params);
}
