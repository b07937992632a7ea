// The run rules judged when a reading is logged: the Western Electric rules (lib/bath/spc) on the
// analyte's recent history, reported for the newest point only. Pure.
import { AppError } from '../errors';
import { individualsChart, RULE_TEXT, type RuleId } from './spc';

/** How many recent points (the new one included) the rules look at. */
export const RULE_WINDOW = 30;
/**
 * Below this many points sigma is too uncertain to raise an alert on (common practice; the chart
 * itself calls limits from fewer than about 20 points provisional).
 */
export const RULE_MIN_POINTS = 12;

/** Rules that fire at the last value of `values` (oldest first), judged within the last RULE_WINDOW. */
export function rulesAtLast(values: readonly number[], options: { minPoints?: number; window?: number } = {}): RuleId[] {
  const window = values.slice(-(options.window ?? RULE_WINDOW));
  if (window.length < (options.minPoints ?? RULE_MIN_POINTS)) return [];
  try {
    const chart = individualsChart(window);
    return chart.points[chart.points.length - 1]?.rules ?? [];
  } catch (e) {
    // Every moving range zero (identical readings): no sigma, so no rule can be judged.
    if (e instanceof AppError) return [];
    throw e;
  }
}

export function describeRules(rules: readonly RuleId[]): string {
  return rules.map((r) => RULE_TEXT[r]).join('; ');
}

export function isRuleId(s: string): s is RuleId {
  return Object.prototype.hasOwnProperty.call(RULE_TEXT, s);
}
