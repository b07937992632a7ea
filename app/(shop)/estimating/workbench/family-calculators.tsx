'use client';

import { useMemo, useState } from 'react';
import { FamilyFigures } from '@/components/family-figures/family-figures';
import { NumberField, SelectField } from '@/components/ui/field';
import { Tabs } from '@/components/ui/tabs';
import type { ProcessFamilyId } from '@/db/types';
import { FAMILIES } from '@/lib/families';
import type { FamilyCalculator } from '@/lib/families/types';
import { displayUnit, fromStorage, PlatingInputError, toStorage, UNITS, type UnitSystem } from '@/lib/plating';

/** One calculator: its inputs in the user's units, its figures recomputed on every keystroke. */
function Calculator({ calc, system, familyData }: { calc: FamilyCalculator; system: UnitSystem; familyData: Record<string, unknown> | undefined }) {
  const [text, setText] = useState<Record<string, string>>(() =>
    Object.fromEntries(
      calc.inputs.map((i) => [i.name, typeof i.initial === 'number' && i.quantity ? String(Number(fromStorage(i.initial, displayUnit(i.quantity, system)).toPrecision(4))) : String(i.initial)]),
    ),
  );
  const result = useMemo(() => {
    const values: Record<string, number | string> = {};
    for (const i of calc.inputs) {
      const t = (text[i.name] ?? '').trim().replace(',', '.');
      if (i.kind === 'select' || t === '') values[i.name] = t;
      else values[i.name] = i.quantity ? toStorage(Number(t), displayUnit(i.quantity, system)) : Number(t);
    }
    try {
      return { ok: true as const, ...calc.compute(values, familyData) };
    } catch (err) {
      const field = err instanceof PlatingInputError ? err.field : null;
      return { ok: false as const, field, message: err instanceof Error ? err.message : 'Check the numbers.' };
    }
  }, [calc, text, system, familyData]);
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,22rem)_1fr]">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-1">
        {calc.inputs.map((i) =>
          i.kind === 'select' ? (
            <SelectField key={i.name} label={i.label} name={i.name} value={text[i.name] ?? ''} onChange={(e) => setText((t) => ({ ...t, [i.name]: e.target.value }))} options={i.options ?? []} hint={i.hint} />
          ) : (
            <NumberField
              key={i.name}
              label={i.label}
              name={i.name}
              unit={i.quantity ? `${UNITS[displayUnit(i.quantity, system)].symbol}${i.perHour ? '/h' : ''}` : i.unit}
              value={text[i.name] ?? ''}
              onChange={(e) => setText((t) => ({ ...t, [i.name]: e.target.value }))}
              hint={i.hint}
              errors={!result.ok && result.field === i.name ? [result.message] : undefined}
            />
          ),
        )}
      </div>
      <section aria-live="polite" aria-label={`${calc.title}: results`} className="flex flex-col gap-3 rounded-lg border border-surface-line bg-surface-muted p-4">
        {result.ok ? (
          <>
            <FamilyFigures figures={result.figures} units={system} label={calc.title} />
            {result.notes.map((n) => (
              <p key={n} className="text-xs text-ink-muted">
                {n}
              </p>
            ))}
          </>
        ) : (
          <p className="text-sm text-out">{result.message}</p>
        )}
      </section>
    </div>
  );
}

/** The other families' quick calculations beside the plating workbench. */
export function FamilyCalculators({ system, familyData }: { system: UnitSystem; familyData: Partial<Record<ProcessFamilyId, Record<string, unknown>>> }) {
  const calcs = FAMILIES.flatMap((f) => f.calculators.map((c) => ({ id: `${f.id}-${c.title}`, c, data: familyData[f.id] })));
  return <Tabs label="Process calculators" tabs={calcs.map(({ id, c, data }) => ({ id, label: c.title, content: <Calculator calc={c} system={system} familyData={data} /> }))} />;
}
