// Individuals (X) control chart with the moving-range sigma estimate, the four Western Electric
// run rules, and capability indices. Pure.
//
// Sources: Western Electric, Statistical Quality Control Handbook (1956), via the NIST/SEMATECH
// e-Handbook §6.3.2 and the StatSoft glossary; d2 = 1.128 for n = 2 (ASTM E2587; Montgomery,
// Introduction to Statistical Quality Control, Appendix table); Cp/Cpk formulas per the SAS
// SHEWHART procedure documentation and ggQC. Control limits come from the process data and are
// not the bath sheet's control range (reference §10.1).
import { badInput, requireNumber } from './checks';

/** d2 for moving ranges of two consecutive points. */
export const D2_N2 = 1.128;
/** D4 for n = 2: the moving-range chart's upper limit is D4 × MR̄. */
export const D4_N2 = 3.267;

export type RuleId = 'we1_beyond_3s' | 'we2_two_of_three_beyond_2s' | 'we3_four_of_five_beyond_1s' | 'we4_run_one_side';

export const RULE_TEXT: Record<RuleId, string> = {
  we1_beyond_3s: 'One point beyond 3σ',
  we2_two_of_three_beyond_2s: 'Two of three consecutive points beyond 2σ on the same side',
  we3_four_of_five_beyond_1s: 'Four of five consecutive points beyond 1σ on the same side',
  we4_run_one_side: 'A run of consecutive points on one side of the centre line',
};

export type ChartPoint = {
  index: number;
  value: number;
  movingRange: number | null;
  /** Distance from the centre line in sigmas. */
  z: number;
  /** 'C' within 1σ, 'B' 1–2σ, 'A' 2–3σ, 'beyond' past 3σ; a point on a zone line counts as inside it. */
  zone: 'C' | 'B' | 'A' | 'beyond';
  side: 'above' | 'below' | 'on';
  rules: RuleId[];
};

export type IndividualsChart = {
  centre: number;
  sigma: number;
  /** How sigma was obtained, stated for the report. */
  sigmaBasis: string;
  mrBar: number | null;
  ucl: number;
  lcl: number;
  mrUcl: number | null;
  zones: { plus1: number; plus2: number; minus1: number; minus2: number };
  points: ChartPoint[];
  warnings: string[];
};

export type ChartOptions = {
  /** Phase II: limits fixed from an earlier baseline rather than this data. */
  centre?: number;
  sigma?: number;
  /** Run length for rule 4: 8 per the handbook; some software uses 9. */
  runLength?: number;
};

function readValues(values: readonly number[], min: number): number[] {
  if (!Array.isArray(values)) throw badInput('values', 'Values must be a list of numbers.');
  values.forEach((v, i) => requireNumber(v, 'values', `Value ${i + 1}`));
  if (values.length < min) throw badInput('values', `At least ${min} values are needed.`);
  return [...values];
}

export function movingRanges(values: readonly number[]): number[] {
  const xs = readValues(values, 2);
  return xs.slice(1).map((x, i) => Math.abs(x - (xs[i] as number)));
}

/** σ̂ = MR̄ / d2 with d2 = 1.128 (moving ranges of span 2). */
export function sigmaFromMovingRange(values: readonly number[]): { mrBar: number; sigma: number } {
  const mr = movingRanges(values);
  const mrBar = mr.reduce((s, x) => s + x, 0) / mr.length;
  return { mrBar, sigma: mrBar / D2_N2 };
}

// Counts the last `n` points (fewer at the start of the series) beyond k sigma on one side.
function countBeyond(zs: number[], end: number, n: number, k: number, sign: 1 | -1): number {
  let count = 0;
  for (let j = Math.max(0, end - n + 1); j <= end; j++) if (sign * (zs[j] as number) > k) count++;
  return count;
}

/** Rules fired at each point; a rule is reported at the point that completes its pattern. */
export function westernElectricRules(zs: readonly number[], runLength = 8): RuleId[][] {
  const run = requireNumber(runLength, 'runLength', 'Run length', { integer: true, min: 2 });
  const z = [...zs];
  return z.map((zi, i) => {
    const fired: RuleId[] = [];
    if (Math.abs(zi) > 3) fired.push('we1_beyond_3s');
    const sign: 1 | -1 = zi >= 0 ? 1 : -1;
    if (sign * zi > 2 && countBeyond(z, i, 3, 2, sign) >= 2) fired.push('we2_two_of_three_beyond_2s');
    if (sign * zi > 1 && countBeyond(z, i, 5, 1, sign) >= 4) fired.push('we3_four_of_five_beyond_1s');
    // A point exactly on the centre line breaks a run.
    if (i >= run - 1 && zi !== 0 && z.slice(i - run + 1, i + 1).every((x) => sign * x > 0)) fired.push('we4_run_one_side');
    return fired;
  });
}

