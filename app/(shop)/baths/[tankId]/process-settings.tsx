'use client';

import { useActionState, useMemo, useState } from 'react';
import { NumberField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { aluminiumDecant } from '@/lib/families/anodizing/bath';
import type { FamilyFormField } from '@/lib/families/types';
import { updateTankSettingsAction } from './actions';

/** The tank's family settings; values arrive already in the reader's units. */
export function ProcessSettingsForm({ tankId, fields, values, madeUpOn, readOnly }: { tankId: string; fields: readonly FamilyFormField[]; values: Record<string, string>; madeUpOn: string; readOnly: boolean }) {
  const [state, action] = useActionState(updateTankSettingsAction, initialFormState);
  const v = (k: string, d: string) => (state.ok ? d : (state.values?.[k] ?? d));
  return (
    <form action={action} className="grid gap-3 sm:grid-cols-2" noValidate>
      <input type="hidden" name="tankId" value={tankId} />
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <fieldset disabled={readOnly} className="contents">
        {fields.map((f) => (
          <NumberField
            key={f.name}
            label={f.label}
            name={`ts_${f.name}`}
            unit={f.convert === 'dollars' ? '$' : f.unit}
            hint={f.hint}
            defaultValue={v(`ts_${f.name}`, values[f.name] ?? '')}
            errors={state.fieldErrors?.[`ts_${f.name}`]}
            required={!f.optional}
          />
        ))}
        <TextField label="Bath made up on" name="madeUpOn" type="date" defaultValue={v('madeUpOn', madeUpOn)} errors={state.fieldErrors?.madeUpOn} hint="The bath's age counts from here." />
        {readOnly ? null : (
          <div className="self-end">
            <SubmitButton variant="secondary" pendingLabel="Saving…">
              Save settings
            </SubmitButton>
          </div>
        )}
      </fieldset>
    </form>
  );
}

/** Decant and refill: how much of the bath to take out to bring dissolved aluminium down. */
export function DecantCalculator({ volumeL, aluminiumGPerL, acidTargetGPerL, aluminiumLimitGPerL }: { volumeL: number; aluminiumGPerL: number | null; acidTargetGPerL: number; aluminiumLimitGPerL: number }) {
  const [measured, setMeasured] = useState(aluminiumGPerL === null ? '' : String(aluminiumGPerL));
  const [target, setTarget] = useState(String(Math.max(0, aluminiumLimitGPerL / 2)));
  const result = useMemo(() => {
    try {
      return { ok: true as const, r: aluminiumDecant({ volumeL, aluminiumGPerL: Number(measured), targetAluminiumGPerL: Number(target), acidTargetGPerL }) };
    } catch (err) {
      return { ok: false as const, message: err instanceof Error ? err.message : 'Check the numbers.' };
    }
  }, [measured, target, volumeL, acidTargetGPerL]);
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField label="Dissolved aluminium now" name="aluminiumNow" unit="g/L" value={measured} onChange={(e) => setMeasured(e.target.value)} />
        <NumberField label="Aluminium wanted after" name="aluminiumTarget" unit="g/L" value={target} onChange={(e) => setTarget(e.target.value)} />
      </div>
      <p aria-live="polite" className="text-base">
        {!result.ok
          ? result.message
          : result.r.note ??
            `Decant ${result.r.decantL.toFixed(0)} L of the ${volumeL} L and refill with fresh acid: ${result.r.sulfuricAcidKg.toFixed(1)} kg of sulfuric acid (as H2SO4) made up to ${result.r.refillL.toFixed(0)} L at the bath's target of ${acidTargetGPerL} g/L.`}
      </p>
      <p className="text-xs text-ink-muted">A mass balance: the fresh acid holds no aluminium. Add acid to water, never water to acid.</p>
    </div>
  );
}
