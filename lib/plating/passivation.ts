import { PlatingInputError } from './errors';

// Passivation of stainless steel: no current and no coating, so the "calculation" is a window
// that a lot's bath concentration, temperature and immersion time must sit inside. ASTM A967
// §5.2.2 asks the processor to keep, per lot, a record of concentration and temperature sufficient
// to show the specified conditions were held; a lot outside the window is a nonconformance.
// Windows are data: each shop may edit them; each default names its source or says "from memory".

export type TemperatureBand = { minC: number; maxC: number; minMinutes: number };

export type PassivationWindow = {
  id: string;
  standard: string;
  treatment: string;
  acid: 'nitric' | 'citric';
  concentration: { min: number; max: number; unit: 'vol %' | 'wt %' };
  /** A lot passes in any one band: its temperature inside the band and at least its minutes. */
  bands: readonly TemperatureBand[];
  /** Where each figure comes from. */
  source: string;
};

export const DEFAULT_PASSIVATION_WINDOWS: readonly PassivationWindow[] = [
  {
    id: 'a967-nitric-2',
    standard: 'ASTM A967',
    treatment: 'Nitric 2',
    acid: 'nitric',
    concentration: { min: 20, max: 45, unit: 'vol %' },
    bands: [
      { minC: 21, maxC: 32, minMinutes: 30 },
      { minC: 38, maxC: 52, minMinutes: 20 },
      { minC: 49, maxC: 60, minMinutes: 10 },
    ],
    source: 'Concentration: ASTM A967 Nitric 2 (checked). Time and temperature bands: from memory; confirm against the current edition.',
  },
  {
    id: 'a967-citric-1',
    standard: 'ASTM A967',
    treatment: 'Citric 1',
    acid: 'citric',
    concentration: { min: 4, max: 10, unit: 'wt %' },
    bands: [{ minC: 60, maxC: 71, minMinutes: 4 }],
    source: 'From memory; confirm against the current edition of ASTM A967.',
  },
  {
    id: 'a967-citric-2',
    standard: 'ASTM A967',
    treatment: 'Citric 2',
    acid: 'citric',
    concentration: { min: 4, max: 10, unit: 'wt %' },
    bands: [{ minC: 49, maxC: 60, minMinutes: 10 }],
    source: 'From memory; confirm against the current edition of ASTM A967.',
  },
  {
    id: 'a967-citric-3',
    standard: 'ASTM A967',
    treatment: 'Citric 3',
    acid: 'citric',
    concentration: { min: 4, max: 10, unit: 'wt %' },
    bands: [{ minC: 21, maxC: 49, minMinutes: 20 }],
    source: 'From memory; confirm against the current edition of ASTM A967.',
  },
];

export type PassivationLot = { windowId: string; temperatureC: number; minutes: number; concentration: number };
export type PassivationVerdict = { ok: true; window: PassivationWindow; band: TemperatureBand } | { ok: false; window: PassivationWindow; broken: string[] };

function requireFinite(field: string, label: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new PlatingInputError(field, `${label} must be a finite number; got ${String(value)}.`);
  return value;
}

const num = (v: number) => (Number.isInteger(v) ? String(v) : v.toFixed(1));

/** Whether a lot sat inside its treatment's window, and if not, each rule it broke in plain words. */
export function checkPassivation(lot: PassivationLot, windows: readonly PassivationWindow[] = DEFAULT_PASSIVATION_WINDOWS): PassivationVerdict {
  const window = windows.find((w) => w.id === lot.windowId);
  if (!window) throw new PlatingInputError('windowId', `There is no passivation treatment "${String(lot.windowId)}"; choose one of ${windows.map((w) => `${w.standard} ${w.treatment}`).join(', ')}.`);
  const t = requireFinite('temperatureC', 'Temperature', lot.temperatureC);
  const minutes = requireFinite('minutes', 'Immersion time', lot.minutes);
  if (minutes < 0) throw new PlatingInputError('minutes', `Immersion time cannot be negative; got ${minutes}.`);
  const c = requireFinite('concentration', 'Acid concentration', lot.concentration);
  if (c < 0 || c > 100) throw new PlatingInputError('concentration', `Acid concentration must be a percentage from 0 to 100; got ${c}.`);
  const broken: string[] = [];
  const name = `${window.standard} ${window.treatment}`;
  const { min, max, unit } = window.concentration;
  if (c < min || c > max) broken.push(`${window.acid === 'nitric' ? 'Nitric' : 'Citric'} acid at ${num(c)} ${unit} is outside ${num(min)}–${num(max)} ${unit} for ${name}.`);
  const inBand = window.bands.filter((b) => t >= b.minC && t <= b.maxC);
  if (inBand.length === 0) {
    broken.push(`${num(t)} °C is outside every temperature band of ${name} (${window.bands.map((b) => `${num(b.minC)}–${num(b.maxC)} °C`).join(', ')}).`);
  } else {
    // Overlapping bands: the shortest time that applies at this temperature.
    const band = inBand.reduce((a, b) => (b.minMinutes < a.minMinutes ? b : a));
    if (minutes < band.minMinutes) broken.push(`${num(minutes)} min is shorter than the ${num(band.minMinutes)} min ${name} needs at ${num(band.minC)}–${num(band.maxC)} °C.`);
    if (broken.length === 0) return { ok: true, window, band };
  }
  return { ok: false, window, broken };
}
