// A realistic mix of the shop's traffic, driven with autocannon against a running app: platers
// logging analyses and meter readings at the tank, estimators pricing a job, customers listing
// their invoices. Every write carries a unique entry key, so afterwards each acknowledged write can
// be matched to exactly one row.
import autocannon from 'autocannon';
import { US_NICKEL_REQUEST } from '../unit/estimating/us-nickel-request';
import type { LoadFixture, LoadRole } from './fixture';

export type Outcome = { status: number; ms: number };
export type KindReport = {
  kind: string;
  role: LoadRole;
  requests: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  statuses: Record<string, number>;
  /** Timeouts and connection errors: requests that got no HTTP answer. */
  errors: number;
};
export type LoadReport = {
  seconds: number;
  kinds: KindReport[];
  total: { requests: number; perSecond: number; p50: number; p95: number; p99: number; errors: number };
  /** Entry key → what was sent and the answers it got (a refused write may be sent again as it was). */
  writes: Map<string, { body: string; answers: number[] }>;
  /** Every answer in the order received, with its time since the start (for the fault runs). */
  timeline: { at: number; kind: string; status: number; ms: number; body?: string }[];
};

export type MixOptions = {
  url: string;
  fixture: LoadFixture;
  seconds: number;
  /** Entry keys are `${keyPrefix}${n}`; the prefix tells this run's rows apart. */
  keyPrefix: string;
  connections?: Partial<Record<LoadRole, number>>;
  /** Keep the body of non-2xx answers in the timeline (the fault runs read the message). */
  keepErrorBodies?: boolean;
};

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

type Req = autocannon.Request & { kind: string; onResponse?: (status: number, body: string, context: object) => void };

export async function runMix(o: MixOptions): Promise<LoadReport> {
  const connections = { plater: 4, estimator: 2, customer: 2, ...o.connections };
  const origin = new URL(o.url).origin;
  const writes: LoadReport['writes'] = new Map();
  const timeline: LoadReport['timeline'] = [];
  const latencies = new Map<string, number[]>();
  const statuses = new Map<string, Record<string, number>>();
  const errors = new Map<string, number>();
  const started = Date.now();
  let n = 0;

  const json = (role: LoadRole) => ({ 'content-type': 'application/json', origin, cookie: o.fixture.cookies[role] });
  // pH around its target of 4.9 with the scatter of a real bath: now and then outside its limits.
  const ph = () => Math.round((4.9 + (Math.random() + Math.random() + Math.random() - 1.5) * 0.15) * 100) / 100;
  const write = (kind: string, body: (key: string) => object): Req => ({
    kind,
    method: 'POST',
    path: '/api/floor/entries',
    headers: json('plater'),
    setupRequest: (req, context) => {
      const key = `${o.keyPrefix}${++n}`;
      (context as { key?: string }).key = key;
      const text = JSON.stringify(body(key));
      writes.set(key, { body: text, answers: [] });
      return { ...req, body: text };
    },
    onResponse: (status: number, _body: string, context: object) => {
      const key = (context as { key?: string }).key;
      if (key) writes.get(key)?.answers.push(status);
    },
  });

  const byRole: Record<LoadRole, Req[]> = {
    plater: [
      write('analysis', (key) => ({ kind: 'analysis', key, tankId: o.fixture.tankId, analyteId: o.fixture.analytes.ph, inputs: { reading: ph() }, takenAt: new Date().toISOString() })),
      write('meter', (key) => ({ kind: 'meter', key, tankId: o.fixture.tankId, ampHours: 10_000 + n, readAt: new Date().toISOString() })),
      write('analysis', (key) => ({ kind: 'analysis', key, tankId: o.fixture.tankId, analyteId: o.fixture.analytes.temperature, inputs: { reading: 52 + Math.round(Math.random() * 60) / 10 }, takenAt: new Date().toISOString() })),
    ],
    estimator: [{ kind: 'estimate', method: 'POST', path: '/api/v1/plating/estimate', headers: json('estimator'), body: JSON.stringify(US_NICKEL_REQUEST) }],
    customer: [{ kind: 'invoice list', method: 'GET', path: '/portal/invoices', headers: { cookie: o.fixture.cookies.customer } }],
  };

  const runs = (Object.keys(byRole) as LoadRole[])
    .filter((role) => connections[role] > 0)
    .map(
      (role) =>
        new Promise<void>((resolve, reject) => {
          // autocannon calls a request's onResponse and then, at once and in the same tick, emits
          // 'response' with the latency: the first names the answer, the second times it.
          let last: { kind: string; body: string } = { kind: '', body: '' };
          const requests = byRole[role].map(({ kind, onResponse, ...r }) => ({
            ...r,
            onResponse: (status: number, body: string, context: object) => {
              last = { kind, body };
              onResponse?.(status, body, context);
            },
          }));
          const instance = autocannon({ url: o.url, connections: connections[role], duration: o.seconds, timeout: 20, requests }, (err) =>
            err ? reject(err) : resolve(),
          );
          instance.on('response', (_client, status, _bytes, ms) => {
            const id = `${role}:${last.kind}`;
            const list = latencies.get(id) ?? [];
            list.push(ms);
            latencies.set(id, list);
            const s = statuses.get(id) ?? {};
            s[status] = (s[status] ?? 0) + 1;
            statuses.set(id, s);
            timeline.push({ at: Date.now() - started, kind: last.kind, status, ms, ...(o.keepErrorBodies && status >= 300 ? { body: last.body.slice(0, 500) } : {}) });
          });
          instance.on('reqError', () => errors.set(role, (errors.get(role) ?? 0) + 1));
        }),
    );
  await Promise.all(runs);
  const seconds = (Date.now() - started) / 1000;

  const kinds: KindReport[] = [...latencies.entries()].map(([id, list]) => {
    const [role, kind] = id.split(':') as [LoadRole, string];
    const sorted = [...list].sort((a, b) => a - b);
    return {
      kind,
      role,
      requests: list.length,
      perSecond: list.length / seconds,
      p50: percentile(sorted, 50),
      p95: percentile(sorted, 95),
      p99: percentile(sorted, 99),
      statuses: statuses.get(id) ?? {},
      errors: 0,
    };
  });
  for (const k of kinds) k.errors = kinds.find((x) => x.role === k.role) === k ? (errors.get(k.role) ?? 0) : 0;
  const all = [...latencies.values()].flat().sort((a, b) => a - b);
  return {
    seconds,
    kinds,
    total: {
      requests: all.length,
      perSecond: all.length / seconds,
      p50: percentile(all, 50),
      p95: percentile(all, 95),
      p99: percentile(all, 99),
      errors: [...errors.values()].reduce((a, b) => a + b, 0),
    },
    writes,
    timeline,
  };
}

