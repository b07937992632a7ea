// The shop's real cathode current efficiency, from a lot's measured mean thickness and the
// amp-hours its runs passed. Pure. Faraday's law at 100 % efficiency gives the thickness the
// charge could have deposited over the plated area; the measured mean divided by it is the share of
// the charge that became metal (reference §1.1). Readings taken only on the thinnest significant
// surfaces understate the average, so the figure is a lower bound for such lots.
import { thicknessFromCharge } from '@/lib/plating';

export type EfficiencyRun = {
  tankId: string;
  tankElement: string | null;
  /** Null for a run without current: it adds no charge. */
  ampHours: number | null;
  loads: number;
  partsPerLoad: number;
  predictedThicknessUm: number;
};

export type LotEfficiency =
  | {
      ok: true;
      tankId: string;
      ampHours: number;
      areaDm2: number;
      /** What the charge would deposit at 100 % efficiency, spread evenly. */
      theoreticalUm: number;
      /** The engine's prediction logged with the runs (parts-weighted). */
      predictedUm: number;
      measuredMeanUm: number;
      efficiency: number;
      /** Measured mean ÷ predicted. */
      ratioToPredicted: number | null;
    }
  | { ok: false; reason: string };

export function lotEfficiency(input: {
  element: string;
  ionCharge: number;
  partAreaDm2: number;
  measuredMeanUm: number;
  runs: readonly EfficiencyRun[];
}): LotEfficiency {
  const runs = input.runs.filter((r) => r.tankElement === input.element);
  if (runs.length === 0) return { ok: false, reason: `No run in a ${input.element} tank.` };
  const tanks = new Set(runs.map((r) => r.tankId));
  if (tanks.size > 1) return { ok: false, reason: 'Plated in more than one tank: the lot cannot be credited to one tank.' };
  if (!(input.partAreaDm2 > 0)) return { ok: false, reason: 'The part has no area.' };
  if (!(input.measuredMeanUm > 0)) return { ok: false, reason: 'No measured thickness.' };
  const parts = runs.reduce((s, r) => s + r.loads * r.partsPerLoad, 0);
  const ampHours = runs.reduce((s, r) => s + (r.ampHours ?? 0), 0);
  if (!(parts > 0) || !(ampHours > 0)) return { ok: false, reason: 'The runs record no parts or no amp-hours.' };
  const areaDm2 = parts * input.partAreaDm2;
  const theoreticalUm = thicknessFromCharge({ element: input.element, charge: input.ionCharge, areaDm2, ampHours, efficiency: 1 }).thicknessUm;
  const predictedUm = runs.reduce((s, r) => s + r.predictedThicknessUm * r.loads * r.partsPerLoad, 0) / parts;
  return {
    ok: true,
    tankId: [...tanks][0]!,
    ampHours,
    areaDm2,
    theoreticalUm,
    predictedUm,
    measuredMeanUm: input.measuredMeanUm,
    efficiency: input.measuredMeanUm / theoreticalUm,
    ratioToPredicted: predictedUm > 0 ? input.measuredMeanUm / predictedUm : null,
  };
}
