import { PlatingInputError } from './errors';

// Input checks shared by every calculation. Each takes the field name (as the caller spelt it,
// so a form can put the message beside the right box) and a plain-English label.

function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (value === undefined) return 'nothing';
  return `a ${typeof value}`;
}

function requireNumber(field: string, label: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new PlatingInputError(field, `${label} must be a finite number; got ${describe(value)}.`);
  }
  return value;
}

export function requirePositive(field: string, label: string, value: unknown): number {
  const v = requireNumber(field, label, value);
  if (v <= 0) throw new PlatingInputError(field, `${label} must be greater than 0; got ${v}.`);
  return v;
}

export function requireNonNegative(field: string, label: string, value: unknown): number {
  const v = requireNumber(field, label, value);
  if (v < 0) throw new PlatingInputError(field, `${label} cannot be negative; got ${v}.`);
  return v;
}

export function requirePositiveInteger(field: string, label: string, value: unknown): number {
  const v = requirePositive(field, label, value);
  if (!Number.isSafeInteger(v)) {
    throw new PlatingInputError(field, `${label} must be a whole number; got ${v}.`);
  }
  return v;
}

export function requireNonNegativeInteger(field: string, label: string, value: unknown): number {
  const v = requireNonNegative(field, label, value);
  if (!Number.isSafeInteger(v)) {
    throw new PlatingInputError(field, `${label} must be a whole number; got ${v}.`);
  }
  return v;
}

// A fraction in (0, 1], e.g. a cathode current efficiency of 0.95 (not 95).
export function requireFraction(field: string, label: string, value: unknown): number {
  const v = requireNumber(field, label, value);
  if (v <= 0 || v > 1) {
    const hint = v > 1 && v <= 100 ? ` Enter a fraction: ${v} % is ${v / 100}.` : '';
    throw new PlatingInputError(
      field,
      `${label} must be a fraction greater than 0 and at most 1; got ${v}.${hint}`,
    );
  }
  return v;
}

// A percentage in [0, 100).
export function requirePercent(field: string, label: string, value: unknown): number {
  const v = requireNumber(field, label, value);
  if (v < 0 || v >= 100) {
    throw new PlatingInputError(field, `${label} must be from 0 up to (not including) 100 %; got ${v}.`);
  }
  return v;
}

// Valid inputs can still overflow (1e308 dm² × 25 µm) or underflow to a zero divisor. Rather than
// hand back Infinity or NaN, blame the input whose magnitude is furthest from 1: it is almost
// always the one typed in the wrong unit or with extra zeros.
export function requireFiniteResults(
  results: Record<string, number>,
  inputs: Record<string, number>,
): void {
  for (const [name, value] of Object.entries(results)) {
    if (Number.isFinite(value)) continue;
    let culprit = Object.keys(inputs)[0] ?? name;
    let worst = -1;
    for (const [field, input] of Object.entries(inputs)) {
      const distance = input === 0 ? -1 : Math.abs(Math.log10(Math.abs(input)));
      if (distance > worst) {
        worst = distance;
        culprit = field;
      }
    }
    throw new PlatingInputError(
      culprit,
      `The inputs are outside the range this calculation can represent (${name} would not be a ` +
        `finite number). Check ${culprit}: ${inputs[culprit]} looks out of scale.`,
    );
  }
}
