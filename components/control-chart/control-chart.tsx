'use client';

import { useMemo, useState } from 'react';
import {
  CartesianGrid,
  ComposedChart,
  Line,
  ReferenceLine,
  Tooltip,
  XAxis,
  YAxis,
  type ActiveDotProps,
  type DotItemDotProps,
} from 'recharts';
import { cx } from '../ui/cx';
import { EmptyState } from '../ui/empty-state';
import { FormMessage } from '../ui/form-message';
import { formatUnitValue } from '../unit-value';
import { checkLimits, preparePoints, yScale, type ChartPoint, type PreparedPoint } from './chart-model';
import { ChartLegend, chartColors, formatTime, lineStyles, PointMark, tickStyle, TooltipBody } from './chart-parts';
import { ReadingsTable } from './readings-table';

export type { ChartPoint } from './chart-model';

export type ControlChartProps = {
  /** Readings in time order; `rules` names each control rule that fired at that reading. */
  points: readonly ChartPoint[];
  cl: number;
  ucl: number;
  lcl: number;
  lsl?: number;
  usl?: number;
  /** Unit of the values, e.g. "g/L"; shown on the axis and in every value. */
  unit: string;
  /** What is measured, e.g. "Nickel metal". */
  label: string;
  /** Fixed decimals for values; by default up to 3. */
  digits?: number;
  height?: number;
  /** IANA zone for dates (the shop's); defaults to the browser's. */
  timeZone?: string;
  className?: string;
};

