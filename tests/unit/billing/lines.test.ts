// Invoice lines priced as the order was: the accepted unit price per pricing basis, applied to the
// quantity shipped. Conversion factors: NIST SP 811 Appendix B.8 (1 lb = 0.45359237 kg exactly,
// 1 ft² = 0.09290304 m² exactly, so 1 ft² = 9.290304 dm²).
import { describe, expect, it } from 'vitest';
import { draftInvoice, extraLine, orderLine, shippedBasisQuantity, type InvoiceableOrder } from '@/lib/billing/lines';
import { reminderStageFor } from '@/lib/billing/reminder-stages';

const order = (over: Partial<InvoiceableOrder>): InvoiceableOrder => ({
  id: '00000000-0000-4000-8000-000000000001',
  number: 'W2026-00042',
  poNumber: 'PO-7788',
  quantityShipped: 2450,
  unitPriceCents: 100,
  pricingBasis: 'piece',
  partNumber: 'HX-0816',
  partRevision: 'C',
  finishName: 'Zinc, clear',
  areaPerPartDm2: 0.0915,
  weightPerPartG: 9.6,
  partsPerLoad: 2000,
  ...over,
});

describe('quantity shipped in the pricing unit', () => {
  it.each([
    ['piece', 2450], // 2450 pc
    ['hundred', 24.5], // 2450 / 100
    ['kg', 23.52], // 2450 × 9.6 g = 23 520 g = 23.52 kg
    ['lb', 51.8527], // 23 520 g / 453.59237 g/lb = 51.85272… lb → 4 places
    ['dm2', 224.175], // 2450 × 0.0915 dm²
    ['load', 2], // 2450 pc at 2000 per load → 2 loads (a part load is a load)
  ] as const)('per %s: %d', (basis, expected) => {
    expect(shippedBasisQuantity(order({ pricingBasis: basis }))).toBe(expected);
  });

  it('per ft²', () => {
    // 1000 × 0.0915 dm² = 91.5 dm²; 91.5 / 9.290304 = 9.848978… ft² → 9.849
    expect(shippedBasisQuantity(order({ pricingBasis: 'ft2', quantityShipped: 1000 }))).toBe(9.849);
  });

  it('refuses an order with nothing shipped, or weight pricing without a weight', () => {
    expect(() => shippedBasisQuantity(order({ quantityShipped: 0 }))).toThrow(/no shipped quantity/);
    expect(() => shippedBasisQuantity(order({ pricingBasis: 'kg', weightPerPartG: null }))).toThrow(/W2026-00042: .*no weight/);
  });
});

describe('lines and draft invoice', () => {
  it('describes the order and prices the shipped quantity', () => {
    const l = orderLine(order({ pricingBasis: 'hundred', unitPriceCents: 1850 }));
    expect(l).toMatchObject({ kind: 'work_order', quantity: 24.5, unit: '100 pc', unitPriceCents: 1850 });
    expect(l.description).toContain('W2026-00042');
    expect(l.description).toContain('PO PO-7788');
  });

  it('bills rework at no charge whatever price was typed', () => {
    expect(extraLine({ kind: 'rework', description: 'Strip and replate 12 pc', quantity: 1, unitPriceCents: 5000 }).unitPriceCents).toBe(0);
    expect(() => extraLine({ kind: 'rush', description: '  ', quantity: 1, unitPriceCents: 100 })).toThrow(/needs a description/);
  });

  it('totals orders and extras together', () => {
    // 24.5 × 1850 ¢ = 45 325 ¢; rush 1 × 7 500 ¢; subtotal 52 825 ¢; tax 6 % = 3169.5 ¢ → 3170 ¢
    const d = draftInvoice(
      [order({ pricingBasis: 'hundred', unitPriceCents: 1850 })],
      [{ kind: 'rush', description: 'Rush surcharge', quantity: 1, unitPriceCents: 7500 }],
      600,
    );
    expect(d.totals).toEqual({ lineAmounts: [45_325, 7_500], subtotalCents: 52_825, taxCents: 3170, totalCents: 55_995 });
  });
});

describe('overdue reminder stages', () => {
  it.each([
    [0, null],
    [1, 'overdue_1'],
    [14, 'overdue_1'],
    [15, 'overdue_15'],
    [45, 'overdue_30'],
    [60, 'overdue_60'],
    [200, 'overdue_60'],
  ] as const)('%i days past due → %s', (days, stage) => {
    expect(reminderStageFor(days)).toBe(stage);
  });
});
