'use client';

import { useMemo, useState } from 'react';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { Button, LinkButton } from '@/components/ui/button';
import { NumberField } from '@/components/ui/field';
import { canConvert, displayUnitOf, formatWhen, roundForDisplay, toDisplay, verdictSentence } from '@/lib/bath/display';
import { evaluateReading } from '@/lib/bath/evaluate';
import type { FloorAnalyte, CorrectionTarget } from '@/lib/bath/floor-queries';
import { getMethod } from '@/lib/bath/methods';
import { describeRecommendation, type Recommendation } from '@/lib/bath/recommend';
import type { AnalysisInputs } from '@/lib/bath/methods/titration';
import { floorQueue, newEntryKey, useEntryFate } from '@/lib/floor/browser-queue';
import type { UnitSystem } from '@/lib/plating/units';
import { AdditionForm } from '../../../../_ui/addition-form';
import { SaveState } from '../../../../_ui/save-state';
import { MethodNote } from './method-note';

type Props = {
  tank: { id: string; code: string; name: string; volumeL: number };
  analyte: FloorAnalyte;
  system: UnitSystem;
  correcting: CorrectionTarget | null;
  prefill: Record<string, number>;
  additionTargets: { id: string; name: string; material: string | null }[];
};

const NUMBER = /^-?\d+(\.\d+)?$/;

