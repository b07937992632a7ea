import { cx } from './ui/cx';

export type MoneyOptions = {
  /** Fixed by default so server and browser render the same text (no hydration mismatch). */
  locale?: string;
  /** Negative amounts in brackets, as statements and receivables show them. */
  accounting?: boolean;
};

const formatters = new Map<string, Intl.NumberFormat>();

function formatterFor(currency: string, locale: string, accounting: boolean): Intl.NumberFormat {
  const key = `${locale}|${currency}|${accounting ? 'a' : 's'}`;
  let f = formatters.get(key);
  if (!f) {
    // Throws a RangeError naming the code when the currency is not a valid ISO 4217 code.
    f = new Intl.NumberFormat(locale, { style: 'currency', currency, currencySign: accounting ? 'accounting' : 'standard' });
    formatters.set(key, f);
  }
  return f;
}

/**
 * Formats an amount held in the currency's minor unit (cents for USD, yen for JPY). Money is stored
 * and added as integers; this is the only place it becomes a decimal, and only for display.
 */
export function formatMoney(cents: number, currency = 'USD', options: MoneyOptions = {}): string {
  if (!Number.isSafeInteger(cents)) {
    throw new TypeError(`formatMoney expects a whole number of minor units (cents); got ${String(cents)}.`);
  }
  const f = formatterFor(currency.toUpperCase(), options.locale ?? 'en-US', options.accounting ?? false);
  // The currency's own number of decimals, e.g. 2 for USD and EUR, 0 for JPY, 3 for KWD.
  const digits = f.resolvedOptions().maximumFractionDigits ?? 2;
  return f.format(cents / 10 ** digits);
}

export type MoneyProps = MoneyOptions & { cents: number; currency?: string; className?: string };

export function Money({ cents, currency = 'USD', className, ...options }: MoneyProps) {
  return <span className={cx('tabular whitespace-nowrap', className)}>{formatMoney(cents, currency, options)}</span>;
}
