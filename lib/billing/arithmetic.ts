// Invoice arithmetic. Pure: no I/O, safe to import from client components (the issue form shows
// the same totals the server will compute).
import type { InvoiceStatus } from '@/db/types';
import { AppError } from '@/lib/errors';

/**
 * The rounding rule, stated once. It is printed on every invoice, and every amount on an invoice
 * is computed by the functions below.
 */
export const ROUNDING_RULE =
  'Quantities are taken to 4 decimal places of their pricing unit and unit prices to 4 decimal places of a cent. ' +
  'Each line is quantity × unit price, rounded half-up to the cent. Tax is the tax rate applied to the subtotal, ' +
  'rounded half-up to the cent.';

const FOUR_PLACES = 10_000;
const FOUR_PLACES_N = 10_000n;

/** A non-negative decimal as an exact count of ten-thousandths (e.g. 12.3456 → 123456). */
export function toTenThousandths(value: number, what: string): bigint {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new AppError('BAD_INPUT', `${what} must be a finite number of at least zero; got ${String(value)}.`);
  }
  // toPrecision strips binary noise such as 1234.4999999999998 before rounding to whole units.
  const scaled = Math.round(Number((value * FOUR_PLACES).toPrecision(15)));
  if (!Number.isSafeInteger(scaled)) throw new AppError('BAD_INPUT', `${what} is too large.`);
  return BigInt(scaled);
}

/** Rounds a non-negative value to 4 decimal places, the precision quantities are stored in. */
export function toFourPlaces(value: number, what = 'The quantity'): number {
  return Number(toTenThousandths(value, what)) / FOUR_PLACES;
}

/** numerator / denominator rounded half-up, for non-negative integers. */
function divideHalfUp(numerator: bigint, denominator: bigint): bigint {
  return (numerator * 2n + denominator) / (denominator * 2n);
}

function toSafeCents(value: bigint, what: string): number {
  const n = Number(value);
  if (!Number.isSafeInteger(n)) throw new AppError('BAD_INPUT', `${what} is too large to bill.`);
  return n;
}

/** quantity × unit price (cents, 4 decimals), rounded half-up to the cent. */
export function lineAmountCents(quantity: number, unitPriceCents: number): number {
  const q = toTenThousandths(quantity, 'The quantity');
  const p = toTenThousandths(unitPriceCents, 'The unit price');
  return toSafeCents(divideHalfUp(q * p, FOUR_PLACES_N * FOUR_PLACES_N), 'The line amount');
}

/** The tax on a subtotal at a rate in basis points (725 = 7.25 %), rounded half-up to the cent. */
export function taxCents(subtotalCents: number, taxRateBp: number): number {
  if (!Number.isSafeInteger(subtotalCents) || subtotalCents < 0) {
    throw new AppError('BAD_INPUT', `A subtotal must be a whole number of cents, at least 0; got ${String(subtotalCents)}.`);
  }
  if (!Number.isInteger(taxRateBp) || taxRateBp < 0 || taxRateBp > 10_000) {
    throw new AppError('BAD_INPUT', `A tax rate must be whole basis points from 0 to 10000; got ${String(taxRateBp)}.`);
  }
  return toSafeCents(divideHalfUp(BigInt(subtotalCents) * BigInt(taxRateBp), 10_000n), 'The tax');
}

export type PricedLine = { quantity: number; unitPriceCents: number };
export type InvoiceTotals = { lineAmounts: number[]; subtotalCents: number; taxCents: number; totalCents: number };

export function invoiceTotals(lines: readonly PricedLine[], taxRateBp: number): InvoiceTotals {
  const lineAmounts = lines.map((l) => lineAmountCents(l.quantity, l.unitPriceCents));
  const subtotalCents = lineAmounts.reduce((s, a) => s + a, 0);
  if (!Number.isSafeInteger(subtotalCents)) throw new AppError('BAD_INPUT', 'The subtotal is too large to bill.');
  const tax = taxCents(subtotalCents, taxRateBp);
  return { lineAmounts, subtotalCents, taxCents: tax, totalCents: subtotalCents + tax };
}

export type Balance = { totalCents: number; paidCents: number; creditedCents: number };

/** What the customer still owes; below zero when they have paid more than is due. */
export function openBalanceCents(b: Balance): number {
  return b.totalCents - b.creditedCents - b.paidCents;
}

/** Money received on an invoice beyond what it asks: the customer's credit on account. */
export function excessCents(b: Balance): number {
  return Math.max(0, -openBalanceCents(b));
}

/** The status follows from the amounts alone, so replayed or reordered events cannot skew it. */
export function invoiceStatus(b: Balance): InvoiceStatus {
  const open = openBalanceCents(b);
  if (b.paidCents > 0) return open < 0 ? 'overpaid' : open === 0 ? 'paid' : 'partly_paid';
  if (b.creditedCents > 0 && open <= 0) return 'credited';
  // A zero invoice (rework at no charge only) has nothing due.
  return open <= 0 ? 'paid' : 'issued';
}

export const STATUS_WORDS: Record<InvoiceStatus, string> = {
  issued: 'Issued',
  partly_paid: 'Partly paid',
  paid: 'Paid',
  overpaid: 'Overpaid',
  credited: 'Credited',
};

/** A tax rate for display: 725 → "7.25 %". */
export function formatTaxRate(bp: number): string {
  return `${(bp / 100).toFixed(2).replace(/\.?0+$/, '')} %`;
}
