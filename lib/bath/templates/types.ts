// Shapes and shared constants for bath templates (kept apart from the data to avoid import cycles).
import type { ElementSymbol } from '../../chemistry/atomic-weights';
import type { Hazard } from '../hazards';

export const TEMPLATE_NOTE = "Typical values; the supplier's data sheet governs." as const;

export type Analyte = {
  key: string;
  name: string;
  unit: string;
  methodId: string;
  target: number;
  lowerControl?: number;
  upperControl?: number;
  /** Specification limits, where a hard limit exists; being outside them is worse than out of control. */
  lowerSpec?: number;
  upperSpec?: number;
  frequencyHours: number;
  /** Amp-hour replenishment rate for additives, mL per kA·h. */
  additiveRateMlPerKAh?: number;
  /** Where the numbers come from: a reference source, "computed" or "from memory". */
  basis: string;
};

export type Deposit = {
  element: ElementSymbol;
  /** Electrons per atom deposited (the n of Faraday's law). */
  charge: number;
  alloyWith?: { element: ElementSymbol; charge: number; typicalMassPercent: number };
};

export type BathTemplate = {
  id: string;
  name: string;
  deposit: Deposit | null;
  efficiencyPercent: { typical: number; low: number; high: number } | null;
  currentDensityAdm2: { low: number; high: number } | null;
  analytes: Analyte[];
  hazards: Hazard[];
  note: typeof TEMPLATE_NOTE;
  basis: string;
};

// Analysis frequencies are common practice (from memory): a shop sets its own.
export const EVERY_SHIFT_H = 8;
export const DAILY_H = 24;
export const WEEKLY_H = 168;

export const round1 = (x: number): number => Math.round(x * 10) / 10;

/** The temperature analyte every heated or ambient bath carries, read each shift. */
export const temperature = (target: number, low: number, high: number, basis: string): Analyte => ({
  key: 'temperature',
  name: 'Temperature',
  unit: '°C',
  methodId: 'thermometer',
  target,
  lowerControl: low,
  upperControl: high,
  frequencyHours: EVERY_SHIFT_H,
  basis,
});
