'use client';

import { Card } from '@/components/ui/card';
import { NumberField, SelectField, TextField } from '@/components/ui/field';
import { DISTRIBUTION_RATIO_DEFAULTS, PLATING_METALS, UNITS, type Loading } from '@/lib/plating';
import { unitSymbol } from '@/lib/estimating/display-units';
import { applyFreeMetal, applyLibrary, formUnits } from '@/lib/estimating/form-state';
import type { LibraryProcess } from '@/lib/estimating/process-library';
import { bind, type PanelProps } from './panel';

const FREE = '';

export function ProcessPanel(p: PanelProps & { library: readonly LibraryProcess[] }) {
  const { form, set, system } = p;
  const u = formUnits(system);
  const entry = p.library.find((l) => l.finishId === form.finishId) ?? null;
  return (
    <Card title="Job and process" description="Pick a finish from the shop's library, or describe a free process. Every value can be changed.">
      <div className="flex flex-col gap-4">
        <SelectField
          label="Process"
          name="finishId"
          value={form.finishId}
          hint={entry ? [entry.specText, entry.tankCode ? `tank ${entry.tankCode}` : null, entry.note].filter(Boolean).join(' · ') : 'Values below are starting points from the bath templates.'}
          onChange={(e) => {
            const next = p.library.find((l) => l.finishId === e.target.value);
            set(next ? applyLibrary(form, next, system) : { ...form, finishId: FREE });
          }}
          options={[{ value: FREE, label: 'Free process (no finish)' }, ...p.library.map((l) => ({ value: l.finishId, label: `${l.code} — ${l.name}` }))]}
        />
        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField
            label="Metal and ion"
            name="metalKey"
            value={form.metalKey}
            errors={p.errors.metalKey}
            onChange={(e) => set(applyFreeMetal(form, e.target.value, system))}
            options={PLATING_METALS.map((m) => ({ value: m.key, label: `${m.name} — ${m.ion}` }))}
          />
          <NumberField label="Quantity" unit="parts" {...bind(p, 'quantity')} required />
          <NumberField label="Minimum thickness" unit={UNITS[u.thickness].symbol} hint="On significant surfaces." {...bind(p, 'minimumThickness')} required />
        </div>
        <div className="grid gap-3 sm:grid-cols-3">
          <NumberField label="Current density" unit={UNITS[u.currentDensity].symbol} {...bind(p, 'currentDensity')} required />
          <NumberField label="Cathode efficiency" unit="%" {...bind(p, 'efficiencyPct')} required />
          <NumberField
            label="Distribution ratio"
            hint={`Minimum ÷ average. Blank: ${DISTRIBUTION_RATIO_DEFAULTS[form.loading]} for ${form.loading} work (common practice).`}
            {...bind(p, 'distributionRatio')}
          />
        </div>
        <div className="grid gap-3 sm:grid-cols-4">
          <SelectField
            label="Loading"
            name="loading"
            value={form.loading}
            onChange={(e) => set({ loading: e.target.value as Loading })}
            options={[
              { value: 'rack', label: 'Rack' },
              { value: 'barrel', label: 'Barrel' },
            ]}
          />
          <NumberField label="Parts per load" unit="parts" hint="Rack or barrel capacity." {...bind(p, 'partsPerLoad')} required />
          <NumberField label="Rectifier maximum" unit="A" {...bind(p, 'rectifierMaxA')} required />
          <NumberField label="Rectifier efficiency" unit="%" {...bind(p, 'rectifierEfficiencyPct')} required />
        </div>
        <div className="grid gap-3 sm:grid-cols-3">
          <NumberField label="Tank voltage" unit="V" {...bind(p, 'tankVolts')} required />
          <NumberField label="Drag-out" unit={unitSymbol(u.dragOut)} {...bind(p, 'dragOut')} required />
          <NumberField label="Metal in the bath" unit={UNITS[u.concentration].symbol} {...bind(p, 'bathMetal')} required />
        </div>
        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField
            label="Anodes"
            name="anodes"
            value={form.anodes}
            onChange={(e) => set({ anodes: e.target.value as 'soluble' | 'insoluble' })}
            options={[
              { value: 'soluble', label: 'Soluble' },
              { value: 'insoluble', label: 'Insoluble (metal from a salt)' },
            ]}
          />
          {form.anodes === 'soluble' ? (
            <NumberField label="Anode losses" unit="%" hint="Stubs, sludge and bags, on top of the metal used." {...bind(p, 'anodeLossPct')} />
          ) : (
            <TextField label="Replenishment salt" hint="Chemical formula, e.g. CrO3 or NiSO4·6H2O." {...bind(p, 'replenishmentSalt')} required />
          )}
        </div>
      </div>
    </Card>
  );
}
