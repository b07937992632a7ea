// Receivables aging on invented invoices; days past due are counted by hand on the calendar.
import { describe, expect, it } from 'vitest';
import { ageReceivables, agingBucket } from '@/lib/billing/aging';
import { addDaysIso, daysBetweenIso, isIsoDate } from '@/lib/billing/dates';

describe('aging buckets', () => {
  it.each([
    [-15, 'current'],
    [0, 'current'], // due today is not yet late
    [1, 'days_1_30'],
    [30, 'days_1_30'],
    [31, 'days_31_60'],
    [60, 'days_31_60'],
    [61, 'days_61_90'],
    [90, 'days_61_90'],
    [91, 'over_90'],
    [400, 'over_90'],
  ] as const)('%i days past due is %s', (days, bucket) => {
    expect(agingBucket(days)).toBe(bucket);
  });

  it('refuses a fractional day count', () => {
    expect(() => agingBucket(1.5)).toThrow(/whole number/);
  });
});

describe('calendar days', () => {
  it('counts across month ends and a leap day', () => {
    // Gregorian calendar: 2024 is a leap year (divisible by 4, not by 100), so Feb 2024 has 29 days.
    expect(daysBetweenIso('2024-02-28', '2024-03-01')).toBe(2);
    expect(daysBetweenIso('2026-02-28', '2026-03-01')).toBe(1);
    // 1 Apr → 30 Jun: 29 (rest of April) + 31 (May) + 30 (June) = 90
    expect(daysBetweenIso('2026-04-01', '2026-06-30')).toBe(90);
    expect(addDaysIso('2026-12-15', 30)).toBe('2027-01-14');
    expect(isIsoDate('2026-02-29')).toBe(false);
    expect(isIsoDate('2024-02-29')).toBe(true);
  });
});

describe('receivables report', () => {
  const asOf = '2026-06-30';
  const inv = (number: string, customer: 'X' | 'Y', dueOn: string, openCents: number) => ({
    invoiceId: number,
    number,
    customerId: customer,
    customerName: customer === 'X' ? 'Customer X' : 'Customer Y',
    dueOn,
    openCents,
  });
  const report = ageReceivables(
    [
      inv('A', 'X', '2026-07-15', 10_000), // 15 days before due → current
      inv('B', 'Y', '2026-06-30', 5_000), // due today → current
      inv('C', 'X', '2026-06-29', 2_000), // 1 day → 1–30
      inv('D', 'Y', '2026-05-31', 3_000), // 31 May → 30 Jun = 30 days → 1–30
      inv('E', 'X', '2026-05-30', 4_000), // 31 days → 31–60
      inv('F', 'Y', '2026-04-01', 7_000), // 90 days → 61–90
      inv('G', 'X', '2026-03-31', 1_100), // 91 days → over 90
      inv('H', 'X', '2026-01-01', 0), // paid: left out
      inv('I', 'Y', '2026-01-01', -500), // overpaid: left out
    ],
    asOf,
  );

  it('puts each open invoice in its bucket and leaves out settled ones', () => {
    expect(report.invoices.map((i) => [i.number, i.daysPastDue, i.bucket])).toEqual([
      ['G', 91, 'over_90'],
      ['F', 90, 'days_61_90'],
      ['E', 31, 'days_31_60'],
      ['D', 30, 'days_1_30'],
      ['C', 1, 'days_1_30'],
      ['B', 0, 'current'],
      ['A', -15, 'current'],
    ]);
  });

  it('totals each bucket and the whole', () => {
    // current 10 000 + 5 000; 1–30: 2 000 + 3 000; 31–60: 4 000; 61–90: 7 000; over 90: 1 100
    expect(report.totals).toEqual({ current: 15_000, days_1_30: 5_000, days_31_60: 4_000, days_61_90: 7_000, over_90: 1_100 });
    expect(report.totalCents).toBe(32_100);
  });

  it('totals each customer, largest balance first', () => {
    expect(report.customers).toEqual([
      // X: A 10 000 + C 2 000 + E 4 000 + G 1 100 = 17 100
      { customerId: 'X', customerName: 'Customer X', totals: { current: 10_000, days_1_30: 2_000, days_31_60: 4_000, days_61_90: 0, over_90: 1_100 }, totalCents: 17_100 },
      // Y: B 5 000 + D 3 000 + F 7 000 = 15 000
      { customerId: 'Y', customerName: 'Customer Y', totals: { current: 5_000, days_1_30: 3_000, days_31_60: 0, days_61_90: 7_000, over_90: 0 }, totalCents: 15_000 },
    ]);
  });
});
