'use client';

import { useActionState, useState } from 'react';
import { Caution } from '@/components/ui/caution';
import { NumberField, SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { finishHazards, routeFromText } from '@/lib/finishes/hazards';
import type { ProcessFamilyId } from '@/db/types';
import { FAMILIES, getFamily } from '@/lib/families';
import { displayUnit, PLATING_METALS, UNITS, unitsOf, type UnitSystem } from '@/lib/plating';
import { saveFinishAction } from './actions';

const unitOptions = (ids: readonly string[]) => ids.map((u) => ({ value: u, label: UNITS[u as keyof typeof UNITS].symbol }));
const METAL_OPTIONS = PLATING_METALS.map((m) => ({ value: m.key, label: `${m.name} (${m.ion})` }));

type Props = { defaults: Record<string, string>; lines: { id: string; name: string }[]; readOnly: boolean; units: UnitSystem };

export function FinishForm({ defaults, lines, readOnly, units }: Props) {
  const [state, action] = useActionState(saveFinishAction, initialFormState);
  const v = (k: string) => (state.ok ? defaults[k] : (state.values?.[k] ?? defaults[k])) ?? '';
  const e = (k: string) => state.fieldErrors?.[k];
  const [metal, setMetal] = useState(defaults.metal ?? 'Zn2+');
  const [familyId, setFamilyId] = useState<ProcessFamilyId>((defaults.family as ProcessFamilyId) ?? 'electroplating');
  const family = getFamily(familyId);
  const [route, setRoute] = useState(defaults.route ?? '');
  const [bake, setBake] = useState(defaults.bakeRequired === 'on');
  const m = family.metal ?? PLATING_METALS.find((x) => x.key === metal);
  const hazards = m ? finishHazards({ family: familyId, element: m.element, ionCharge: m.charge, route: routeFromText(route), bakeRequired: bake, words: `${v('name')} ${v('specText')}` }) : [];
  const fieldUnit = (convert: 'thicknessPerHour' | 'temperature' | 'dollars' | undefined, unit: string | undefined) =>
    convert === 'dollars' ? '$' : convert === 'thicknessPerHour' ? `${UNITS[displayUnit('thickness', units)].symbol}/h` : convert === 'temperature' ? UNITS[displayUnit('temperature', units)].symbol : unit;
  const check = (name: string, label: string, checked?: boolean, onChange?: (on: boolean) => void) => (
    <label className="flex items-center gap-2 text-sm">
      <input type="checkbox" name={name} className="size-4" {...(onChange ? { checked, onChange: (ev) => onChange(ev.target.checked) } : { defaultChecked: v(name) === 'on' })} />
      {label}
    </label>
  );
  return (
    <form action={action} className="flex flex-col gap-6" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      {hazards.length ? <Caution kind={hazards} /> : null}
      <input type="hidden" name="finishId" value={defaults.finishId} />
      <fieldset disabled={readOnly} className="contents">
        <section className="grid gap-4 sm:grid-cols-2">
          <TextField label="Code" name="code" defaultValue={v('code')} errors={e('code')} required hint="e.g. ZN-B633-SC2" />
          <TextField label="Name" name="name" defaultValue={v('name')} errors={e('name')} required />
          <TextField className="sm:col-span-2" label="Specification as the customer cites it" name="specText" defaultValue={v('specText')} errors={e('specText')} hint="e.g. ASTM B633 Fe/Zn 8 (SC2) Type III" />
          <TextareaField
            className="sm:col-span-2"
            label="Process route"
            name="route"
            rows={5}
            value={route}
            onChange={(ev) => setRoute(ev.target.value)}
            errors={e('route')}
            hint="One step a line, in order: clean, activate, strike, plate, post-treatment, bake. Add a note after “|”."
            required
          />
          <SelectField
            label="Process family"
            name="family"
            value={familyId}
            onChange={(ev) => setFamilyId(ev.target.value as ProcessFamilyId)}
            options={FAMILIES.map((f) => ({ value: f.id, label: f.label }))}
            hint={family.summary}
            errors={e('family')}
          />
          {family.metal ? (
            <p className="self-end text-sm text-ink-muted">Metal: {family.metal.label}</p>
          ) : (
            <SelectField label="Metal and ion" name="metal" value={metal} onChange={(ev) => setMetal(ev.target.value)} options={METAL_OPTIONS} errors={e('metal')} required />
          )}
          <SelectField label="Rack or barrel" name="method" defaultValue={v('method')} options={[{ value: 'rack', label: 'Rack' }, { value: 'barrel', label: 'Barrel' }]} errors={e('method')} />
          <SelectField label="Line" name="lineId" defaultValue={v('lineId')} placeholder="Any line" options={lines.map((l) => ({ value: l.id, label: l.name }))} errors={e('lineId')} />
          {check('isActive', 'Offered on new quotes')}
        </section>
        <section className="grid gap-4 sm:grid-cols-3">
          {family.makesCoating ? (
            <>
              <NumberField label="Minimum thickness" name="minThickness" defaultValue={v('minThickness')} errors={e('minThickness')} required hint="On significant surfaces." />
              <NumberField label="Maximum thickness" name="maxThickness" defaultValue={v('maxThickness')} errors={e('maxThickness')} hint="Optional." />
            </>
          ) : null}
          <SelectField label="Thickness unit" name="thicknessUnit" defaultValue={v('thicknessUnit')} options={unitOptions(unitsOf('thickness'))} errors={e('thicknessUnit')} />
          {family.usesCurrentDensity ? (
            <>
              <NumberField label="Current density" name="currentDensity" defaultValue={v('currentDensity')} errors={e('currentDensity')} required />
              <SelectField label="Current density unit" name="currentDensityUnit" defaultValue={v('currentDensityUnit')} options={unitOptions(unitsOf('currentDensity'))} errors={e('currentDensityUnit')} />
            </>
          ) : (
            <input type="hidden" name="currentDensityUnit" value={v('currentDensityUnit')} />
          )}
          {family.usesEfficiency ? <NumberField label="Cathode efficiency" name="efficiencyPercent" unit="%" defaultValue={v('efficiencyPercent')} errors={e('efficiencyPercent')} required /> : null}
          <NumberField label="Distribution ratio" name="distributionRatio" defaultValue={v('distributionRatio')} errors={e('distributionRatio')} required hint="Minimum ÷ average thickness; about 0.7 on racks, 0.5 in barrels (common practice)." />
          <NumberField label="Tank voltage" name="tankVolts" unit="V" defaultValue={v('tankVolts')} errors={e('tankVolts')} required />
          <NumberField label="Parts per load" name="partsPerLoad" defaultValue={v('partsPerLoad')} errors={e('partsPerLoad')} required />
          <NumberField label="Handling per load" name="handlingMinutesPerLoad" unit="min" defaultValue={v('handlingMinutesPerLoad')} errors={e('handlingMinutesPerLoad')} required />
          <NumberField label="Masking per piece" name="maskingPerPiece" unit="$" defaultValue={v('maskingPerPiece')} errors={e('maskingPerPiece')} />
        </section>
        {family.form.length ? (
          <fieldset className="grid gap-4 rounded-md border border-surface-line p-4 sm:grid-cols-3">
            <legend className="px-1 text-base font-semibold">{family.label}</legend>
            {family.form.map((f) =>
              f.kind === 'select' ? (
                <SelectField key={`${familyId}-${f.name}`} label={f.label} name={`fp_${f.name}`} defaultValue={v(`fp_${f.name}`)} options={f.options ?? []} hint={f.hint} errors={e(`fp_${f.name}`)} />
              ) : (
                <NumberField
                  key={`${familyId}-${f.name}`}
                  label={f.label}
                  name={`fp_${f.name}`}
                  unit={fieldUnit(f.convert, f.unit)}
                  defaultValue={v(`fp_${f.name}`)}
                  hint={f.hint}
                  errors={e(`fp_${f.name}`)}
                  required={!f.optional}
                />
              ),
            )}
          </fieldset>
        ) : null}
        <fieldset className="grid gap-4 rounded-md border border-surface-line p-4 sm:grid-cols-3">
          <legend className="px-1 text-base font-semibold">{family.bakeLabel}</legend>
          <div className="sm:col-span-3">{check('bakeRequired', 'The specification requires a relief bake', bake, setBake)}</div>
          <NumberField label="For parts from" name="bakeThresholdHrc" unit="HRC" defaultValue={v('bakeThresholdHrc')} errors={e('bakeThresholdHrc')} />
          <NumberField label="Start within" name="bakeWindowHours" unit="h" defaultValue={v('bakeWindowHours')} errors={e('bakeWindowHours')} hint="Of the end of plating." />
          <NumberField label="Bake time" name="bakeHours" unit="h" defaultValue={v('bakeHours')} errors={e('bakeHours')} />
          <NumberField label="Bake temperature" name="bakeTemp" defaultValue={v('bakeTemp')} errors={e('bakeTemp')} />
          <SelectField label="Temperature unit" name="temperatureUnit" defaultValue={v('temperatureUnit')} options={unitOptions(unitsOf('temperature'))} errors={e('temperatureUnit')} />
        </fieldset>
      </fieldset>
      {readOnly ? null : (
        <div>
          <SubmitButton pendingLabel="Saving…">{defaults.finishId ? 'Save finish' : 'Add finish'}</SubmitButton>
        </div>
      )}
    </form>
  );
}
