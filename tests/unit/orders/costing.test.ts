import { describe, expect, it } from 'vitest';
import { actualCost, compareCosts } from '@/lib/orders/costing';
import { groupVariance } from '@/lib/orders/variance';
import type { PricingRates } from '@/lib/quotes/pricing';

const rates: PricingRates = {
  labourPerHourCents: 4200, tankHourRackCents: 3500, tankHourBarrelCents: 2800, metalPerKgCents: { Ni: 2200 }, additivesPerKahCents: 180,
  powerPerKwhCents: 14, bakePerLoadCents: 4500, lotChargeCents: 3500, minimumChargeCents: 12500, rushMultiplierPct: 150, marginPct: 35,
};

const job = {
  element: 'Ni', ionCharge: 2, method: 'rack' as const, tankVolts: 6, handlingMinutesPerLoad: 15, maskingPerPieceCents: 10, areaPerPartDm2: 1,
  quantityReceived: 10, bakeApplies: false, rectifierEfficiency: 0.85, dragOutLPerM2: 0.05,
};

describe('actualCost from the runs, by hand', () => {
  // One rack load of 10 parts × 1 dm², 100 A·h in 1 h, tank at 95 %, bath 70 g/L nickel.
  const a = actualCost(job, [{ ampHours: 100, loads: 1, partsPerLoad: 10, hours: 1, tankEfficiency: 0.95, bathMetalGPerL: 70 }], rates);
  const cents = Object.fromEntries(a.components.map((c) => [c.key, c.cents]));

  it('costs each line half-up to whole cents', () => {
    expect(cents).toEqual({
      // Deposit 100 A·h × 1.094 966 g/(A·h) (reference §1.2) × 0.95 = 104.022 g; drag-out 0.05 L/m² × 0.1 m² × 70 g/L = 0.35 g;
      // 0.104 372 kg × 2200 ¢ = 229.62 ¢ → 230.
      metal: 230,
      additives: 18, // 0.1 kA·h × 180 ¢
      power: 10, // 6 V × 100 A·h ÷ 1000 ÷ 0.85 = 0.705 88 kWh × 14 ¢ = 9.88 ¢
      labour: 1050, // 1 load × 15 min × 4200 ¢/h
      tankTime: 3500, // 1 h × 3500 ¢ (rack)
      masking: 100, // 10 received × 10 ¢
      bake: 0,
    });
    expect(a.subtotalCents).toBe(4908);
    expect([a.ampHours, a.loads, a.tankHours]).toEqual([100, 1, 1]);
  });

  it('compares with the quote and states the margin realised', () => {
    const quoted = { subtotalCents: 5000, components: a.components.map((c) => ({ ...c, cents: c.key === 'tankTime' ? 3592 : c.cents })) };
    const c = compareCosts(10000, quoted, a);
    expect([c.quotedCostCents, c.actualCostCents, c.varianceCents]).toEqual([5000, 4908, -92]);
    expect([c.quotedMarginCents, c.realisedMarginCents, c.realisedMarginPct]).toEqual([5000, 5092, 50.9]);
    expect(c.rows.find((r) => r.key === 'tankTime')).toMatchObject({ quotedCents: 3592, actualCents: 3500 });
  });

  it('costs nothing measured before any run, and copes with a missing quote', () => {
    const none = actualCost(job, [], rates);
    expect(none.subtotalCents).toBe(100); // masking only
    expect(compareCosts(0, null, none).realisedMarginPct).toBeNull();
  });
});

describe('groupVariance', () => {
  const row = (customer: string, month: string, price: number, quoted: number, actual: number) => ({
    customer, finish: 'NI', month,
    comparison: { priceCents: price, quotedCostCents: quoted, actualCostCents: actual, varianceCents: actual - quoted, quotedMarginCents: price - quoted, realisedMarginCents: price - actual, realisedMarginPct: null, rows: [] },
  });

  it('sums by the chosen key and states the margin share of the price', () => {
    const g = groupVariance([row('B', '2026-10', 1000, 600, 700), row('A', '2026-10', 2000, 1000, 900), row('B', '2026-11', 1000, 600, 500)], 'customer');
    expect(g.map((x) => [x.key, x.orders, x.priceCents, x.actualCostCents, x.varianceCents, x.realisedMarginPct])).toEqual([
      ['A', 1, 2000, 900, -100, 55],
      ['B', 2, 2000, 1200, 0, 40],
    ]);
    expect(groupVariance([row('B', '2026-10', 0, 0, 10)], 'month')[0]!.realisedMarginPct).toBeNull();
  });
});
