// A plating run as the plater logs it at the tank: amp-hours from the rectifier or the meter, and
// the thickness the engine predicts from them. Pure, so the phone can show the verdict before
// saving and the server can check it again.
import { PlatingInputError, thicknessFromCharge } from '@/lib/plating';

export type RunCharge =
  | { mode: 'amps'; currentA: number; minutesPerLoad: number; loads: number }
  | { mode: 'meter'; meterStartAh: number; meterStopAh: number; minutesPerLoad: number; loads: number };

const MAX_MINUTES_PER_LOAD = 24 * 60;

function positive(field: string, label: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) throw new PlatingInputError(field, `${label} must be a number greater than 0.`);
  return v;
}

export function wholePositive(field: string, label: string, v: unknown, max: number): number {
  if (typeof v !== 'number' || !Number.isInteger(v) || v < 1 || v > max) throw new PlatingInputError(field, `${label} must be a whole number from 1 to ${max}.`);
  return v;
}

/** Minutes per load, checked: above 0 and at most a day. */
export function runMinutes(value: unknown): number {
  const minutes = positive('minutesPerLoad', 'Minutes per load', value);
  if (minutes > MAX_MINUTES_PER_LOAD) throw new PlatingInputError('minutesPerLoad', 'Minutes per load must be at most 1440 (one day).');
  return minutes;
}

/** Amp-hours of the whole run: amps × minutes per load × loads, or meter stop − start. */
export function runAmpHours(c: RunCharge): number {
  const minutes = runMinutes(c.minutesPerLoad);
  const loads = wholePositive('loads', 'Loads', c.loads, 1000);
  if (c.mode === 'amps') return (positive('currentA', 'Rectifier current', c.currentA) * minutes * loads) / 60;
  if (typeof c.meterStartAh !== 'number' || !Number.isFinite(c.meterStartAh) || c.meterStartAh < 0) {
    throw new PlatingInputError('meterStartAh', 'The meter reading at the start must be a number of at least 0.');
  }
  const stop = positive('meterStopAh', 'The meter reading at the end', c.meterStopAh);
  if (!(stop > c.meterStartAh)) throw new PlatingInputError('meterStopAh', 'The meter reading at the end must be higher than at the start.');
  return stop - c.meterStartAh;
}

export type RunPredictionInput = {
  ampHours: number;
  loads: number;
  partsPerLoad: number;
  areaPerPartDm2: number;
  element: string;
  ionCharge: number;
  /** The tank's cathode current efficiency, fraction in (0, 1]. */
  tankEfficiency: number;
  /** The finish's minimum ÷ average thickness on significant surfaces. */
  distributionRatio: number;
  minThicknessUm: number;
};

export type RunPrediction = {
  platedAreaDm2: number;
  averageThicknessUm: number;
  /** Expected on the thinnest significant surface: average × distribution ratio. */
  minimumThicknessUm: number;
  requiredMinimumUm: number;
  isBelowMinimum: boolean;
  depositMassG: number;
};

export function predictRun(input: RunPredictionInput): RunPrediction {
  const parts = wholePositive('partsPerLoad', 'Parts per load', input.partsPerLoad, 1_000_000);
  const loads = wholePositive('loads', 'Loads', input.loads, 1000);
  const area = positive('areaPerPartDm2', 'Area per part', input.areaPerPartDm2);
  const ratio = input.distributionRatio;
  if (!(ratio > 0 && ratio <= 1)) throw new PlatingInputError('distributionRatio', 'The distribution ratio must be greater than 0 and at most 1.');
  const platedAreaDm2 = loads * parts * area;
  const r = thicknessFromCharge({ element: input.element, charge: input.ionCharge, areaDm2: platedAreaDm2, ampHours: input.ampHours, efficiency: input.tankEfficiency });
  const minimumThicknessUm = r.thicknessUm * ratio;
  return {
    platedAreaDm2,
    averageThicknessUm: r.thicknessUm,
    minimumThicknessUm,
    requiredMinimumUm: input.minThicknessUm,
    isBelowMinimum: minimumThicknessUm < input.minThicknessUm,
    depositMassG: r.depositMassG,
  };
}

/** Current density the run actually used: amps over one load's area. */
export function runCurrentDensity(currentA: number, partsPerLoad: number, areaPerPartDm2: number): number | null {
  const area = partsPerLoad * areaPerPartDm2;
  return currentA > 0 && area > 0 ? currentA / area : null;
}
