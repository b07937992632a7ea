// Pure preparation of control-chart data: classification, axis range and summaries.

export type ChartPoint = { t: string; value: number; rules: string[] };

export type ChartLimits = { cl: number; ucl: number; lcl: number; lsl?: number; usl?: number };

/** `spec`: outside a specification limit; `rule`: a control rule fired; `normal`: neither. */
export type PointKind = 'normal' | 'rule' | 'spec';

export type PreparedPoint = ChartPoint & { index: number; kind: PointKind };

export function classifyPoint(point: ChartPoint, limits: ChartLimits): PointKind {
  if ((limits.usl !== undefined && point.value > limits.usl) || (limits.lsl !== undefined && point.value < limits.lsl)) {
    return 'spec';
  }
  return point.rules.length > 0 ? 'rule' : 'normal';
}

/** Drops points without a finite value (they cannot be drawn) and reports how many were dropped. */
export function preparePoints(points: readonly ChartPoint[], limits: ChartLimits): { points: PreparedPoint[]; dropped: number } {
  const kept: PreparedPoint[] = [];
  for (const p of points) {
    if (typeof p.value !== 'number' || !Number.isFinite(p.value)) continue;
    kept.push({ ...p, rules: p.rules ?? [], index: kept.length, kind: classifyPoint(p, limits) });
  }
  return { points: kept, dropped: points.length - kept.length };
}

/**
 * A y-range that shows every point and every limit line with a little room, rounded out to a
 * 1-2-5 step so the axis reads 48, 52, 56… rather than 48.3, 55.3, 62.3…
 */
export function yScale(points: readonly { value: number }[], limits: ChartLimits, targetTicks = 6): { domain: [number, number]; ticks: number[] } {
  const values = [
    ...points.map((p) => p.value),
    limits.cl,
    limits.ucl,
    limits.lcl,
    ...(limits.lsl !== undefined ? [limits.lsl] : []),
    ...(limits.usl !== undefined ? [limits.usl] : []),
  ].filter((v) => Number.isFinite(v));
  if (values.length === 0) return { domain: [0, 1], ticks: [0, 0.5, 1] };
  const min = Math.min(...values);
  const max = Math.max(...values);
  const span = max - min;
  const pad = span > 0 ? span * 0.06 : Math.abs(max) * 0.05 || 1;
  const lo = min - pad;
  const hi = max + pad;
  const step = niceStep((hi - lo) / Math.max(targetTicks - 1, 1));
  const start = Math.floor(lo / step) * step;
  const end = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  // Rounded through toFixed so 0.1 steps give 0.3, not 0.30000000000000004.
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  for (let v = start; v <= end + step / 2; v += step) ticks.push(Number(v.toFixed(decimals)));
  return { domain: [ticks[0] ?? start, ticks[ticks.length - 1] ?? end], ticks };
}

function niceStep(raw: number): number {
  const power = 10 ** Math.floor(Math.log10(raw));
  const fraction = raw / power;
  const nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
  return nice * power;
}

/** Limits must be finite numbers, with LCL ≤ CL ≤ UCL; a message per problem, empty when fine. */
export function checkLimits(limits: ChartLimits): string[] {
  const problems: string[] = [];
  for (const [name, v] of Object.entries(limits)) {
    if (v !== undefined && (typeof v !== 'number' || !Number.isFinite(v))) problems.push(`${name.toUpperCase()} is not a number.`);
  }
  if (problems.length === 0 && !(limits.lcl <= limits.cl && limits.cl <= limits.ucl)) {
    problems.push('Control limits are out of order: expected LCL ≤ CL ≤ UCL.');
  }
  if (limits.lsl !== undefined && limits.usl !== undefined && limits.lsl > limits.usl) {
    problems.push('Specification limits are out of order: expected LSL ≤ USL.');
  }
  return problems;
}
