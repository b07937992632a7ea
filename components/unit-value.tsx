import { cx } from './ui/cx';

// U+202F NARROW NO-BREAK SPACE: a thin space that never lets the unit wrap away from its number.
export const UNIT_SPACE = '\u202f';
// Plane-angle marks sit against the number; every other unit, °C and % included, takes a space
// (Source: NIST SP 811, 2008 ed., §7.2 and §7.10.2; section numbers from memory).
const NO_SPACE_UNITS = new Set(['°', '′', '″']);

const formatters = new Map<string, Intl.NumberFormat>();

function numberFormat(digits: number | undefined, locale: string): Intl.NumberFormat {
  const key = `${locale}|${digits ?? 'auto'}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.NumberFormat(
      locale,
      digits === undefined ? { maximumFractionDigits: 3 } : { minimumFractionDigits: digits, maximumFractionDigits: digits },
    );
    formatters.set(key, f);
  }
  return f;
}

export type UnitValueOptions = {
  /** Fixed decimals; by default up to 3, trailing zeros dropped. */
  digits?: number;
  /** Fixed by default so server and browser render the same text. */
  locale?: string;
};

/** Shown when there is no usable number; never "NaN" or "Infinity". */
export const NO_VALUE = '—';

/** "12.5 g/L" as plain text, for grid cells, CSV labels and titles. */
export function formatUnitValue(value: number | null | undefined, unit: string, options: UnitValueOptions = {}): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return NO_VALUE;
  if (options.digits !== undefined && !(Number.isInteger(options.digits) && options.digits >= 0 && options.digits <= 20)) {
    throw new RangeError(`digits must be a whole number from 0 to 20; got ${String(options.digits)}.`);
  }
  const number = numberFormat(options.digits, options.locale ?? 'en-US').format(value);
  if (!unit) return number;
  return NO_SPACE_UNITS.has(unit) ? `${number}${unit}` : `${number}${UNIT_SPACE}${unit}`;
}

export type UnitValueProps = UnitValueOptions & {
  value: number | null | undefined;
  unit: string;
  className?: string;
};

/** A quantity with its unit, in tabular figures; a missing value reads "no value" to screen readers. */
export function UnitValue({ value, unit, digits, locale, className }: UnitValueProps) {
  const text = formatUnitValue(value, unit, { digits, locale });
  if (text === NO_VALUE) {
    return (
      <span className={cx('tabular text-ink-faint', className)}>
        <span aria-hidden="true">{NO_VALUE}</span>
        <span className="sr-only">no value</span>
      </span>
    );
  }
  return <span className={cx('tabular whitespace-nowrap', className)}>{text}</span>;
}
