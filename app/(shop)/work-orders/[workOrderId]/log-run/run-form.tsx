'use client';

import { useActionState, useEffect, useMemo, useRef, useState } from 'react';
import { NumberField, SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { StatusBadge } from '@/components/ui/status-badge';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import type { ProcessFamilyId } from '@/db/types';
import { getFamily } from '@/lib/families';
import { runAmpHours, runCurrentDensity } from '@/lib/orders/run-math';
import { displayUnit, formatNumber, formatStoredQuantity, toStorage, UNITS, type UnitSystem } from '@/lib/plating';
import { logRunAction } from '../../actions';

export type RunTank = { id: string; code: string; name: string; efficiency: number | null; rectifierMaxA: number | null; hasAhMeter: boolean; settings: Record<string, unknown> };
export type RunFinish = {
  family: ProcessFamilyId;
  params: Record<string, unknown>;
  element: string;
  ionCharge: number;
  distributionRatio: number;
  minThicknessUm: number;
  areaPerPartDm2: number;
  partsPerLoad: number;
};

const num = (s: string | undefined) => (s === undefined || s.trim() === '' ? Number.NaN : Number(s.replace(',', '.')));

function newKey(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now()}-${Math.random().toString(36).slice(2, 14)}`;
}

/** The figures the finish's family predicts from what is typed so far, or the reason it cannot yet. */
function usePrediction(v: Record<string, string>, finish: RunFinish, tank: RunTank | undefined, units: UnitSystem, familyData: Record<string, unknown>) {
  return useMemo(() => {
    const family = getFamily(finish.family);
    if (!tank) return { ok: false, error: 'Choose the tank.' } as const;
    const typed = !family.runsWithCurrent || (v.mode === 'meter' ? v.meterStartAh && v.meterStopAh : v.currentA);
    if (!typed || !v.minutesPerLoad) {
      return { ok: false, error: family.runsWithCurrent ? 'Enter the current and the minutes to see the predicted thickness before saving.' : 'Enter the minutes and the bath readings to see the verdict before saving.' } as const;
    }
    try {
      const loads = num(v.loads);
      const partsPerLoad = num(v.partsPerLoad);
      const minutesPerLoad = num(v.minutesPerLoad);
      const ampHours = !family.runsWithCurrent
        ? null
        : v.mode === 'meter'
          ? runAmpHours({ mode: 'meter', meterStartAh: num(v.meterStartAh), meterStopAh: num(v.meterStopAh), minutesPerLoad, loads })
          : runAmpHours({ mode: 'amps', currentA: num(v.currentA), minutesPerLoad, loads });
      const conditions = {
        ...(v.temperature ? { temperatureC: toStorage(num(v.temperature), displayUnit('temperature', units)) } : {}),
        ...(v.concentration ? { concentration: num(v.concentration) } : {}),
      };
      const p = family.predictRun(
        { ampHours, minutesPerLoad, loads, partsPerLoad, areaPerPartDm2: finish.areaPerPartDm2, finish, tank: { efficiency: tank.efficiency, settings: tank.settings }, conditions, familyData },
        finish.params,
      );
      const density = ampHours !== null && v.mode === 'amps' ? runCurrentDensity(num(v.currentA), partsPerLoad, finish.areaPerPartDm2) : null;
      return { ok: true, ampHours, p, density, makesThickness: finish.minThicknessUm > 0 && family.id !== 'passivation' } as const;
    } catch (err) {
      return { ok: false, error: err instanceof Error ? err.message : 'Check the numbers.' } as const;
    }
  }, [v, finish, tank, units, familyData]);
}

export function RunForm({ workOrderId, tanks, finish, units, familyData }: { workOrderId: string; tanks: RunTank[]; finish: RunFinish; units: UnitSystem; familyData: Record<string, unknown> }) {
  const [state, action] = useActionState(logRunAction, initialFormState);
  const [key, setKey] = useState('');
  const family = getFamily(finish.family);
  const [v, setV] = useState<Record<string, string>>({
    tankId: tanks.length === 1 ? (tanks[0]?.id ?? '') : '',
    mode: !family.runsWithCurrent ? 'time' : tanks[0]?.hasAhMeter ? 'meter' : 'amps',
    loads: '1',
    partsPerLoad: String(finish.partsPerLoad),
  });
  // A fresh key per run: a retried submit (same key) stores the run once; after a save the next run gets a new one.
  const handled = useRef(state);
  useEffect(() => {
    if (!key) setKey(newKey());
    else if (state.ok && handled.current !== state) {
      handled.current = state;
      setKey(newKey());
    }
  }, [state, key]);
  const set = (name: string) => (e: { target: { value: string } }) => setV((old) => ({ ...old, [name]: e.target.value }));
  const tank = tanks.find((t) => t.id === v.tankId);
  const pred = usePrediction(v, finish, tank, units, familyData);
  const below = pred.ok && pred.p.isBelowMinimum;
  const outside = pred.ok ? pred.p.outsideWindow : [];
  const tempUnit = displayUnit('temperature', units);

  return (
    <form action={action} className="flex flex-col gap-5" noValidate>
      <input type="hidden" name="workOrderId" value={workOrderId} />
      <input type="hidden" name="idempotencyKey" value={key} />
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField label="Tank" name="tankId" size="lg" value={v.tankId} onChange={set('tankId')} placeholder="Choose the tank…" options={tanks.map((t) => ({ value: t.id, label: `${t.code} · ${t.name}` }))} errors={state.fieldErrors?.tankId} required />
      {!family.runsWithCurrent ? (
        <>
          <input type="hidden" name="mode" value="time" />
          <input type="hidden" name="temperatureUnit" value={tempUnit} />
        </>
      ) : null}
      {family.runsWithCurrent ? (
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-base font-medium">Current measured by</legend>
        <div className="grid grid-cols-2 gap-2">
          {(['amps', 'meter'] as const).map((m) => (
            <label key={m} className={`flex min-h-target items-center justify-center gap-2 rounded-md border px-3 text-base font-medium ${v.mode === m ? 'border-action bg-action-soft text-action' : 'border-surface-line'}`}>
              <input type="radio" name="mode" value={m} checked={v.mode === m} onChange={set('mode')} className="size-5" />
              {m === 'amps' ? 'Rectifier amps' : 'Amp-hour meter'}
            </label>
          ))}
        </div>
      </fieldset>
      ) : null}
      {!family.runsWithCurrent ? (
        <div className="grid grid-cols-2 gap-3">
          {family.runConditions.includes('temperatureC') ? (
            <NumberField label="Bath temperature" name="temperature" unit={UNITS[tempUnit].symbol} size="lg" value={v.temperature ?? ''} onChange={set('temperature')} errors={state.fieldErrors?.temperature ?? state.fieldErrors?.temperatureC} required />
          ) : null}
          {family.runConditions.includes('concentration') ? (
            <NumberField label="Acid concentration" name="concentration" unit="%" size="lg" value={v.concentration ?? ''} onChange={set('concentration')} errors={state.fieldErrors?.concentration} hint="From the latest titration of this tank." required />
          ) : null}
        </div>
      ) : v.mode === 'amps' ? (
        <NumberField label="Rectifier current" name="currentA" unit="A" size="lg" value={v.currentA ?? ''} onChange={set('currentA')} errors={state.fieldErrors?.currentA} hint={tank?.rectifierMaxA ? `At most ${tank.rectifierMaxA} A on ${tank.code}.` : undefined} required />
      ) : (
        <div className="grid grid-cols-2 gap-3">
          <NumberField label="Meter at start" name="meterStartAh" unit="A·h" size="lg" value={v.meterStartAh ?? ''} onChange={set('meterStartAh')} errors={state.fieldErrors?.meterStartAh} required />
          <NumberField label="Meter at end" name="meterStopAh" unit="A·h" size="lg" value={v.meterStopAh ?? ''} onChange={set('meterStopAh')} errors={state.fieldErrors?.meterStopAh} required />
        </div>
      )}
      <NumberField label={family.runsWithCurrent ? 'Minutes per load under current' : 'Minutes per load in the bath'} name="minutesPerLoad" unit="min" size="lg" value={v.minutesPerLoad ?? ''} onChange={set('minutesPerLoad')} errors={state.fieldErrors?.minutesPerLoad} required />
      <div className="grid grid-cols-2 gap-3">
        <NumberField label="Loads" name="loads" unit="loads" size="lg" value={v.loads} onChange={set('loads')} errors={state.fieldErrors?.loads} required />
        <NumberField label="Parts per load" name="partsPerLoad" unit="pc" size="lg" value={v.partsPerLoad} onChange={set('partsPerLoad')} errors={state.fieldErrors?.partsPerLoad} required />
      </div>

      <section aria-live="polite" className="rounded-lg border border-surface-line bg-surface-muted p-4">
        {pred.ok && !pred.makesThickness ? (
          <div className="flex flex-col gap-2">
            <StatusBadge size="lg" status={outside.length ? 'out' : 'ok'} label={outside.length ? 'Outside the process window' : 'Inside the process window'} />
            {outside.length ? (
              <ul className="list-disc pl-5 text-base">
                {outside.map((o) => (
                  <li key={o}>{o}</li>
                ))}
              </ul>
            ) : (
              <p className="text-base">Time, temperature and concentration meet the treatment.</p>
            )}
            {outside.length ? <p className="text-sm text-ink-muted">Saving records the run as it was and opens a nonconformance for quality.</p> : null}
          </div>
        ) : pred.ok ? (
          <div className="flex flex-col gap-2">
            <StatusBadge size="lg" status={below ? 'out' : 'ok'} label={below ? 'Below the minimum' : 'Meets the minimum'} />
            <p className="text-2xl font-semibold tabular">{formatStoredQuantity(pred.p.minimumThicknessUm, 'thickness', units)} on the thinnest significant surface</p>
            <p className="text-sm text-ink-muted tabular">
              {pred.ampHours !== null ? `${formatNumber(pred.ampHours, 4)} A·h · ` : ''}average {formatStoredQuantity(pred.p.averageThicknessUm, 'thickness', units)} over {formatStoredQuantity(pred.p.platedAreaDm2, 'area', units)} · minimum required{' '}
              {formatStoredQuantity(pred.p.requiredMinimumUm, 'thickness', units)}
              {pred.density ? ` · ${formatStoredQuantity(pred.density, 'currentDensity', units)}` : ''}
            </p>
          </div>
        ) : (
          <p className="text-sm text-ink-muted">{pred.error}</p>
        )}
      </section>

      {below || state.fieldErrors?.confirmBelowMinimum ? (
        <label className="flex min-h-target items-center gap-3 rounded-md border border-out/40 bg-out-soft px-3 text-base">
          <input type="checkbox" name="confirmBelowMinimum" className="size-6" />
          Save anyway: the parts will be re-plated or held for inspection
        </label>
      ) : null}
      <SubmitButton size="lg" fullWidth pendingLabel="Saving…" disabled={!key}>
        Save run
      </SubmitButton>
    </form>
  );
}