/** An individuals control chart: readings over time against centre line, control and specification limits. */
export function ControlChart({ points, cl, ucl, lcl, lsl, usl, unit, label, digits, height = 320, timeZone, className }: ControlChartProps) {
  const limits = useMemo(() => ({ cl, ucl, lcl, lsl, usl }), [cl, ucl, lcl, lsl, usl]);
  const problems = useMemo(() => checkLimits(limits), [limits]);
  const prepared = useMemo(() => preparePoints(points, limits), [points, limits]);
  const scale = useMemo(() => yScale(prepared.points, limits), [prepared.points, limits]);
  const [showTable, setShowTable] = useState(false);
  const data = prepared.points;
  const ticks = tickStyle(data[0]?.t, data.at(-1)?.t);
  const hasSpec = lsl !== undefined || usl !== undefined;
  const fmt = (v: number) => formatUnitValue(v, unit, { digits });

  if (problems.length > 0) {
    return <FormMessage tone="error" message={`This chart cannot be drawn: ${problems.join(' ')}`} className={className} />;
  }
  if (data.length === 0) {
    return (
      <EmptyState
        className={className}
        title={`No ${label.toLowerCase()} readings to chart yet`}
        description="Log an analysis for this tank; each reading appears here against its limits."
      />
    );
  }

  const first = data[0];
  const last = data[data.length - 1];
  // Every reading a rule fired on, whether or not it is also outside specification (marked as such).
  const ruleCount = data.filter((p) => p.rules.length > 0).length;
  const specCount = data.filter((p) => p.kind === 'spec').length;
  const summary =
    `${data.length} ${data.length === 1 ? 'reading' : 'readings'}` +
    (first && last ? ` from ${formatTime(first.t, 'full', timeZone)} to ${formatTime(last.t, 'full', timeZone)}` : '') +
    `. Centre line ${fmt(cl)}, control limits ${fmt(lcl)} to ${fmt(ucl)}` +
    (hasSpec ? `, specification ${lsl !== undefined ? fmt(lsl) : 'no lower limit'} to ${usl !== undefined ? fmt(usl) : 'no upper limit'}` : '') +
    `. ${ruleCount} with a control rule fired` +
    (hasSpec ? `, ${specCount} outside specification.` : '.');

  const renderDot = (props: DotItemDotProps) => {
    const p = props.payload as PreparedPoint | undefined;
    if (!p || props.cx === undefined || props.cy === undefined) return <g key={`dot-${props.index}`} />;
    return (
      <g key={`dot-${props.index}`}>
        <PointMark kind={p.kind} x={props.cx} y={props.cy} />
      </g>
    );
  };

  const refLabel = (text: string, color: string) => ({ value: text, position: 'right' as const, fill: color, fontSize: 11 });

  return (
    <figure className={cx('flex flex-col gap-2', className)}>
      <figcaption className="flex flex-wrap items-baseline justify-between gap-2">
        <span className="text-sm font-semibold text-ink">
          {label} <span className="font-normal text-ink-muted">({unit})</span>
        </span>
        {/* Dates are in the shop's zone (or timeZone), the same text on server and browser. */}
        <span className="sr-only" suppressHydrationWarning>
          {summary}
        </span>
        {prepared.dropped > 0 ? (
          <span className="text-xs text-ink-muted">
            {prepared.dropped} {prepared.dropped === 1 ? 'reading has' : 'readings have'} no number and {prepared.dropped === 1 ? 'is' : 'are'} not shown.
          </span>
        ) : null}
      </figcaption>
      <ComposedChart
        responsive
        data={data}
        style={{ width: '100%', height }}
        margin={{ top: 12, right: 84, bottom: 24, left: 8 }}
      >
        <CartesianGrid stroke={chartColors.line} strokeDasharray="2 4" vertical={false} />
        <XAxis
          dataKey="index"
          type="number"
          domain={[0, Math.max(data.length - 1, 1)]}
          allowDecimals={false}
          tickFormatter={(i: number) => {
            const p = data[Math.round(i)];
            return p ? formatTime(p.t, ticks, timeZone) : '';
          }}
          tick={{ fill: chartColors.inkMuted, fontSize: 12 }}
          stroke={chartColors.line}
          label={{ value: 'Date of reading', position: 'insideBottom', offset: -14, fill: chartColors.inkMuted, fontSize: 12 }}
          padding={{ left: 10, right: 10 }}
        />
        <YAxis
          type="number"
          domain={scale.domain}
          ticks={scale.ticks}
          interval={0}
          tickFormatter={(v: number) => formatUnitValue(v, '', { digits })}
          tick={{ fill: chartColors.inkMuted, fontSize: 12 }}
          stroke={chartColors.line}
          width={64}
          label={{ value: `${label} (${unit})`, angle: -90, position: 'insideLeft', fill: chartColors.inkMuted, fontSize: 12, style: { textAnchor: 'middle' } }}
        />
        {usl !== undefined ? (
          <ReferenceLine y={usl} stroke={lineStyles.spec.color} strokeWidth={lineStyles.spec.width} strokeDasharray={lineStyles.spec.dash} label={refLabel(`USL ${fmt(usl)}`, lineStyles.spec.color)} />
        ) : null}
        {lsl !== undefined ? (
          <ReferenceLine y={lsl} stroke={lineStyles.spec.color} strokeWidth={lineStyles.spec.width} strokeDasharray={lineStyles.spec.dash} label={refLabel(`LSL ${fmt(lsl)}`, lineStyles.spec.color)} />
        ) : null}
        <ReferenceLine y={ucl} stroke={lineStyles.control.color} strokeWidth={lineStyles.control.width} strokeDasharray={lineStyles.control.dash} label={refLabel(`UCL ${fmt(ucl)}`, lineStyles.control.color)} />
        <ReferenceLine y={cl} stroke={lineStyles.centre.color} strokeWidth={lineStyles.centre.width} label={refLabel(`CL ${fmt(cl)}`, lineStyles.centre.color)} />
        <ReferenceLine y={lcl} stroke={lineStyles.control.color} strokeWidth={lineStyles.control.width} strokeDasharray={lineStyles.control.dash} label={refLabel(`LCL ${fmt(lcl)}`, lineStyles.control.color)} />
        <Tooltip
          cursor={{ stroke: chartColors.line }}
          content={({ active, payload }) =>
            active ? <TooltipBody point={payload?.[0]?.payload as PreparedPoint | undefined} unit={unit} digits={digits} timeZone={timeZone} /> : null
          }
        />
        <Line
          type="linear"
          dataKey="value"
          name={label}
          stroke={chartColors.inkMuted}
          strokeWidth={1.2}
          dot={renderDot}
          activeDot={(props: ActiveDotProps) => {
            const p = props.payload as PreparedPoint | undefined;
            if (!p || props.cx === undefined || props.cy === undefined) return <g />;
            return <PointMark kind={p.kind} x={props.cx} y={props.cy} size={1.5} />;
          }}
          isAnimationActive={false}
        />
      </ComposedChart>
      <ChartLegend hasSpec={hasSpec} />
      <details onToggle={(e) => setShowTable(e.currentTarget.open)} className="text-sm">
        <summary className="cursor-pointer text-action hover:underline">Show readings as a table</summary>
        {showTable ? <ReadingsTable points={data} unit={unit} label={label} digits={digits} timeZone={timeZone} /> : null}
      </details>
    </figure>
  );
}
