// Text for prices and dates on screens, PDFs and e-mails. Pure.
import { formatMoney } from '@/components/money';
import type { PricingBasis } from '@/db/types';
import { formatShopDate, formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';
import { BASIS_LABELS } from './basis';

const unitFormat = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', minimumFractionDigits: 2, maximumFractionDigits: 6 });

/** A unit price held in cents with up to 4 decimals: "$1.86632", or "$18.50" when whole cents. */
export function formatUnitPrice(cents: number): string {
  if (!Number.isFinite(cents)) return '—';
  if (Number.isInteger(cents)) return formatMoney(cents);
  return unitFormat.format(cents / 100);
}

const rateFormats = new Map<number, Intl.NumberFormat>();

/**
 * A rate (dollars per kg, lb, hour, kWh …): cents always shown, and four significant figures for
 * rates under a dollar or two, so "$1.724/lb" and "$0.1235/kWh", never "$1.723651/lb".
 */
export function formatRate(cents: number): string {
  if (!Number.isFinite(cents)) return '—';
  const dollars = Math.abs(cents / 100);
  const decimals = dollars === 0 || dollars >= 10 ? 2 : Math.min(6, Math.max(2, 3 - Math.floor(Math.log10(dollars))));
  let f = rateFormats.get(decimals);
  if (!f) {
    f = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', minimumFractionDigits: 2, maximumFractionDigits: decimals });
    rateFormats.set(decimals, f);
  }
  return f.format(cents / 100);
}

export function formatUnitPriceWithBasis(cents: number, basis: PricingBasis): string {
  return `${formatUnitPrice(cents)} ${BASIS_LABELS[basis]}`;
}

/**
 * A day in the shop's own words, e.g. "3 Feb 2027"; fixed locale so server and browser agree.
 * A calendar date ("2027-02-03", or a date column, which arrives as UTC midnight) is that day; any
 * other instant (a timestamp) is the day it was in the shop's zone.
 */
export function formatDay(d: Date | string | null | undefined): string {
  if (!d) return '—';
  const date = typeof d === 'string' ? new Date(d.length === 10 ? `${d}T00:00:00Z` : d) : d;
  if (Number.isNaN(date.getTime())) return '—';
  const calendarDate = date.getTime() % 86_400_000 === 0;
  return formatShopDate(date, calendarDate ? 'UTC' : shopTimeZone());
}

/** An instant in the shop's zone, "3 Feb 2027, 14:05 EST", as the rest of the app writes times. */
export function formatDateTime(d: Date | string | null | undefined): string {
  if (!d) return '—';
  return formatShopTime(d, shopTimeZone());
}
