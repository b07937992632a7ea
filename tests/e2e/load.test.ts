// The load run, short form (the long one is `npm run load`): platers logging analyses and meter
// readings, estimators pricing, customers listing invoices, all at once against `next start`.
// Every request gets an answer, none fails, and the rows written are exactly the writes the app
// acknowledged. Figures are printed, not asserted: speed targets live in the benchmarks.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_DATABASE_URL } from '../helpers/test-db';
import { APP_URL } from '../helpers/browser';
import { prepareLoadFixture, rowsWritten, type LoadFixture } from '../load/fixture';
import { formatReport, resendUnacknowledged, runMix, type LoadReport } from '../load/mix';

let fixture: LoadFixture;
let report: LoadReport;
const keyPrefix = `load-short-${Date.now().toString(36)}-`;

beforeAll(async () => {
  fixture = await prepareLoadFixture(TEST_DATABASE_URL);
  report = await runMix({ url: APP_URL, fixture, seconds: 8, keyPrefix });
  console.log(`load run, short form (${report.seconds.toFixed(1)} s):\n${formatReport(report)}`);
});

afterAll(() => fixture?.close());

describe('the realistic mix under load', () => {
  it('answers every request, each kind with its success status', () => {
    expect(report.total.errors).toBe(0);
    const expected: Record<string, string[]> = { analysis: ['201'], meter: ['201'], estimate: ['200'], 'invoice list': ['200'] };
    for (const k of report.kinds) {
      expect(k.requests, k.kind).toBeGreaterThan(0);
      expect(Object.keys(k.statuses), `${k.role} ${k.kind}`).toEqual(expected[k.kind]);
    }
    expect(report.kinds.map((k) => k.kind).sort()).toEqual(['analysis', 'estimate', 'invoice list', 'meter']);
  });

  it('writes one row for each write, and nothing else', async () => {
    // The run ends with requests still in flight (at most one per connection): the app may have
    // stored them, but their answers were never read. The device would send them again.
    const cutOff = await resendUnacknowledged(APP_URL, fixture.cookies.plater, report);
    expect(cutOff.resent).toBeLessThanOrEqual(4);
    expect(cutOff.refused).toEqual([]);
    const acknowledged = [...report.writes.values()].filter((w) => w.answers.some((s) => s === 200 || s === 201));
    expect(acknowledged.length).toBe(report.writes.size);
    expect(acknowledged.length).toBeGreaterThan(20);
    const rows = await rowsWritten(TEST_DATABASE_URL, keyPrefix);
    expect(rows.count).toBe(report.writes.size);
    expect([...rows.keys].sort()).toEqual([...report.writes.keys()].sort());
  });
});
