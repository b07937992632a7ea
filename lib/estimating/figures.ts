// A job estimate as named figures with units: in storage units (what the API returns and the
// database keeps) and in a user's unit system (what screens show). The workbench page and
// POST /api/v1/plating/estimate both read their figures from here. Pure.
import { displayUnit, fromStorage, type JobEstimate, type JobFigures, type Quantity, type UnitSystem } from '@/lib/plating';

export type Measure = { value: number; unit: string };

type Def = {
  label: string;
  // An engine quantity (converted between systems) or a unit that is the same in both.
  quantity?: Quantity;
  unit?: string;
  of: (e: JobEstimate, f: JobFigures) => number | null;
  // Changes with cathode efficiency, so it has a lower-efficiency value.
  sensitive?: boolean;
};

export const FIGURES = {
  areaPerPart: { label: 'Area per part', quantity: 'area', of: (e) => e.areaPerPartDm2 },
  areaPerLot: { label: 'Area per lot', quantity: 'area', of: (e) => e.areaPerLotDm2 },
  minimumThickness: { label: 'Minimum thickness', quantity: 'thickness', of: (e) => e.minimumThicknessUm },
  averageThickness: { label: 'Average thickness', quantity: 'thickness', of: (e) => e.averageThicknessUm },
  depositMassPerPart: { label: 'Deposit per part', quantity: 'mass', of: (e) => e.depositMassPerPartG },
  partsPerLoad: { label: 'Parts per load', unit: 'parts', of: (e) => e.partsPerLoad },
  loads: { label: 'Loads', unit: 'loads', of: (e) => e.loads },
  currentPerLoad: { label: 'Current per load', unit: 'A', of: (e) => e.currentPerLoadA },
  ampHoursPerLoad: { label: 'Amp-hours per load', unit: 'A·h', of: (_, f) => f.ampHoursPerLoad, sensitive: true },
  ampHoursLot: { label: 'Amp-hours for the lot', unit: 'A·h', of: (_, f) => f.ampHoursLot, sensitive: true },
  minutesPerLoad: { label: 'Plating time per load', unit: 'min', of: (_, f) => f.minutesPerLoad, sensitive: true },
  totalTankTime: { label: 'Total tank time', unit: 'min', of: (_, f) => f.totalTankMinutes, sensitive: true },
  metalDeposited: { label: 'Metal deposited', quantity: 'mass', of: (_, f) => f.metal.depositG },
  metalDraggedOut: { label: 'Metal dragged out', quantity: 'mass', of: (_, f) => f.metal.dragOutG },
  metalAnodeLoss: { label: 'Anode losses', quantity: 'mass', of: (_, f) => f.metal.anodeLossG },
  metalConsumed: { label: 'Metal consumed', quantity: 'mass', of: (_, f) => f.metal.totalG },
  saltToAdd: { label: 'Salt to add', quantity: 'mass', of: (_, f) => f.salt?.grams ?? null },
  energyDc: { label: 'Energy at the tank (DC)', unit: 'kWh', of: (_, f) => f.energy.dcKWh, sensitive: true },
  energyAc: { label: 'Energy from the mains', unit: 'kWh', of: (_, f) => f.energy.acKWh, sensitive: true },
} as const satisfies Record<string, Def>;

export type FigureKey = keyof typeof FIGURES;
export const FIGURE_KEYS = Object.keys(FIGURES) as FigureKey[];
export const SENSITIVE_KEYS = FIGURE_KEYS.filter((k) => (FIGURES[k] as Def).sensitive);

export type FigureSet = Partial<Record<FigureKey, Measure>>;

function storageUnit(def: Def): string {
  return def.quantity ? displayUnit(def.quantity, 'metric') : (def.unit as string);
}

function inSystem(def: Def, value: number, system: UnitSystem | 'storage'): Measure {
  if (!def.quantity || system === 'storage') return { value, unit: storageUnit(def) };
  const unit = displayUnit(def.quantity, system);
  return { value: fromStorage(value, unit), unit };
}

/** Figures at one efficiency: the nominal one or the lower one; `keys` limits the set. */
export function figureSet(
  estimate: JobEstimate,
  figures: JobFigures,
  system: UnitSystem | 'storage',
  keys: readonly FigureKey[] = FIGURE_KEYS,
): FigureSet {
  const out: FigureSet = {};
  for (const key of keys) {
    const def = FIGURES[key] as Def;
    const value = def.of(estimate, figures);
    if (value !== null) out[key] = inSystem(def, value, system);
  }
  return out;
}

export type SensitivityRow = { key: FigureKey; label: string; nominal: Measure; lower: Measure; changePercent: number };

/** The efficiency-dependent figures at the nominal and the 5-point lower efficiency. */
export function sensitivityRows(estimate: JobEstimate, system: UnitSystem): SensitivityRow[] {
  const lowerFigures = estimate.lowerEfficiency;
  if (!lowerFigures) return [];
  const nominal = figureSet(estimate, estimate.nominal, system, SENSITIVE_KEYS);
  const lower = figureSet(estimate, lowerFigures, system, SENSITIVE_KEYS);
  return SENSITIVE_KEYS.flatMap((key) => {
    const n = nominal[key];
    const l = lower[key];
    if (!n || !l || n.value === 0) return [];
    return [{ key, label: FIGURES[key].label, nominal: n, lower: l, changePercent: ((l.value - n.value) / n.value) * 100 }];
  });
}