export function individualsChart(values: readonly number[], options: ChartOptions = {}): IndividualsChart {
  const xs = readValues(values, 2);
  const warnings: string[] = [];
  const { mrBar, sigma: mrSigma } = sigmaFromMovingRange(xs);
  const centre =
    options.centre !== undefined
      ? requireNumber(options.centre, 'centre', 'Centre line')
      : xs.reduce((s, x) => s + x, 0) / xs.length;
  const sigma = options.sigma !== undefined ? requireNumber(options.sigma, 'sigma', 'Sigma', { positive: true }) : mrSigma;
  if (!(sigma > 0)) {
    throw badInput('values', 'Every moving range is zero, so sigma cannot be estimated: check the readings or set sigma.');
  }
  if (options.sigma === undefined && xs.length < 20) {
    // Common practice: limits from fewer than about 20 points are provisional.
    warnings.push(`Only ${xs.length} points: treat these limits as provisional.`);
  }
  const zs = xs.map((x) => (x - centre) / sigma);
  const rules = westernElectricRules(zs, options.runLength ?? 8);
  const points: ChartPoint[] = xs.map((x, i) => {
    const z = zs[i] as number;
    const a = Math.abs(z);
    return {
      index: i,
      value: x,
      movingRange: i === 0 ? null : Math.abs(x - (xs[i - 1] as number)),
      z,
      zone: a <= 1 ? 'C' : a <= 2 ? 'B' : a <= 3 ? 'A' : 'beyond',
      side: z > 0 ? 'above' : z < 0 ? 'below' : 'on',
      rules: rules[i] as RuleId[],
    };
  });
  return {
    centre,
    sigma,
    sigmaBasis: options.sigma !== undefined ? 'sigma supplied (baseline)' : `MR̄/d2 = ${mrBar.toPrecision(4)}/1.128`,
    mrBar,
    ucl: centre + 3 * sigma,
    lcl: centre - 3 * sigma,
    mrUcl: D4_N2 * mrBar,
    zones: { plus1: centre + sigma, plus2: centre + 2 * sigma, minus1: centre - sigma, minus2: centre - 2 * sigma },
    points,
    warnings,
  };
}

export type Capability = {
  cp: number | null;
  cpu: number | null;
  cpl: number | null;
  cpk: number;
  mean: number;
  sigma: number;
  sigmaBasis: string;
};

/** Cp = (USL − LSL)/6σ; Cpk = min(Cpu, Cpl); one-sided when only one limit is given. */
export function capability(input: { mean: number; sigma: number; lsl?: number; usl?: number; sigmaBasis?: string }): Capability {
  const mean = requireNumber(input.mean, 'mean', 'Mean');
  const sigma = requireNumber(input.sigma, 'sigma', 'Sigma', { positive: true });
  const lsl = input.lsl === undefined ? undefined : requireNumber(input.lsl, 'lsl', 'Lower specification limit');
  const usl = input.usl === undefined ? undefined : requireNumber(input.usl, 'usl', 'Upper specification limit');
  if (lsl === undefined && usl === undefined) throw badInput('usl', 'Give at least one specification limit.');
  if (lsl !== undefined && usl !== undefined && lsl >= usl) throw badInput('lsl', 'The lower specification limit must be below the upper.');
  const cpu = usl === undefined ? null : (usl - mean) / (3 * sigma);
  const cpl = lsl === undefined ? null : (mean - lsl) / (3 * sigma);
  const cp = lsl !== undefined && usl !== undefined ? (usl - lsl) / (6 * sigma) : null;
  const cpk = Math.min(cpu ?? Infinity, cpl ?? Infinity);
  return { cp, cpu, cpl, cpk, mean, sigma, sigmaBasis: input.sigmaBasis ?? 'sigma supplied' };
}

/** Capability from individual readings, using the within (moving-range) sigma (reference §10.4). */
export function capabilityFromValues(values: readonly number[], limits: { lsl?: number; usl?: number }): Capability {
  const xs = readValues(values, 2);
  const { mrBar, sigma } = sigmaFromMovingRange(xs);
  if (!(sigma > 0)) throw badInput('values', 'Every moving range is zero, so sigma cannot be estimated.');
  const mean = xs.reduce((s, x) => s + x, 0) / xs.length;
  return capability({ mean, sigma, ...limits, sigmaBasis: `within: MR̄/d2 = ${mrBar.toPrecision(4)}/1.128` });
}
