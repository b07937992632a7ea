// Judges one analysis value against a bath's limits. Pure.
//
// Control limits are the shop's working band; specification limits (optional) are the hard
// limits from the supplier or the customer. Crossing a specification limit is worse than
// crossing a control limit, and the verdict names the limit that was crossed.
//
// "Near limit" means inside the control band but within 10 % of the band's width of either
// control limit. That margin is common practice for an early warning, not a published rule;
// it is a parameter so a shop can change it.
import { badInput, optionalNumber, requireNumber } from './checks';

export const NEAR_LIMIT_FRACTION = 0.1;

export type Limits = {
  target?: number;
  lowerControl?: number;
  upperControl?: number;
  lowerSpec?: number;
  upperSpec?: number;
};

export type LimitName = 'lower_spec' | 'upper_spec' | 'lower_control' | 'upper_control';
export type VerdictStatus = 'in_range' | 'near_limit' | 'out_of_range';

export type Verdict = {
  status: VerdictStatus;
  /** The limit that was crossed (out_of_range) or approached (near_limit). */
  limit: LimitName | null;
  outOfSpec: boolean;
  /** 0 in range, 1 near a limit, 2 out of control, 3 out of specification. */
  severity: 0 | 1 | 2 | 3;
  message: string;
};

const LABEL: Record<LimitName, string> = {
  lower_spec: 'lower specification limit',
  upper_spec: 'upper specification limit',
  lower_control: 'lower control limit',
  upper_control: 'upper control limit',
};

/** Checks the limits are numbers and nested: spec outside control, lower below upper, target inside. */
export function validateLimits(limits: Limits): Limits {
  const l = {
    target: optionalNumber(limits.target, 'target', 'Target'),
    lowerControl: optionalNumber(limits.lowerControl, 'lowerControl', 'Lower control limit'),
    upperControl: optionalNumber(limits.upperControl, 'upperControl', 'Upper control limit'),
    lowerSpec: optionalNumber(limits.lowerSpec, 'lowerSpec', 'Lower specification limit'),
    upperSpec: optionalNumber(limits.upperSpec, 'upperSpec', 'Upper specification limit'),
  };
  const lower = l.lowerControl ?? l.lowerSpec;
  const upper = l.upperControl ?? l.upperSpec;
  if (lower === undefined && upper === undefined) throw badInput('limits', 'Set at least one control or specification limit.');
  if (lower !== undefined && upper !== undefined && lower > upper) {
    throw badInput('lowerControl', 'The lower limit is above the upper limit.');
  }
  if (l.lowerSpec !== undefined && l.lowerControl !== undefined && l.lowerSpec > l.lowerControl) {
    throw badInput('lowerSpec', 'The lower specification limit must not be inside the control band.');
  }
  if (l.upperSpec !== undefined && l.upperControl !== undefined && l.upperSpec < l.upperControl) {
    throw badInput('upperSpec', 'The upper specification limit must not be inside the control band.');
  }
  if (l.target !== undefined && ((lower !== undefined && l.target < lower) || (upper !== undefined && l.target > upper))) {
    throw badInput('target', 'The target must lie between the limits.');
  }
  return l;
}

function margin(limit: number, other: number | undefined, target: number | undefined, fraction: number): number {
  if (other !== undefined) return Math.abs(other - limit) * fraction;
  // One-sided band (a contaminant with only a maximum, say): measure from the target instead.
  if (target !== undefined && target !== limit) return Math.abs(target - limit) * fraction;
  return Math.abs(limit) * fraction;
}

/** A figure as the verdict says it: four significant figures (as the screens round an analyte), with its unit. */
function said(x: number, unit: string | undefined): string {
  const n = x === 0 || !Number.isFinite(x) ? x : Number(x.toPrecision(4));
  return unit ? `${n} ${unit}` : String(n);
}

export function judgeValue(value: number, limits: Limits, options: { nearFraction?: number; unit?: string } = {}): Verdict {
  const v = requireNumber(value, 'value', 'The value');
  const fraction = requireNumber(options.nearFraction ?? NEAR_LIMIT_FRACTION, 'nearFraction', 'Near-limit fraction', {
    min: 0,
    max: 0.5,
  });
  const l = validateLimits(limits);
  const out = (limit: LimitName, side: 'below' | 'above', bound: number): Verdict => {
    const outOfSpec = limit === 'lower_spec' || limit === 'upper_spec';
    return {
      status: 'out_of_range',
      limit,
      outOfSpec,
      severity: outOfSpec ? 3 : 2,
      message: `${said(v, options.unit)} is ${side} the ${LABEL[limit]} (${said(bound, options.unit)}).`,
    };
  };

  if (l.lowerSpec !== undefined && v < l.lowerSpec) return out('lower_spec', 'below', l.lowerSpec);
  if (l.upperSpec !== undefined && v > l.upperSpec) return out('upper_spec', 'above', l.upperSpec);
  // Without control limits the specification limits serve as the band.
  const lowerName: LimitName = l.lowerControl !== undefined ? 'lower_control' : 'lower_spec';
  const upperName: LimitName = l.upperControl !== undefined ? 'upper_control' : 'upper_spec';
  const lower = l.lowerControl ?? l.lowerSpec;
  const upper = l.upperControl ?? l.upperSpec;
  if (lower !== undefined && v < lower) return out(lowerName, 'below', lower);
  if (upper !== undefined && v > upper) return out(upperName, 'above', upper);

  const distLower = lower === undefined ? Infinity : v - lower;
  const distUpper = upper === undefined ? Infinity : upper - v;
  const nearLower = lower !== undefined && distLower <= margin(lower, upper, l.target, fraction);
  const nearUpper = upper !== undefined && distUpper <= margin(upper, lower, l.target, fraction);
  if (nearLower || nearUpper) {
    const useLower = nearLower && (!nearUpper || distLower <= distUpper);
    const limit = useLower ? lowerName : upperName;
    const bound = (useLower ? lower : upper) as number;
    return { status: 'near_limit', limit, outOfSpec: false, severity: 1, message: `${said(v, options.unit)} is close to the ${LABEL[limit]} (${said(bound, options.unit)}).` };
  }
  return { status: 'in_range', limit: null, outOfSpec: false, severity: 0, message: `${said(v, options.unit)} is within limits.` };
}