export function formatReport(r: LoadReport): string {
  const rows = [
    ['who', 'request', 'requests', 'req/s', 'p50 ms', 'p95 ms', 'p99 ms', 'answers', 'no answer'],
    ...r.kinds.map((k) => [k.role, k.kind, String(k.requests), k.perSecond.toFixed(1), k.p50.toFixed(0), k.p95.toFixed(0), k.p99.toFixed(0), Object.entries(k.statuses).map(([s, c]) => `${s}×${c}`).join(' '), String(k.errors)]),
    ['all', '', String(r.total.requests), r.total.perSecond.toFixed(1), r.total.p50.toFixed(0), r.total.p95.toFixed(0), r.total.p99.toFixed(0), '', String(r.total.errors)],
  ];
  const widths = rows[0]!.map((_, i) => Math.max(...rows.map((row) => row[i]!.length)));
  return rows.map((row) => `| ${row.map((c, i) => c.padEnd(widths[i]!)).join(' | ')} |`).join('\n');
}

/**
 * Sends again, as the device's offline queue would, every write that got no success answer (cut
 * off at the end of the run, or refused during a fault). Answers 201 (stored now) or 200 (it had
 * been stored; only the answer was lost) are expected; anything else is returned as refused.
 */
export async function resendUnacknowledged(url: string, cookie: string, report: LoadReport): Promise<{ resent: number; storedBefore: number; refused: number[] }> {
  const origin = new URL(url).origin;
  const out = { resent: 0, storedBefore: 0, refused: [] as number[] };
  for (const w of report.writes.values()) {
    if (w.answers.some((s) => s === 200 || s === 201)) continue;
    const r = await fetch(`${url}/api/floor/entries`, { method: 'POST', headers: { 'content-type': 'application/json', origin, cookie }, body: w.body });
    await r.arrayBuffer();
    w.answers.push(r.status);
    out.resent += 1;
    if (r.status === 200) out.storedBefore += 1;
    else if (r.status !== 201) out.refused.push(r.status);
  }
  return out;
}
