import type { ReactNode } from 'react';
import { formatUnitValue } from '../unit-value';
import type { PointKind, PreparedPoint } from './chart-model';
import { dateFormat, formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';

// Colours mirror tailwind.config.ts; SVG inside the chart is drawn with literal values.
export const chartColors = {
  ink: '#1f2326',
  inkMuted: '#565c61',
  line: '#ddd7cf',
  action: '#0f5e63',
  copperDeep: '#8a4519',
  out: '#a3231b',
  surface: '#ffffff',
} as const;

export const kindWords: Record<PointKind, string> = {
  normal: 'Reading',
  rule: 'Control rule fired',
  spec: 'Outside specification',
};

/** Circle for a reading, diamond where a rule fired, filled triangle outside specification. */
export function PointMark({ kind, x, y, size = 1 }: { kind: PointKind; x: number; y: number; size?: number }) {
  if (kind === 'spec') {
    const r = 6.5 * size;
    return (
      <path
        d={`M${x} ${y - r}L${x + r * 0.95} ${y + r * 0.7}H${x - r * 0.95}Z`}
        fill={chartColors.out}
        stroke={chartColors.surface}
        strokeWidth={1.2}
        strokeLinejoin="round"
      />
    );
  }
  if (kind === 'rule') {
    const r = 6 * size;
    return (
      <path
        d={`M${x} ${y - r}L${x + r} ${y}L${x} ${y + r}L${x - r} ${y}Z`}
        fill={chartColors.copperDeep}
        stroke={chartColors.surface}
        strokeWidth={1.2}
        strokeLinejoin="round"
      />
    );
  }
  return <circle cx={x} cy={y} r={3.2 * size} fill={chartColors.action} stroke={chartColors.surface} strokeWidth={1} />;
}

/**
 * A reading's time in the shop's zone (or `timeZone`): "8 Mar" on the axis, "Mar 2026" on the axis
 * of a range over more than a year (else five years read "3 Dec … 2 Dec"), "8 Mar 2026, 14:30 EDT"
 * in full, as elsewhere.
 */
export function formatTime(t: string, style: 'tick' | 'tick-year' | 'full', timeZone?: string): string {
  const date = new Date(t);
  if (Number.isNaN(date.getTime())) return t;
  const tz = timeZone ?? shopTimeZone();
  if (style === 'full') return formatShopTime(date, tz);
  return dateFormat('en-GB', style === 'tick' ? { day: 'numeric', month: 'short', timeZone: tz } : { month: 'short', year: 'numeric', timeZone: tz }).format(date);
}

/** The axis's tick style for readings from `first` to `last`. */
export function tickStyle(first: string | undefined, last: string | undefined): 'tick' | 'tick-year' {
  if (!first || !last) return 'tick';
  return new Date(last).getTime() - new Date(first).getTime() > 330 * 86_400_000 ? 'tick-year' : 'tick';
}

type TooltipBodyProps = {
  point: PreparedPoint | undefined;
  unit: string;
  digits?: number;
  timeZone?: string;
};

export function TooltipBody({ point, unit, digits, timeZone }: TooltipBodyProps) {
  if (!point) return null;
  return (
    <div className="max-w-64 rounded-md border border-surface-line bg-surface px-3 py-2 text-sm shadow-md">
      <p className="text-xs text-ink-muted">{formatTime(point.t, 'full', timeZone)}</p>
      <p className="tabular text-base font-semibold text-ink">{formatUnitValue(point.value, unit, { digits })}</p>
      {point.kind !== 'normal' ? (
        <p className="mt-1 flex items-center gap-1.5 font-medium text-ink">
          <MarkSwatch kind={point.kind} />
          {kindWords[point.kind]}
        </p>
      ) : null}
      {point.rules.length > 0 ? (
        <ul className="mt-0.5 list-disc pl-5 text-ink">
          {point.rules.map((rule) => (
            <li key={rule}>{rule}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

export function MarkSwatch({ kind }: { kind: PointKind }) {
  return (
    <svg viewBox="0 0 16 16" className="size-4 shrink-0" aria-hidden="true" focusable="false">
      <PointMark kind={kind} x={8} y={8.5} size={kind === 'normal' ? 1.4 : 1} />
    </svg>
  );
}

function LineSwatch({ dash, color, width }: { dash?: string; color: string; width: number }) {
  return (
    <svg viewBox="0 0 28 8" className="h-2 w-7 shrink-0" aria-hidden="true" focusable="false">
      <line x1="0" y1="4" x2="28" y2="4" stroke={color} strokeWidth={width} strokeDasharray={dash} />
    </svg>
  );
}

export const lineStyles = {
  centre: { color: chartColors.inkMuted, width: 1.5, dash: undefined },
  control: { color: chartColors.action, width: 1.5, dash: '6 4' },
  spec: { color: chartColors.copperDeep, width: 2.2, dash: '1.5 3.5' },
} as const;

export function ChartLegend({ hasSpec }: { hasSpec: boolean }) {
  const items: Array<{ key: string; swatch: ReactNode; text: string }> = [
    { key: 'pt', swatch: <MarkSwatch kind="normal" />, text: kindWords.normal },
    { key: 'rule', swatch: <MarkSwatch kind="rule" />, text: kindWords.rule },
    ...(hasSpec ? [{ key: 'spec', swatch: <MarkSwatch kind="spec" />, text: kindWords.spec }] : []),
    { key: 'cl', swatch: <LineSwatch {...lineStyles.centre} />, text: 'Centre line' },
    { key: 'cr', swatch: <LineSwatch {...lineStyles.control} />, text: 'Control limits (UCL, LCL)' },
    ...(hasSpec ? [{ key: 'sl', swatch: <LineSwatch {...lineStyles.spec} />, text: 'Specification limits (LSL, USL)' }] : []),
  ];
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
      {items.map((item) => (
        <li key={item.key} className="flex items-center gap-1.5">
          {item.swatch}
          {item.text}
        </li>
      ))}
    </ul>
  );
}
