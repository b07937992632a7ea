// Text for prices and dates on screens, PDFs and e-mails. Pure.
import { formatMoney } from '@/components/money';
import type { PricingBasis } from '@/db/types';
import { BASIS_LABELS } from './basis';

const unitFormat = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', minimumFractionDigits: 2, maximumFractionDigits: 6 });

/** A unit price held in cents with up to 4 decimals: "$1.86632", or "$18.50" when whole cents. */
export function formatUnitPrice(cents: number): string {
  if (!Number.isFinite(cents)) return '—';
  if (Number.isInteger(cents)) return formatMoney(cents);
  return unitFormat.format(cents / 100);
}

export function formatUnitPriceWithBasis(cents: number, basis: PricingBasis): string {
  return `${formatUnitPrice(cents)} ${BASIS_LABELS[basis]}`;
}

/** A calendar day in the shop's own words, e.g. "3 Feb 2027"; fixed locale so server and browser agree. */
export function formatDay(d: Date | string | null | undefined): string {
  if (!d) return '—';
  const date = typeof d === 'string' ? new Date(d.length === 10 ? `${d}T00:00:00Z` : d) : d;
  if (Number.isNaN(date.getTime())) return '—';
  return date.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
}

export function formatDateTime(d: Date | null | undefined): string {
  if (!d) return '—';
  return `${formatDay(d)} ${d.toISOString().slice(11, 16)} UTC`;
}
