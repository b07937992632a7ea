'use client';

import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { chartColors } from '@/components/control-chart/chart-parts';
import { formatMoney } from '@/components/money';

export type VarianceBar = { key: string; quoted: number; actual: number; price: number };

const dollars = (cents: number) => formatMoney(Math.round(cents));

/** Quoted and actual cost per group, with the price beside them, in dollars. */
export function VarianceChart({ data, groupLabel }: { data: VarianceBar[]; groupLabel: string }) {
  return (
    <figure className="flex flex-col gap-2">
      <figcaption className="text-sm text-ink-muted">Quoted cost, actual cost and price by {groupLabel}. The table below holds the same figures.</figcaption>
      <BarChart responsive data={data} style={{ width: '100%', height: 320 }} margin={{ top: 8, right: 16, bottom: 8, left: 16 }}>
        <CartesianGrid stroke={chartColors.line} strokeDasharray="2 4" vertical={false} />
        <XAxis dataKey="key" tick={{ fill: chartColors.inkMuted, fontSize: 12 }} stroke={chartColors.line} />
        <YAxis tickFormatter={dollars} tick={{ fill: chartColors.inkMuted, fontSize: 12 }} stroke={chartColors.line} width={88} />
        <Tooltip formatter={(v) => dollars(Number(v))} />
        {/* In the bars' own order (the legend sorts by name unless told not to). */}
        <Legend itemSorter={null} />
        <Bar dataKey="quoted" name="Quoted cost" fill={chartColors.action} />
        <Bar dataKey="actual" name="Actual cost" fill={chartColors.copperDeep} />
        <Bar dataKey="price" name="Price" fill={chartColors.inkMuted} />
      </BarChart>
    </figure>
  );
}
