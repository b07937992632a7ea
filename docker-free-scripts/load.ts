// The long load run: `bash docker-free-scripts/load.sh [seconds]` starts what it needs and calls
// this with the app's URL and database. Prints requests/s and latency per kind of request, then
// checks that every write the app acknowledged is exactly one row and that nothing else was written.
import { startRoundRobin } from '../tests/helpers/round-robin';
import { prepareLoadFixture, rowsWritten } from '../tests/load/fixture';
import { formatReport, resendUnacknowledged, runMix } from '../tests/load/mix';

async function main() {
  // Several app processes: a round-robin on loopback in front of them, as a load balancer would be.
  const upstreams = (process.env.LOAD_UPSTREAM_PORTS ?? '').split(',').map(Number).filter((p) => p > 0);
  const balancer = upstreams.length > 1 ? await startRoundRobin(upstreams) : null;
  const url = balancer?.url ?? process.env.APP_URL!;
  const databaseUrl = process.env.DATABASE_URL!;
  const seconds = Number(process.argv[2] ?? 60);
  if (!Number.isFinite(seconds) || seconds < 1 || seconds > 3600) throw new Error('give the run length in seconds (1 to 3600)');
  const fixture = await prepareLoadFixture(databaseUrl);
  const keyPrefix = `load-${Date.now().toString(36)}-`;
  try {
    const where = balancer ? `${upstreams.length} app processes (ports ${upstreams.join(', ')}) behind a round-robin` : url;
    console.log(`[load] ${seconds} s against ${where}: 4 platers logging, 2 estimators pricing, 2 customers listing invoices`);
    const report = await runMix({ url, fixture, seconds, keyPrefix });
    console.log(formatReport(report));
    if (balancer) console.log(`[load] connections per app process: ${balancer.connections.join(' / ')}`);
    // Requests still in flight when the run ended were never answered: sent again, as a device would.
    const cutOff = await resendUnacknowledged(url, fixture.cookies.plater, report);
    const acknowledged = [...report.writes.values()].filter((w) => w.answers.some((s) => s === 200 || s === 201)).length;
    const rows = await rowsWritten(databaseUrl, keyPrefix);
    const unknown = [...rows.keys].filter((k) => !report.writes.has(k)).length;
    console.log(
      `[load] writes sent: ${report.writes.size}; acknowledged: ${acknowledged} (${cutOff.resent} cut off at the end, sent again: ${cutOff.storedBefore} had been stored); ` +
        `rows written: ${rows.count}; rows of no write: ${unknown}`,
    );
    if (rows.count !== report.writes.size || acknowledged !== report.writes.size || unknown > 0 || report.total.errors > 0) process.exitCode = 1;
  } finally {
    await fixture.close();
    await balancer?.close();
  }
}

main().catch((err) => {
  console.error('[load] failed:', err instanceof Error ? err.message : err);
  process.exit(1);
});
