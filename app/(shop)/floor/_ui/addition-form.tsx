'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { NumberField, SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { convertSymbol, displayUnitOf, roundForDisplay } from '@/lib/bath/display';
import type { AdditionEntry } from '@/lib/bath/schemas';
import { floorQueue, newEntryKey, useEntryFate } from '@/lib/floor/browser-queue';
import type { UnitSystem } from '@/lib/plating/units';
import { SaveState } from './save-state';

export type AdditionDefaults = {
  analyteId?: string | null;
  material?: string;
  /** Stored units: kg or L. */
  amount?: number | null;
  unit?: 'kg' | 'L';
  recommendedAmount?: number | null;
  recommendedUnit?: 'kg' | 'L' | null;
  analysisKey?: string | null;
  kind?: AdditionEntry['additionKind'];
  reason?: string;
};

type Props = {
  tank: { id: string; code: string };
  analytes: { id: string; name: string; material: string | null }[];
  defaults: AdditionDefaults;
  system: UnitSystem;
  title?: string;
};

/** Records the addition actually made (kept on the device and sent when the connection allows). */
export function AdditionForm({ tank, analytes, defaults, system, title = 'Record the addition made' }: Props) {
  const baseUnit = defaults.unit ?? 'kg';
  const [unit, setUnit] = useState<string>(displayUnitOf(baseUnit, system));
  const shownDefault = defaults.amount != null ? String(roundForDisplay(convertSymbol(defaults.amount, baseUnit, displayUnitOf(baseUnit, system)))) : '';
  const [amount, setAmount] = useState(shownDefault);
  const [material, setMaterial] = useState(defaults.material ?? '');
  const [analyteId, setAnalyteId] = useState(defaults.analyteId ?? '');
  const [reason, setReason] = useState(defaults.reason ?? '');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [savedKey, setSavedKey] = useState<string | null>(null);
  const fate = useEntryFate(savedKey);
  const units = system === 'us' ? ['lb', 'gal'] : ['kg', 'L'];

  function save() {
    const n = Number(amount.trim());
    const next: Record<string, string> = {};
    if (!material.trim()) next.material = 'Name what was added.';
    if (!/^\d+(\.\d+)?$/.test(amount.trim()) || !(n > 0)) next.amount = 'Give the amount added, e.g. 12.5.';
    setErrors(next);
    if (Object.keys(next).length) return;
    const key = newEntryKey();
    const payload = {
      kind: 'addition' as const,
      key,
      tankId: tank.id,
      analyteId: analyteId || null,
      analysisKey: defaults.analysisKey ?? null,
      additionKind: defaults.kind ?? 'correction',
      material: material.trim(),
      amount: n,
      unit: unit as 'kg' | 'L' | 'lb' | 'gal',
      recommendedAmount: defaults.recommendedAmount ?? null,
      recommendedUnit: defaults.recommendedUnit ?? null,
      reason: reason.trim(),
      madeAt: new Date().toISOString(),
    };
    setSavedKey(key);
    void floorQueue().add({ key, payload, label: `${tank.code} · added ${n} ${unit} ${material.trim()}` });
  }

  if (savedKey) {
    return (
      <div className="flex flex-col gap-3">
        <SaveState fate={fate} what="Addition" />
        <Button size="lg" variant="secondary" onClick={() => setSavedKey(null)}>
          Record another addition
        </Button>
      </div>
    );
  }

  return (
    <form
      className="flex flex-col gap-4"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        save();
      }}
    >
      <h2 className="text-lg font-semibold text-ink">{title}</h2>
      {analytes.length > 0 ? (
        <SelectField
          size="lg"
          label="For"
          name="analyteId"
          value={analyteId}
          onChange={(e) => {
            setAnalyteId(e.target.value);
            const m = analytes.find((a) => a.id === e.target.value)?.material;
            if (m && !material) setMaterial(m);
          }}
          placeholder="Whole bath"
          options={analytes.map((a) => ({ value: a.id, label: a.name }))}
        />
      ) : null}
      <TextField size="lg" label="What was added" name="material" value={material} onChange={(e) => setMaterial(e.target.value)} errors={errors.material} required />
      <div className="flex items-end gap-2">
        <NumberField
          size="lg"
          label="Amount added"
          name="amount"
          value={amount}
          onChange={(e) => setAmount(e.target.value)}
          errors={errors.amount}
          required
          className="flex-1"
          inputClassName="text-2xl!"
        />
        <SelectField size="lg" label="Unit" name="unit" value={unit} onChange={(e) => setUnit(e.target.value)} options={units.map((u) => ({ value: u, label: u }))} className="w-28" />
      </div>
      <TextField size="lg" label="Note (optional)" name="reason" value={reason} onChange={(e) => setReason(e.target.value)} />
      <FormMessage tone="info" message={defaults.recommendedAmount != null ? 'The amount is filled in from the recommendation: change it to what was actually added.' : null} />
      <Button type="submit" size="lg" fullWidth>
        Save addition
      </Button>
    </form>
  );
}
