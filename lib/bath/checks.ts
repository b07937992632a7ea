// Input guards shared by the bath and quality domain modules. Every bad number becomes an
// AppError('BAD_INPUT') naming the field, so no NaN or Infinity ever leaves a calculation.
import { AppError } from '../errors';

export function badInput(field: string, message: string): AppError {
  return new AppError('BAD_INPUT', message, { [field]: [message] });
}

type NumberRule = { min?: number; max?: number; positive?: boolean; integer?: boolean };

export function requireNumber(value: unknown, field: string, label: string, rule: NumberRule = {}): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw badInput(field, `${label} must be a number.`);
  }
  if (rule.integer && !Number.isInteger(value)) throw badInput(field, `${label} must be a whole number.`);
  if (rule.positive && value <= 0) throw badInput(field, `${label} must be greater than zero.`);
  if (rule.min !== undefined && value < rule.min) throw badInput(field, `${label} must be at least ${rule.min}.`);
  if (rule.max !== undefined && value > rule.max) throw badInput(field, `${label} must be at most ${rule.max}.`);
  return value;
}

export function optionalNumber(
  value: unknown,
  field: string,
  label: string,
  rule: NumberRule = {},
): number | undefined {
  return value === undefined || value === null ? undefined : requireNumber(value, field, label, rule);
}

/** Guards a computed result: a NaN or infinity here is a bug or an unhandled edge, never output. */
export function finiteResult(value: number, what: string): number {
  if (!Number.isFinite(value)) throw new AppError('BAD_INPUT', `${what} could not be computed from these inputs.`);
  return value;
}
