// Invoice arithmetic on invented figures; every expected value is worked out by hand in the comment
// beside it, following the rounding rule stated in lib/billing/arithmetic.ts.
import { describe, expect, it } from 'vitest';
import {
  formatTaxRate,
  invoiceStatus,
  invoiceTotals,
  lineAmountCents,
  openBalanceCents,
  taxCents,
  toFourPlaces,
} from '@/lib/billing/arithmetic';
import { AppError } from '@/lib/errors';

describe('line amounts (quantity × unit price, half-up to the cent)', () => {
  it('multiplies exactly when no rounding is needed', () => {
    // 1250 pc × 18.5 ¢ = 23 125 ¢
    expect(lineAmountCents(1250, 18.5)).toBe(23_125);
  });

  it('rounds a half cent up and anything below a half down', () => {
    expect(lineAmountCents(3, 12.5)).toBe(38); // 37.5 ¢ → 38 ¢
    expect(lineAmountCents(2, 0.25)).toBe(1); // 0.5 ¢ → 1 ¢
    expect(lineAmountCents(1, 0.4999)).toBe(0); // 0.4999 ¢ → 0 ¢
    expect(lineAmountCents(0.5, 1850.005)).toBe(925); // 925.0025 ¢ → 925 ¢
  });

  it('uses the 4-decimal unit price in full', () => {
    // 24.5 hundreds × 1234.5678 ¢ = 29 629.6272 + 617.2839 = 30 246.9111 ¢ → 30 247 ¢
    expect(lineAmountCents(24.5, 1234.5678)).toBe(30_247);
  });

  it('is not fooled by binary floating point at an exact half', () => {
    // 100 × 1.005 ¢ is exactly 100.5 ¢ → 101 ¢; in binary floating point 100 * 1.005 is 100.49999999999999.
    expect(100 * 1.005).toBeLessThan(100.5);
    expect(lineAmountCents(100, 1.005)).toBe(101);
  });

  it('refuses negative or non-finite input with a clear message', () => {
    expect(() => lineAmountCents(-1, 10)).toThrow(AppError);
    expect(() => lineAmountCents(1, Number.NaN)).toThrow(/unit price must be a finite number/);
    expect(() => lineAmountCents(Number.POSITIVE_INFINITY, 1)).toThrow(/quantity must be a finite number/);
  });
});

describe('tax on the subtotal (basis points, half-up to the cent)', () => {
  it('computes 7.25 % of a subtotal', () => {
    // 30 247 ¢ × 0.0725 = 2192.9075 ¢ → 2193 ¢
    expect(taxCents(30_247, 725)).toBe(2193);
  });
  it('rounds a half cent of tax up', () => {
    // 200 ¢ × 0.0725 = 14.5 ¢ → 15 ¢
    expect(taxCents(200, 725)).toBe(15);
  });
  it('is zero at a zero rate and refuses rates outside 0–10000 bp', () => {
    expect(taxCents(123_456, 0)).toBe(0);
    expect(() => taxCents(100, 10_001)).toThrow(/basis points from 0 to 10000/);
    expect(() => taxCents(100.5, 725)).toThrow(/whole number of cents/);
  });
});

describe('invoice totals', () => {
  it('adds rounded lines, then taxes the subtotal once', () => {
    const t = invoiceTotals(
      [
        { quantity: 1250, unitPriceCents: 18.5 }, // 23 125 ¢
        { quantity: 24.5, unitPriceCents: 1234.5678 }, // 30 247 ¢
        { quantity: 1, unitPriceCents: 7500 }, // rush: 7 500 ¢
        { quantity: 1, unitPriceCents: 0 }, // rework at no charge: 0 ¢
      ],
      725,
    );
    expect(t.lineAmounts).toEqual([23_125, 30_247, 7_500, 0]);
    // subtotal 23 125 + 30 247 + 7 500 = 60 872 ¢; tax 60 872 × 0.0725 = 4413.22 ¢ → 4413 ¢; total 65 285 ¢
    expect(t.subtotalCents).toBe(60_872);
    expect(t.taxCents).toBe(4413);
    expect(t.totalCents).toBe(65_285);
  });

  it('is different from rounding only the total (the rule is applied per line)', () => {
    // Three lines of 1 × 0.5 ¢: each rounds to 1 ¢, so 3 ¢; the unrounded sum would be 1.5 ¢ → 2 ¢.
    expect(invoiceTotals([0, 1, 2].map(() => ({ quantity: 1, unitPriceCents: 0.5 })), 0).subtotalCents).toBe(3);
  });

  it('takes quantities to 4 decimal places', () => {
    expect(toFourPlaces(51.85272406588321)).toBe(51.8527);
    expect(toFourPlaces(9.848978031289395)).toBe(9.849);
  });
});

describe('open balance and status', () => {
  const total = 10_000;
  it.each([
    [0, 0, 'issued', 10_000],
    [4_000, 0, 'partly_paid', 6_000],
    [10_000, 0, 'paid', 0],
    [12_000, 0, 'overpaid', -2_000], // 20.00 more than asked: the customer's credit on account
    [0, 10_000, 'credited', 0],
    [7_000, 3_000, 'paid', 0],
    [0, 3_000, 'issued', 7_000],
  ] as const)('paid %i and credited %i of 10 000 ¢ is %s with %i ¢ open', (paid, credited, status, open) => {
    const b = { totalCents: total, paidCents: paid, creditedCents: credited };
    expect(invoiceStatus(b)).toBe(status);
    expect(openBalanceCents(b)).toBe(open);
  });

  it('treats a zero invoice (rework only) as having nothing due', () => {
    expect(invoiceStatus({ totalCents: 0, paidCents: 0, creditedCents: 0 })).toBe('paid');
  });
});

describe('tax rate text', () => {
  it('shows basis points as a percentage without trailing zeros', () => {
    expect(formatTaxRate(725)).toBe('7.25 %');
    expect(formatTaxRate(600)).toBe('6 %');
    expect(formatTaxRate(750)).toBe('7.5 %');
    expect(formatTaxRate(0)).toBe('0 %');
  });
});
