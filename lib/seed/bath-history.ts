// Invented bath history for the demo: daily analyses around each analyte's target with noise, one
// analyte drifting out of control, meter readings and additive additions. Pure and repeatable (a
// seeded random generator), so the demo looks the same on every machine.
import { getMethod } from '@/lib/bath/methods';
import { computeAnalysis, factorPerMl, type AnalysisInputs } from '@/lib/bath/methods/titration';

export const HISTORY_DAYS = 120;

/** The one analyte that drifts: alkaline zinc's zinc metal creeps up (anodes dissolving faster than zinc plates out). */
export const DRIFT = { tankCode: 'Z-ZN1', key: 'zinc', startDay: 80, slopePerDay: 0.045, finalBump: 0.2 } as const;

/** One past excursion that was caught and corrected, so the alert history has an acknowledged entry. */
export const EXCURSION = { tankCode: 'N-CU1', key: 'sulfuricAcid', day: 40, value: 26 } as const;

/** One mistyped entry and its correction, so a superseded analysis shows struck through. */
export const MISTYPED = { tankCode: 'N-NI1', key: 'nickelChloride', day: 100, buretteMl: 3.5 } as const;

export function randomSource(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    // mulberry32
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function normal(rand: () => number): number {
  // Box–Muller; 1 − u keeps the logarithm finite.
  const u = 1 - rand();
  const v = rand();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

export function hashSeed(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return h >>> 0;
}

export type SeedAnalyte = {
  key: string;
  unit: string;
  methodId: string;
  target: number;
  lowerControl: number | null;
  upperControl: number | null;
  frequencyHours: number;
};

export type SeedPoint = { day: number; value: number; inputs: AnalysisInputs };

function spread(a: SeedAnalyte): number {
  if (a.lowerControl !== null && a.upperControl !== null) return (a.upperControl - a.lowerControl) / 10;
  const limit = a.upperControl ?? a.lowerControl ?? a.target * 1.2;
  return Math.abs(limit - a.target) / 4 || Math.abs(a.target) * 0.05 || 0.1;
}

// Titrations are recorded as the burette reading (0.05 mL resolution) and the value computed from
// it; direct readings are rounded as a meter shows them.
function asMeasured(a: SeedAnalyte, wanted: number): { value: number; inputs: AnalysisInputs } | null {
  const method = getMethod(a.methodId);
  if (!method) return null;
  if (method.kind === 'titration' && method.back) {
    // A back-titration: the blank less what the sample took.
    const blankMl = 50;
    const buretteMl = Math.max(0.05, Math.round((blankMl - wanted / factorPerMl(method)) / 0.05) * 0.05);
    const inputs = { buretteMl: Number(buretteMl.toFixed(2)), blankMl };
    const r = computeAnalysis(method, inputs);
    return r.ok ? { value: Number(r.value.toFixed(4)), inputs } : null;
  }
  if (method.kind === 'titration') {
    const buretteMl = Math.max(0.05, Math.round(wanted / factorPerMl(method) / 0.05) * 0.05);
    const r = computeAnalysis(method, { buretteMl: Number(buretteMl.toFixed(2)) });
    return r.ok ? { value: Number(r.value.toFixed(4)), inputs: { buretteMl: Number(buretteMl.toFixed(2)) } } : null;
  }
  const digits = a.unit === 'pH' || a.unit === 'SG' ? 2 : a.unit === 'mL/L' ? 2 : 1;
  const value = Math.max(0, Number(wanted.toFixed(digits)));
  return { value, inputs: method.kind === 'direct' ? { reading: value } : { values: {} } };
}

/** One analyte's history, oldest first; weekly analytes every seventh day. */
export function analyteHistory(tankCode: string, a: SeedAnalyte): SeedPoint[] {
  const rand = randomSource(hashSeed(`${tankCode}:${a.key}`));
  const sigma = spread(a);
  const step = a.frequencyHours >= 168 ? 7 : 1;
  const drifting = tankCode === DRIFT.tankCode && a.key === DRIFT.key;
  const points: SeedPoint[] = [];
  for (let day = step === 7 ? 3 : 0; day < HISTORY_DAYS; day += step) {
    let wanted = a.target + normal(rand) * sigma * (drifting ? 0.9 : 1);
    if (drifting && day >= DRIFT.startDay) wanted += (day - DRIFT.startDay) * DRIFT.slopePerDay;
    if (drifting && day === HISTORY_DAYS - 1) wanted += DRIFT.finalBump;
    if (!drifting && a.lowerControl !== null && a.upperControl !== null) {
      // Keep the steady baths inside their band: only the drifting one goes out.
      wanted = Math.min(a.upperControl - sigma * 0.5, Math.max(a.lowerControl + sigma * 0.5, wanted));
    }
    if (tankCode === EXCURSION.tankCode && a.key === EXCURSION.key && day === EXCURSION.day) wanted = EXCURSION.value;
    const m = asMeasured(a, wanted);
    if (m) points.push({ day, ...m });
  }
  return points;
}

/**
 * When in its day a reading was taken: each tank has its own round on the morning shift (06:00–
 * 14:00), and each analyte its own minutes in it, so no two tanks share a time stamp. Minutes
 * before the seed's reference time, 0–480.
 */
export function readingOffsetMinutes(tankCode: string, key: string, day: number): number {
  const tankRound = hashSeed(tankCode) % 360;
  const jitter = hashSeed(`${tankCode}:${key}:${day}`) % 90;
  return tankRound + jitter;
}

/** Daily amp-hour meter totals: the rectifier runs about 14–18 h a day at 30–50 % of its rating. */
export function meterHistory(tankCode: string, rectifierMaxA: number): { day: number; ampHours: number }[] {
  const rand = randomSource(hashSeed(`${tankCode}:meter`));
  let total = Math.round(rand() * 50_000);
  const out: { day: number; ampHours: number }[] = [];
  for (let day = 0; day < HISTORY_DAYS; day++) {
    total += Math.round(rectifierMaxA * (0.3 + rand() * 0.2) * (14 + rand() * 4));
    out.push({ day, ampHours: total });
  }
  return out;
}
