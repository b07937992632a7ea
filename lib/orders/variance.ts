// Grouping costed work orders for the variance report. Pure.
import type { CostComparison } from './costing';

export type VarianceGrouping = 'customer' | 'finish' | 'month';

export type VarianceGroup = {
  key: string;
  orders: number;
  priceCents: number;
  quotedCostCents: number;
  actualCostCents: number;
  varianceCents: number;
  realisedMarginCents: number;
  /** Realised margin as a share of the price, one decimal; null when nothing was priced. */
  realisedMarginPct: number | null;
};

export function groupVariance<T extends { customer: string; finish: string; month: string; comparison: CostComparison }>(rows: readonly T[], by: VarianceGrouping): VarianceGroup[] {
  const groups = new Map<string, VarianceGroup>();
  for (const r of rows) {
    const key = r[by];
    const g = groups.get(key) ?? { key, orders: 0, priceCents: 0, quotedCostCents: 0, actualCostCents: 0, varianceCents: 0, realisedMarginCents: 0, realisedMarginPct: null };
    g.orders += 1;
    g.priceCents += r.comparison.priceCents;
    g.quotedCostCents += r.comparison.quotedCostCents;
    g.actualCostCents += r.comparison.actualCostCents;
    g.varianceCents += r.comparison.varianceCents;
    g.realisedMarginCents += r.comparison.realisedMarginCents;
    groups.set(key, g);
  }
  return [...groups.values()]
    .map((g) => ({ ...g, realisedMarginPct: g.priceCents > 0 ? Math.round((g.realisedMarginCents / g.priceCents) * 1000) / 10 : null }))
    .sort((a, b) => a.key.localeCompare(b.key));
}
