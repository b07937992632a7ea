'use client';

import { useEffect, useState } from 'react';
import { ControlChart } from '@/components/control-chart/control-chart';
import { Button, buttonClasses } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { Spinner } from '@/components/ui/spinner';
import type { ChartData } from '@/lib/bath/chart';
import { shopTimeZone } from '@/lib/quality/shop-time';

const DAY_MS = 86_400_000;
const day = (d: Date) => d.toISOString().slice(0, 10);
const PRESETS = [
  { label: '30 days', days: 30 },
  { label: '4 months', days: 120 },
  { label: '1 year', days: 365 },
  { label: '5 years', days: 5 * 365 },
];

/** The analyte's individuals chart for a chosen date range, with Cpk where specification limits exist, and CSV export. */
export function ChartView({ tankId, analyteId }: { tankId: string; analyteId: string }) {
  const [range, setRange] = useState(() => ({ from: day(new Date(Date.now() - 120 * DAY_MS)), to: day(new Date()) }));
  const [draft, setDraft] = useState(range);
  const [data, setData] = useState<ChartData | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [loading, setLoading] = useState(false);
  const [basis, setBasis] = useState<'baseline' | 'all'>('baseline');
  const url = `/api/baths/${tankId}/analytes/${analyteId}/chart?from=${range.from}&to=${range.to}&limits=${basis}`;

  useEffect(() => {
    const ctrl = new AbortController();
    setLoading(true);
    setError(null);
    fetch(url, { signal: ctrl.signal, credentials: 'same-origin' })
      .then(async (res) => {
        const body = await res.json().catch(() => null);
        if (!res.ok) throw new Error(body?.error?.message ?? `The chart could not be loaded (${res.status}).`);
        setData(body as ChartData);
      })
      .catch((e: unknown) => {
        if (!ctrl.signal.aborted) setError(e instanceof Error ? e.message : 'The chart could not be loaded.');
      })
      .finally(() => {
        if (!ctrl.signal.aborted) setLoading(false);
      });
    return () => ctrl.abort();
  }, [url]);

  return (
    <div className="flex flex-col gap-4">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          setRange(draft);
        }}
      >
        <TextField label="From" name="from" type="date" value={draft.from} onChange={(e) => setDraft((d) => ({ ...d, from: e.target.value }))} />
        <TextField label="To" name="to" type="date" value={draft.to} onChange={(e) => setDraft((d) => ({ ...d, to: e.target.value }))} />
        <SelectField
          label="Control limits from"
          name="limits"
          value={basis}
          onChange={(e) => setBasis(e.target.value === 'all' ? 'all' : 'baseline')}
          options={[
            { value: 'baseline', label: 'the first 30 analyses shown' },
            { value: 'all', label: 'all analyses shown' },
          ]}
        />
        <Button type="submit" variant="secondary">Show</Button>
        {PRESETS.map((p) => (
          <Button
            key={p.days}
            variant="ghost"
            onClick={() => {
              const next = { from: day(new Date(Date.now() - p.days * DAY_MS)), to: day(new Date()) };
              setDraft(next);
              setRange(next);
            }}
          >
            {p.label}
          </Button>
        ))}
        <a href={`${url}&format=csv`} className={buttonClasses({ variant: 'secondary' })} download>
          Export CSV
        </a>
        {loading ? <Spinner /> : null}
      </form>
      <FormMessage tone="error" message={error} />
      {data ? (
        <>
          {data.limits ? (
            <ControlChart points={data.points} cl={data.limits.cl} ucl={data.limits.ucl} lcl={data.limits.lcl} lsl={data.limits.lsl} usl={data.limits.usl} unit={data.unit} label={data.analyte.name} height={360} />
          ) : null}
          <dl className="grid gap-3 text-sm sm:grid-cols-4">
            <div><dt className="text-ink-muted">Analyses shown</dt><dd className="text-lg font-semibold tabular">{data.points.length}</dd></div>
            <div><dt className="text-ink-muted">Control rule fired on</dt><dd className="text-lg font-semibold tabular">{data.points.filter((p) => p.rules.length > 0).length}</dd></div>
            <div>
              <dt className="text-ink-muted">Cpk</dt>
              <dd className="text-lg font-semibold tabular" data-testid="cpk">{data.capability ? data.capability.cpk.toFixed(2) : 'no specification limits'}</dd>
            </div>
            <div><dt className="text-ink-muted">Cp</dt><dd className="text-lg font-semibold tabular">{data.capability?.cp != null ? data.capability.cp.toFixed(2) : '—'}</dd></div>
          </dl>
          <p className="text-xs text-ink-muted">
            Control limits are worked out from {data.limitBasis === 'baseline' ? 'the first 30 analyses shown' : 'all analyses shown'} (individuals chart, σ from the
            average moving range{data.sigmaBasis ? `; ${data.sigmaBasis}` : ''}); they are not the bath sheet&apos;s control range. Rules: Western Electric run rules.
            Times in the shop&apos;s zone ({shopTimeZone()}).
          </p>
          {data.warnings.map((w) => <FormMessage key={w} tone="info" message={w} />)}
        </>
      ) : null}
    </div>
  );
}
