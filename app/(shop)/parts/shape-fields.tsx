'use client';

import { useState } from 'react';
import { NumberField, SelectField } from '@/components/ui/field';
import type { UnitSystem } from '@/lib/plating';
import { formatArea, formatVolume } from '@/lib/parts/display';
import { LENGTH_UNITS, measureShapeEntry, SHAPES, shapeField, type LengthUnit, type ShapeKind } from '@/lib/parts/shapes';

type Props = {
  unitSystem: UnitSystem;
  defaults: { kind: ShapeKind; unit: LengthUnit; dims: Record<string, string>; flags: Record<string, boolean> };
  errors: (k: string) => string[] | undefined;
};

/** The shape, its dimensions in mm or inches, and the area the engine computes from them as they are typed. */
export function ShapeFields({ unitSystem, defaults, errors }: Props) {
  const [kind, setKind] = useState<ShapeKind>(defaults.kind);
  const [unit, setUnit] = useState<LengthUnit>(defaults.unit);
  const [dims, setDims] = useState<Record<string, string>>(defaults.dims);
  const [flags, setFlags] = useState<Record<string, boolean>>(defaults.flags);
  const shape = SHAPES[kind];
  const outcome = measureShapeEntry({ kind, unit, dims, flags });
  return (
    <div className="flex flex-col gap-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Shape"
          name="shapeKind"
          value={kind}
          onChange={(e) => setKind(e.target.value as ShapeKind)}
          options={Object.entries(SHAPES).map(([value, s]) => ({ value, label: s.label }))}
          errors={errors('shapeKind')}
        />
        <SelectField label="Dimensions in" name="lengthUnit" value={unit} onChange={(e) => setUnit(e.target.value as LengthUnit)} options={LENGTH_UNITS} errors={errors('lengthUnit')} />
      </div>
      <p className="text-sm text-ink-muted">
        Formula: <span className="font-mono">{shape.formula}</span>
      </p>
      <div className="grid gap-4 sm:grid-cols-3">
        {shape.dims.map((d) => (
          <NumberField
            key={`${kind}-${d.key}`}
            label={d.label}
            name={shapeField(d.key)}
            unit={d.isCount ? undefined : unit}
            value={dims[d.key] ?? ''}
            onChange={(e) => setDims((old) => ({ ...old, [d.key]: e.target.value }))}
            errors={errors(shapeField(d.key))}
          />
        ))}
      </div>
      {shape.flags.length ? (
        <div className="flex flex-wrap gap-6">
          {shape.flags.map((f) => (
            <label key={f.key} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                name={shapeField(f.key)}
                checked={flags[f.key] ?? true}
                onChange={(e) => setFlags((old) => ({ ...old, [f.key]: e.target.checked }))}
                className="size-4"
              />
              {f.label}
            </label>
          ))}
        </div>
      ) : null}
      <p aria-live="polite" className="rounded-md bg-surface-muted px-3 py-2 text-sm">
        {outcome.ok ? (
          <>
            Area per part <strong className="tabular">{formatArea(outcome.measure.areaDm2, unitSystem)}</strong> · volume{' '}
            <span className="tabular">{formatVolume(outcome.measure.volumeCm3, unitSystem)}</span>
          </>
        ) : (
          'Enter the dimensions to see the area.'
        )}
      </p>
    </div>
  );
}
