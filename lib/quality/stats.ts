// Summary statistics of coating-thickness readings and pass/fail against the specified limits.
// Pure. The specified thickness is a minimum on significant surfaces (ASTM B633/B700/B545 text,
// reference §6), so each reading is judged on its own, not only the mean.
import { badInput, optionalNumber, requireNumber } from '../bath/checks';

export type ReadingSummary = {
  count: number;
  mean: number;
  min: number;
  max: number;
  /** Sample standard deviation (n − 1); null with fewer than two readings. */
  stdDev: number | null;
};

function readReadings(readings: readonly number[]): number[] {
  if (!Array.isArray(readings) || readings.length === 0) throw badInput('readings', 'Enter at least one reading.');
  return readings.map((r, i) => requireNumber(r, 'readings', `Reading ${i + 1}`));
}

export function summarize(readings: readonly number[]): ReadingSummary {
  const xs = readReadings(readings);
  const n = xs.length;
  // Shifting by the first reading keeps the sums small, so large values with small spread
  // (NIST StRD NumAcc-type data) do not lose digits.
  const shift = xs[0] as number;
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (const x of xs) {
    sum += x - shift;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  const meanShifted = sum / n;
  let ss = 0;
  for (const x of xs) ss += (x - shift - meanShifted) ** 2;
  return { count: n, mean: shift + meanShifted, min, max, stdDev: n < 2 ? null : Math.sqrt(ss / (n - 1)) };
}

export type ReadingStatus = 'pass' | 'below_minimum' | 'above_maximum';

export type ReadingJudgement = { index: number; value: number; status: ReadingStatus };

export type ThicknessJudgement = {
  summary: ReadingSummary;
  readings: ReadingJudgement[];
  passCount: number;
  failCount: number;
  allPass: boolean;
  message: string;
};

export function judgeReadings(readings: readonly number[], limits: { minimum: number; maximum?: number }): ThicknessJudgement {
  const minimum = requireNumber(limits.minimum, 'minimum', 'Minimum thickness', { min: 0 });
  const maximum = optionalNumber(limits.maximum, 'maximum', 'Maximum thickness', { min: 0 });
  if (maximum !== undefined && maximum < minimum) throw badInput('maximum', 'The maximum is below the minimum.');
  const summary = summarize(readings);
  const judged = readReadings(readings).map((value, index): ReadingJudgement => ({
    index,
    value,
    status: value < minimum ? 'below_minimum' : maximum !== undefined && value > maximum ? 'above_maximum' : 'pass',
  }));
  const failCount = judged.filter((r) => r.status !== 'pass').length;
  const below = judged.filter((r) => r.status === 'below_minimum').length;
  const above = failCount - below;
  const message =
    failCount === 0
      ? `All ${judged.length} readings meet the limits.`
      : [below ? `${below} below the minimum ${minimum}` : '', above ? `${above} above the maximum ${maximum}` : '']
          .filter(Boolean)
          .join('; ') + '.';
  return { summary, readings: judged, passCount: judged.length - failCount, failCount, allPass: failCount === 0, message };
}
