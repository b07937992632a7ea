// zod pieces for the record forms (customers, parts, finishes, rates). Form fields arrive as text;
// these turn them into numbers with one clear message each, never NaN.
import { z } from 'zod';

const blank = (v: unknown) => v === undefined || v === null || (typeof v === 'string' && v.trim() === '');

export const uuidField = (what: string) => z.uuid({ error: `Choose ${what}.` });

export const requiredText = (label: string, max: number) =>
  z
    .string({ error: `Enter ${label}.` })
    .trim()
    .min(1, `Enter ${label}.`)
    .max(max, `Use at most ${max} characters.`);

export const optionalText = (max: number) =>
  z.preprocess((v) => (v === undefined || v === null ? '' : v), z.string().trim().max(max, `Use at most ${max} characters.`));

export const checkbox = z.preprocess((v) => v === 'on' || v === 'true' || v === true || v === '1', z.boolean());

type Range = { min?: number; max?: number; positive?: boolean; integer?: boolean };

function numberFrom(label: string, range: Range) {
  return z
    .string()
    .trim()
    .transform((s, ctx) => {
      // Accept "1,250.5" but not "1,25" (a decimal comma would be read as a thousands separator).
      const text = /^-?\d{1,3}(,\d{3})+(\.\d+)?$/.test(s) ? s.replace(/,/g, '') : s;
      if (!/^-?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(text)) {
        ctx.addIssue({ code: 'custom', message: `Enter ${label} as a number.` });
        return z.NEVER;
      }
      const n = Number(text);
      const problem =
        !Number.isFinite(n)
          ? `${label} is too large.`
          : range.integer && !Number.isInteger(n)
            ? `Enter ${label} as a whole number.`
            : range.positive && n <= 0
              ? `${capital(label)} must be more than 0.`
              : range.min !== undefined && n < range.min
                ? `${capital(label)} must be at least ${range.min}.`
                : range.max !== undefined && n > range.max
                  ? `${capital(label)} must be at most ${range.max}.`
                  : null;
      if (problem) {
        ctx.addIssue({ code: 'custom', message: problem });
        return z.NEVER;
      }
      return n;
    });
}

function capital(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** A required number typed as text. */
export const numberField = (label: string, range: Range = {}) =>
  z.preprocess((v) => (typeof v === 'number' ? String(v) : v), z.string({ error: `Enter ${label}.` }).trim().min(1, `Enter ${label}.`).pipe(numberFrom(label, range)));

/** A number that may be left empty (→ null). */
export const optionalNumberField = (label: string, range: Range = {}) =>
  z.preprocess((v) => (blank(v) ? null : typeof v === 'number' ? String(v) : v), numberFrom(label, range).nullable());

/**
 * A decimal typed as text, scaled to a whole number exactly (no floating point): with
 * `decimals` = 2, "7.25" → 725. More decimals than allowed are refused, not rounded.
 */
export function parseScaledDecimal(text: string, decimals: number): number | null {
  const m = /^(\d{1,12})(?:\.(\d*))?$/.exec(text.trim());
  if (!m) return null;
  const frac = m[2] ?? '';
  if (frac.length > decimals) return null;
  return Number(m[1]) * 10 ** decimals + Number(frac.padEnd(decimals, '0') || '0');
}

/** A percentage typed with up to two decimals, stored exactly in basis points ("7.25" % → 725). */
export const percentToBasisPoints = (label: string, maxPercent: number) =>
  z
    .string({ error: `Enter ${label}.` })
    .trim()
    .transform((s) => s.replace(/\s*%$/, ''))
    .transform((s, ctx) => {
      const bp = parseScaledDecimal(s === '' ? '0' : s, 2);
      if (bp === null) {
        ctx.addIssue({ code: 'custom', message: `Enter ${label} as a percentage with at most two decimals, e.g. 7.25.` });
        return z.NEVER;
      }
      if (bp > maxPercent * 100) {
        ctx.addIssue({ code: 'custom', message: `${capital(label)} must be at most ${maxPercent} %.` });
        return z.NEVER;
      }
      return bp;
    });

/** Basis points shown as a percentage for a form field ("725" → "7.25"). */
export function basisPointsToPercentText(bp: number): string {
  const whole = Math.trunc(bp / 100);
  const frac = String(bp % 100).padStart(2, '0').replace(/0+$/, '');
  return frac ? `${whole}.${frac}` : String(whole);
}

/** Cents shown as dollars for a form field (1250 → "12.50"). */
export function centsToDollarText(cents: number): string {
  return `${Math.trunc(cents / 100)}.${String(Math.abs(cents % 100)).padStart(2, '0')}`;
}

/** A number for a form field: four significant figures, no trailing zeros (0.1720 → "0.172"). */
export function plainNumber(n: number | null, significantFigures = 4): string {
  return n === null || !Number.isFinite(n) ? '' : String(Number(n.toPrecision(significantFigures)));
}
