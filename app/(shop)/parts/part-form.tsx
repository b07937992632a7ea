'use client';

import { useActionState, useState } from 'react';
import { Caution } from '@/components/ui/caution';
import { NumberField, SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { CORROSIVITY_CATEGORIES, SUBSTRATES, UNITS, ZINC_LOSS_UM_PER_YEAR, type SubstrateId, type UnitSystem } from '@/lib/plating';
import { mayNeedReliefBake, RELIEF_BAKE_CAUTION } from '@/lib/parts/embrittlement';
import { AREA_UNITS, MASS_UNITS } from '@/lib/parts/schemas';
import type { LengthUnit, ShapeKind } from '@/lib/parts/shapes';
import { savePartAction } from './actions';
import { DrawingField } from './drawing-field';
import { ShapeFields } from './shape-fields';
import { StlField } from './stl-field';

export type PartFormDefaults = {
  partId: string;
  customerId: string;
  partNumber: string;
  revision: string;
  description: string;
  substrate: SubstrateId;
  tensileMpa: string;
  hardnessHrc: string;
  corrosivityCategory: string;
  designLifeYears: string;
  sizeTolerance: string;
  sizeToleranceUnit: string;
  weight: string;
  weightUnit: string;
  drawing: { fileId: string; fileName: string };
  areaMethod: 'direct' | 'shape' | 'stl';
  direct: { area: string; unit: string };
  shape: { kind: ShapeKind; unit: LengthUnit; dims: Record<string, string>; flags: Record<string, boolean> };
  stl: { fileId: string; fileName: string; unit: LengthUnit };
};

const METHODS = [
  { value: 'direct', label: 'Enter the area' },
  { value: 'shape', label: 'From a shape' },
  { value: 'stl', label: 'From an STL model' },
] as const;

const unitOptions = (ids: readonly string[]) => ids.map((u) => ({ value: u, label: UNITS[u as keyof typeof UNITS].symbol }));

export function PartForm({ defaults, customers, unitSystem }: { defaults: PartFormDefaults; customers: { id: string; code: string; name: string }[]; unitSystem: UnitSystem }) {
  const [state, action] = useActionState(savePartAction, initialFormState);
  const v = (k: string, fallback: string) => (state.ok ? fallback : (state.values?.[k] ?? fallback));
  const e = (k: string) => state.fieldErrors?.[k];
  const [method, setMethod] = useState(defaults.areaMethod);
  const [substrate, setSubstrate] = useState<SubstrateId>(defaults.substrate);
  const [hrc, setHrc] = useState(defaults.hardnessHrc);
  const [mpa, setMpa] = useState(defaults.tensileMpa);
  const caution = mayNeedReliefBake({ hardnessHrc: hrc.trim() ? Number(hrc) : null, tensileMpa: mpa.trim() ? Number(mpa) : null });

  return (
    <form action={action} className="flex flex-col gap-6" noValidate>
      <FormMessage tone={state.ok ? 'success' : 'error'} message={state.message} />
      {defaults.partId ? <input type="hidden" name="partId" value={defaults.partId} /> : null}
      <section className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Customer"
          name="customerId"
          defaultValue={v('customerId', defaults.customerId)}
          placeholder="Choose…"
          options={customers.map((c) => ({ value: c.id, label: `${c.code} · ${c.name}` }))}
          errors={e('customerId')}
          required
        />
        <div className="grid grid-cols-[1fr_8rem] gap-4">
          <TextField label="Customer’s part number" name="partNumber" defaultValue={v('partNumber', defaults.partNumber)} errors={e('partNumber')} required />
          <TextField label="Revision" name="revision" defaultValue={v('revision', defaults.revision)} errors={e('revision')} />
        </div>
        <TextareaField className="sm:col-span-2" label="Description" name="description" rows={2} defaultValue={v('description', defaults.description)} errors={e('description')} />
        <SelectField
          label="Substrate"
          name="substrate"
          value={substrate}
          onChange={(ev) => setSubstrate(ev.target.value as SubstrateId)}
          options={Object.entries(SUBSTRATES).map(([value, s]) => ({ value, label: s.name }))}
          errors={e('substrate')}
          required
        />
        <div className="grid grid-cols-2 gap-4">
          <NumberField label="Tensile strength" name="tensileMpa" unit="MPa" value={mpa} onChange={(ev) => setMpa(ev.target.value)} errors={e('tensileMpa')} />
          <NumberField label="Hardness" name="hardnessHrc" unit="HRC" value={hrc} onChange={(ev) => setHrc(ev.target.value)} errors={e('hardnessHrc')} />
        </div>
        <div className="grid grid-cols-2 gap-4">
          <SelectField
            label="Service environment (ISO 9223)"
            name="corrosivityCategory"
            defaultValue={v('corrosivityCategory', defaults.corrosivityCategory)}
            placeholder="Not stated"
            options={CORROSIVITY_CATEGORIES.map((c) => ({ value: c, label: `${c} · ${ZINC_LOSS_UM_PER_YEAR[c].name}` }))}
            hint="Where the customer says the part will serve: zinc quotes and certificates then show the coating's expected life."
            errors={e('corrosivityCategory')}
          />
          <NumberField label="Design life asked" name="designLifeYears" unit="years" defaultValue={v('designLifeYears', defaults.designLifeYears)} errors={e('designLifeYears')} />
          <NumberField
            label="Tolerance on a finished diameter (±)"
            name="sizeTolerance"
            unit={defaults.sizeToleranceUnit === 'mil' ? 'mil' : 'µm'}
            defaultValue={v('sizeTolerance', defaults.sizeTolerance)}
            hint="From the drawing: an anodic coating's growth is weighed against it."
            errors={e('sizeTolerance')}
          />
          <input type="hidden" name="sizeToleranceUnit" value={defaults.sizeToleranceUnit} />
        </div>
        {caution ? (
          <Caution kind="high-strength-steel-bake" className="sm:col-span-2">
            {RELIEF_BAKE_CAUTION}
          </Caution>
        ) : null}
      </section>

      <fieldset className="flex flex-col gap-4 rounded-md border border-surface-line p-4">
        <legend className="px-1 text-base font-semibold">Area per part</legend>
        <div role="radiogroup" aria-label="How the area is found" className="flex flex-wrap gap-4">
          {METHODS.map((m) => (
            <label key={m.value} className="flex items-center gap-2 text-sm">
              <input type="radio" name="areaMethod" value={m.value} checked={method === m.value} onChange={() => setMethod(m.value)} className="size-4" />
              {m.label}
            </label>
          ))}
        </div>
        {method === 'direct' ? (
          <div className="grid grid-cols-[1fr_8rem] gap-4 sm:max-w-md">
            <NumberField label="Area per part" name="area" defaultValue={v('area', defaults.direct.area)} errors={e('area')} />
            <SelectField label="Unit" name="areaUnit" defaultValue={v('areaUnit', defaults.direct.unit)} options={unitOptions(AREA_UNITS)} errors={e('areaUnit')} />
          </div>
        ) : method === 'shape' ? (
          <ShapeFields unitSystem={unitSystem} defaults={defaults.shape} errors={e} />
        ) : (
          <StlField unitSystem={unitSystem} substrate={substrate} defaults={defaults.stl} errors={e} />
        )}
        {method === 'direct' ? null : <p className="text-sm text-ink-muted">The area is measured again on the server when you save.</p>}
      </fieldset>

      <section className="grid gap-4 sm:grid-cols-2">
        <div className="grid grid-cols-[1fr_8rem] gap-4">
          <NumberField label="Weight per part" name="weight" defaultValue={v('weight', defaults.weight)} errors={e('weight')} hint="Leave empty to weigh it from the shape or model’s volume and the substrate’s density." />
          <SelectField label="Unit" name="weightUnit" defaultValue={v('weightUnit', defaults.weightUnit)} options={unitOptions(MASS_UNITS)} errors={e('weightUnit')} />
        </div>
        <DrawingField defaults={defaults.drawing} errors={e('drawingFile')} />
      </section>

      <div>
        <SubmitButton pendingLabel="Saving…">{defaults.partId ? 'Save part' : 'Add part'}</SubmitButton>
      </div>
    </form>
  );
}
