// Job costing: what a work order really cost, from the plating runs logged at the tank, beside
// what the quote expected. Pure. Uses the same cost lines and rounding rule as pricing
// (lib/quotes/pricing.ts): each line half-up to whole cents, then summed.
import { thicknessFromCharge } from '@/lib/plating';
import type { RunCost } from '@/lib/families/types';
import { costComponent, type CostComponent, type LinePrice, type PricingRates } from '@/lib/quotes/pricing';

export type CostedRun = {
  ampHours: number;
  loads: number;
  partsPerLoad: number;
  /** Tank time of the run, from its start and end. */
  hours: number;
  tankEfficiency: number;
  /** Bath metal of the run's tank, g/L (see lib/quotes/process.ts). */
  bathMetalGPerL: number;
  /** What the finish's family says the run used (lib/families); without it, Faraday's law on the charge. */
  used?: RunCost;
};

export type CostedJob = {
  element: string;
  ionCharge: number;
  method: 'rack' | 'barrel';
  tankVolts: number;
  handlingMinutesPerLoad: number;
  maskingPerPieceCents: number;
  areaPerPartDm2: number;
  quantityReceived: number;
  bakeApplies: boolean;
  rectifierEfficiency: number;
  dragOutLPerM2: number;
};

export type ActualCost = { components: CostComponent[]; subtotalCents: number; ampHours: number; loads: number; tankHours: number };

const DM2_PER_M2 = 100;

export function actualCost(job: CostedJob, runs: readonly CostedRun[], rates: PricingRates): ActualCost {
  let metalG = 0;
  let ampHours = 0;
  let loads = 0;
  let tankHours = 0;
  let bathLifeMto = 0;
  let bathLifeRate = 0;
  for (const r of runs) {
    const area = r.loads * r.partsPerLoad * job.areaPerPartDm2;
    // The deposit follows Faraday's law at the tank's efficiency; drag-out as in pricing.
    metalG += r.used
      ? r.used.metalG
      : thicknessFromCharge({ element: job.element, charge: job.ionCharge, areaDm2: area, ampHours: r.ampHours, efficiency: r.tankEfficiency }).depositMassG;
    if (r.used?.bathLife) {
      bathLifeMto += r.used.bathLife.metalTurnovers;
      bathLifeRate = r.used.bathLife.costPerMtoCents;
    }
    metalG += job.dragOutLPerM2 * (area / DM2_PER_M2) * r.bathMetalGPerL;
    ampHours += r.ampHours;
    loads += r.loads;
    tankHours += r.hours;
  }
  const kWh = ampHours > 0 ? (job.tankVolts * ampHours) / 1000 / job.rectifierEfficiency : 0;
  const components: CostComponent[] = [
    costComponent('metal', 'Metal', metalG / 1000, 'kg', rates.metalPerKgCents[job.element] ?? 0),
    costComponent('additives', 'Salts and additives', ampHours / 1000, 'kA·h', rates.additivesPerKahCents),
    costComponent('power', 'Power', kWh, 'kWh', rates.powerPerKwhCents),
    costComponent('labour', 'Labour (loads × handling minutes)', (loads * job.handlingMinutesPerLoad) / 60, 'h', rates.labourPerHourCents),
    costComponent('tankTime', `Tank time (${job.method})`, tankHours, 'tank-h', job.method === 'rack' ? rates.tankHourRackCents : rates.tankHourBarrelCents),
    costComponent('masking', 'Masking', job.quantityReceived, 'pc', job.maskingPerPieceCents),
    costComponent('bake', 'Relief bake', job.bakeApplies ? loads : 0, 'load', rates.bakePerLoadCents),
    ...(bathLifeMto > 0 ? [costComponent('bathLife', 'Bath life (make-up and disposal per metal turnover)', bathLifeMto, 'MTO', bathLifeRate)] : []),
  ];
  return { components, subtotalCents: components.reduce((s, c) => s + c.cents, 0), ampHours, loads, tankHours };
}

export type CostComparison = {
  priceCents: number;
  quotedCostCents: number;
  actualCostCents: number;
  varianceCents: number;
  quotedMarginCents: number;
  realisedMarginCents: number;
  /** Realised margin as a share of the price; null when the price is zero. */
  realisedMarginPct: number | null;
  rows: { key: string; label: string; quotedCents: number; actualCents: number }[];
};

export function compareCosts(priceCents: number, quoted: Pick<LinePrice, 'components' | 'subtotalCents'> | null, actual: ActualCost): CostComparison {
  const quotedBy = new Map((quoted?.components ?? []).map((c) => [c.key, c.cents]));
  const quotedCostCents = quoted?.subtotalCents ?? 0;
  const realised = priceCents - actual.subtotalCents;
  return {
    priceCents,
    quotedCostCents,
    actualCostCents: actual.subtotalCents,
    varianceCents: actual.subtotalCents - quotedCostCents,
    quotedMarginCents: priceCents - quotedCostCents,
    realisedMarginCents: realised,
    realisedMarginPct: priceCents > 0 ? Math.round((realised / priceCents) * 1000) / 10 : null,
    rows: actual.components.map((c) => ({ key: c.key, label: c.label, quotedCents: quotedBy.get(c.key) ?? 0, actualCents: c.cents })),
  };
}
