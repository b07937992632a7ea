'use client';

import { Card } from '@/components/ui/card';
import { NumberField, SelectField } from '@/components/ui/field';
import { cx } from '@/components/ui/cx';
import { SUBSTRATES, UNITS, unitsOf, type SubstrateId } from '@/lib/plating';
import { LENGTH_UNITS, SHAPES, shapeField, isShapeKind, type LengthUnit } from '@/lib/parts/shapes';
import { geometryRows } from '@/lib/estimating/format';
import type { GeometryFigures } from '@/lib/estimating/calculation';
import type { AreaUnit, GeometryMode } from '@/lib/estimating/form-state';
import { STEEL_SUBSTRATES } from '@/lib/estimating/safety';
import { bind, type PanelProps } from './panel';
import { StlUpload } from './stl-upload';

const MODES: { value: GeometryMode; label: string }[] = [
  { value: 'shape', label: 'Shape' },
  { value: 'area', label: 'Area' },
  { value: 'stl', label: '3D model (STL)' },
];

export function GeometryPanel(p: PanelProps & { geometry: GeometryFigures | null }) {
  const { form, set } = p;
  const isSteel = STEEL_SUBSTRATES.has(form.substrate);
  return (
    <Card title="Part" description="Measure one part: a simple shape, an area you already know, or the 3D model.">
      <div className="flex flex-col gap-4">
        <fieldset>
          <legend className="mb-1.5 text-sm font-medium">Measure the part by</legend>
          <div className="inline-flex rounded-md border border-surface-line p-0.5" role="radiogroup">
            {MODES.map((m) => (
              <label key={m.value} className={cx('cursor-pointer rounded px-3 py-1.5 text-sm', form.geometryMode === m.value ? 'bg-action text-white' : 'text-ink hover:bg-surface-muted')}>
                <input type="radio" name="geometryMode" value={m.value} checked={form.geometryMode === m.value} onChange={() => set({ geometryMode: m.value })} className="sr-only" />
                {m.label}
              </label>
            ))}
          </div>
        </fieldset>

        {form.geometryMode === 'shape' ? <ShapeFields {...p} /> : null}
        {form.geometryMode === 'area' ? (
          <div className="grid gap-3 sm:grid-cols-[1fr_10rem]">
            <NumberField label="Area per part" {...bind(p, 'area')} required />
            <SelectField
              label="Area unit"
              name="areaUnit"
              value={form.areaUnit}
              onChange={(e) => set({ areaUnit: e.target.value as AreaUnit })}
              options={unitsOf('area').map((u) => ({ value: u, label: UNITS[u].symbol }))}
            />
          </div>
        ) : null}
        {form.geometryMode === 'stl' ? (
          <StlUpload value={form.stl} system={p.system} error={p.errors.stl} onChange={(stl) => set({ stl })} />
        ) : null}
        {p.errors.geometry ? <p className="text-sm text-out">{p.errors.geometry.join(' ')}</p> : null}

        <div className="grid gap-3 sm:grid-cols-3">
          <SelectField
            label="Substrate"
            name="substrate"
            value={form.substrate}
            onChange={(e) => set({ substrate: e.target.value as SubstrateId })}
            options={Object.entries(SUBSTRATES).map(([id, s]) => ({ value: id, label: s.name }))}
          />
          {isSteel ? (
            <>
              <NumberField label="Hardness" unit="HRC" hint="Leave blank if not hardened." {...bind(p, 'hardnessHrc')} />
              <NumberField label="Tensile strength" unit="MPa" hint="Either value is enough." {...bind(p, 'tensileMpa')} />
            </>
          ) : null}
        </div>

        {p.geometry ? (
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md bg-surface-muted px-3 py-2 text-sm" aria-label="Part measurements">
            {geometryRows(p.geometry, p.system).map((r) => (
              <div key={r.label} className="contents">
                <dt className="text-ink-muted">{r.label}</dt>
                <dd className="tabular">{r.text}</dd>
              </div>
            ))}
          </dl>
        ) : null}
      </div>
    </Card>
  );
}

function ShapeFields(p: PanelProps) {
  const { form, set } = p;
  const spec = SHAPES[form.shape.kind];
  const setShape = (patch: Partial<typeof form.shape>) => set({ shape: { ...form.shape, ...patch } });
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem]">
        <SelectField
          label="Shape"
          name="shapeKind"
          value={form.shape.kind}
          hint={spec.formula}
          onChange={(e) => {
            const kind = e.target.value;
            if (!isShapeKind(kind)) return;
            // Ends and bores count unless the estimator says otherwise, as the engine assumes.
            setShape({ kind, flags: Object.fromEntries(SHAPES[kind].flags.map((f) => [f.key, true])) });
          }}
          options={Object.entries(SHAPES).map(([k, s]) => ({ value: k, label: s.label }))}
        />
        <SelectField
          label="Dimensions in"
          name="shapeUnit"
          value={form.shape.unit}
          onChange={(e) => setShape({ unit: e.target.value as LengthUnit })}
          options={LENGTH_UNITS}
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        {spec.dims.map((d) => (
          <NumberField
            key={d.key}
            label={d.label}
            name={shapeField(d.key)}
            unit={d.isCount ? undefined : form.shape.unit}
            value={form.shape.dims[d.key] ?? ''}
            onChange={(e) => setShape({ dims: { ...form.shape.dims, [d.key]: e.target.value } })}
            errors={p.errors[shapeField(d.key)]}
            required
          />
        ))}
      </div>
      {spec.flags.length ? (
        <div className="flex flex-wrap gap-4">
          {spec.flags.map((f) => (
            <label key={f.key} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                name={shapeField(f.key)}
                checked={form.shape.flags[f.key] ?? false}
                onChange={(e) => setShape({ flags: { ...form.shape.flags, [f.key]: e.target.checked } })}
              />
              {f.label}
            </label>
          ))}
        </div>
      ) : null}
    </div>
  );
}