export function AnalysisEntry({ tank, analyte, system, correcting, prefill, additionTargets }: Props) {
  const method = getMethod(analyte.methodId);
  const entryUnit = method?.kind === 'direct' && !method.reportAs && canConvert(displayUnitOf(method.unit, system), method.unit) ? displayUnitOf(method.unit, system) : undefined;
  const [text, setText] = useState<Record<string, string>>(() =>
    Object.fromEntries(Object.entries(prefill).map(([k, v]) => [k, String(roundForDisplay(v, 5))])),
  );
  const [saved, setSaved] = useState<{ key: string; recommendation: Recommendation } | null>(null);
  const fate = useEntryFate(saved?.key ?? null);

  const inputs: AnalysisInputs | null = useMemo(() => {
    if (!method) return null;
    const num = (k: string) => (NUMBER.test((text[k] ?? '').trim()) ? Number(text[k]) : undefined);
    if (method.kind === 'titration') return num('buretteMl') === undefined ? null : { buretteMl: num('buretteMl') };
    if (method.kind === 'direct') return num('reading') === undefined ? null : { reading: num('reading') };
    const values: Record<string, number> = {};
    for (const i of method.inputs) {
      const v = num(i.key);
      if (v === undefined) return null;
      values[i.key] = v;
    }
    return { values };
  }, [method, text]);

  const subject = {
    key: analyte.key,
    name: analyte.name,
    unit: analyte.unit,
    methodId: analyte.methodId,
    limits: {
      target: analyte.target,
      lowerControl: analyte.lowerControl ?? undefined,
      upperControl: analyte.upperControl ?? undefined,
      lowerSpec: analyte.lowerSpec ?? undefined,
      upperSpec: analyte.upperSpec ?? undefined,
    },
    supply: analyte.supply,
  };
  const result = inputs ? evaluateReading(subject, tank.volumeL, inputs, entryUnit) : null;
  const shown = result?.ok ? toDisplay(result.value, result.unit, system) : null;

  if (!method) return <p className="text-out">This analyte&apos;s method is not known. Ask a supervisor to fix it.</p>;

  function save() {
    if (!inputs || !result?.ok) return;
    const key = newEntryKey();
    const payload = {
      kind: 'analysis' as const,
      key,
      tankId: tank.id,
      analyteId: analyte.id,
      inputs,
      ...(entryUnit ? { entryUnit } : {}),
      takenAt: correcting?.takenAt ?? new Date().toISOString(),
      ...(correcting ? { supersedesId: correcting.id, note: 'Correction' } : {}),
    };
    setSaved({ key, recommendation: result.recommendation });
    void floorQueue().add({ key, payload, label: `${tank.code} · ${analyte.name}: ${shown ? `${roundForDisplay(shown.value)} ${shown.unit}` : ''}` });
  }

  if (saved) {
    const rec = saved.recommendation;
    return (
      <div className="flex flex-col gap-5">
        <SaveState fate={fate} what="Analysis" />
        {rec.kind === 'add' || rec.kind === 'decant' ? (
          <div className="rounded-lg border border-surface-line bg-surface p-4">
            <AdditionForm
              tank={tank}
              analytes={additionTargets}
              system={system}
              defaults={
                rec.kind === 'add'
                  ? { analyteId: analyte.id, material: rec.material, amount: rec.amount, unit: rec.unit, recommendedAmount: rec.amount, recommendedUnit: rec.unit, analysisKey: saved.key, kind: 'correction', reason: `${analyte.name} low` }
                  : { analyteId: analyte.id, material: 'Decanted and made up with water', amount: rec.decantL, unit: 'L', recommendedAmount: rec.decantL, recommendedUnit: 'L', analysisKey: saved.key, kind: 'correction', reason: `${analyte.name} high` }
              }
            />
          </div>
        ) : null}
        <div className="flex flex-wrap gap-3">
          <Button size="lg" variant="secondary" onClick={() => { setSaved(null); setText({}); }}>
            Log another reading
          </Button>
          <LinkButton size="lg" variant="ghost" href={`/floor/tanks/${tank.code}`}>
            Back to {tank.code}
          </LinkButton>
        </div>
      </div>
    );
  }

  const field = (key: string, label: string, unit: string | undefined) => (
    <NumberField
      key={key}
      size="lg"
      label={label}
      name={key}
      unit={unit}
      value={text[key] ?? ''}
      onChange={(e) => setText((t) => ({ ...t, [key]: e.target.value }))}
      errors={result && !result.ok && (result.field === key || (method.kind === 'direct' && result.field === 'reading')) ? result.message : null}
      inputClassName="text-3xl! py-3"
      autoFocus={key === 'buretteMl' || key === 'reading'}
    />
  );

  return (
    <form
      className="flex flex-col gap-5"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      {correcting ? (
        <p className="rounded-md border border-copper/40 bg-copper-soft px-3 py-2 text-base text-ink">
          Correcting the entry of {formatWhen(correcting.takenAt)}: {roundForDisplay(toDisplay(correcting.value, correcting.unit, system).value)}{' '}
          {displayUnitOf(correcting.unit, system)}. The old entry stays on record, struck through.
        </p>
      ) : null}
      <MethodNote method={method} />
      {method.kind === 'titration' ? field('buretteMl', 'Burette reading', 'mL') : null}
      {method.kind === 'direct' ? field('reading', 'Reading', entryUnit ?? method.unit) : null}
      {method.kind === 'derived' ? method.inputs.map((i) => field(i.key, i.label, 'g/L')) : null}

      <section aria-live="polite" aria-label="Result before saving" className="rounded-lg border border-surface-line bg-surface p-4" data-testid="live-result">
        {result?.ok && shown ? (
          <div className="flex flex-col gap-3">
            <p className="text-4xl font-semibold tabular text-ink" data-testid="live-value">
              {roundForDisplay(shown.value)} <span className="text-2xl font-medium text-ink-muted">{shown.unit}</span>
            </p>
            <VerdictBadge verdict={result.verdict.status} size="lg" />
            <p className="text-base text-ink-muted">{verdictSentence(result.verdict, subject.limits, analyte.unit, system)}</p>
            {result.recommendation.kind !== 'none' || result.verdict.status === 'out_of_range' ? (
              <p className="rounded-md bg-surface-muted px-3 py-2 text-lg font-semibold text-ink" data-testid="recommendation">
                {describeRecommendation(result.recommendation, system)}
              </p>
            ) : null}
            {result.recommendation.kind !== 'none'
              ? result.recommendation.notes.map((n) => (
                  <p key={n} className="text-sm text-ink-muted">
                    {n}
                  </p>
                ))
              : null}
          </div>
        ) : (
          <p className="text-base text-ink-muted">Enter the reading: the value and whether it is in range appear here before you save.</p>
        )}
      </section>
      <Button type="submit" size="lg" fullWidth disabled={!result?.ok}>
        {correcting ? 'Save correction' : 'Save analysis'}
      </Button>
    </form>
  );
}
