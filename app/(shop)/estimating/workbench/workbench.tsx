'use client';

import { useCallback, useEffect, useMemo, useState } from 'react';
import { Card } from '@/components/ui/card';
import { displayUnit, fromStorage, type UnitSystem } from '@/lib/plating';
import { formatValue } from '@/lib/estimating/format';
import { calculationInputSchema, type CalculationInput } from '@/lib/estimating/calculation-schema';
import { defaultForm, formFromInput, type WorkbenchForm } from '@/lib/estimating/form-state';
import type { LibraryProcess } from '@/lib/estimating/process-library';
import { recomputeWorkbench, type WorkbenchView } from '@/lib/estimating/recompute';
import { GeometryPanel } from './geometry-panel';
import { ProcessPanel } from './process-panel';
import { ResultsPanel } from './results-panel';
import { SafetyPanel } from './safety-panel';
import { SaveForm } from './save-form';

// The last valid input, kept for this browser tab so the job survives a trip to another page
// (e.g. switching units under Your account). Stored in storage units, shown in the current ones.
const DRAFT_KEY = 'ampwright:workbench-draft';

type Props = {
  system: UnitSystem;
  library: LibraryProcess[];
  initial: CalculationInput | null;
  initialTitle: string | null;
};

function suggestTitle(view: WorkbenchView, system: UnitSystem): string {
  const e = view.result?.estimate;
  if (!e) return '';
  const unit = displayUnit('thickness', system);
  return `${e.metal.name} ${formatValue(fromStorage(e.minimumThicknessUm, unit), unit, 3)}, ${e.quantity} parts`;
}

export function Workbench({ system, library, initial, initialTitle }: Props) {
  const [form, setForm] = useState<WorkbenchForm>(() => (initial ? formFromInput(initial, system) : defaultForm(system, library)));
  const set = useCallback((patch: Partial<WorkbenchForm>) => setForm((f) => ({ ...f, ...patch })), []);

  // Every keystroke: the same engine as the server, timed so the page can show it stays in a frame.
  const { view, ms } = useMemo(() => {
    const t0 = performance.now();
    const finish = library.find((l) => l.finishId === form.finishId);
    const v = recomputeWorkbench(form, system, finish ? { words: `${finish.name} ${finish.specText}`, bathHazards: finish.bathHazards } : {});
    return { view: v, ms: performance.now() - t0 };
  }, [form, system, library]);

  useEffect(() => {
    if (initial) return;
    try {
      const raw = sessionStorage.getItem(DRAFT_KEY);
      const parsed = raw ? calculationInputSchema.safeParse(JSON.parse(raw)) : null;
      if (parsed?.success) setForm(formFromInput(parsed.data, system));
    } catch {
      // A damaged draft is simply not restored.
    }
  }, [initial, system]);

  useEffect(() => {
    if (!view.input) return;
    try {
      sessionStorage.setItem(DRAFT_KEY, JSON.stringify(view.input));
    } catch {
      // Storage full or disabled: the draft is a convenience only.
    }
  }, [view.input]);

  const panel = { form, set, errors: view.fieldErrors, system };
  return (
    <div className="flex flex-col gap-6" data-recompute-ms={ms.toFixed(3)} suppressHydrationWarning>
      <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_minmax(0,30rem)]">
        <div className="flex min-w-0 flex-col gap-6">
          <GeometryPanel {...panel} geometry={view.geometry} />
          <ProcessPanel {...panel} library={library} />
          <SafetyPanel {...panel} view={view} />
        </div>
        <div className="flex min-w-0 flex-col gap-6 xl:sticky xl:top-6">
          <ResultsPanel view={view} system={system} />
          <Card title="Save this calculation" description="Saved calculations can be reopened here and used on parts and quotes.">
            <SaveForm input={view.input} suggestedTitle={initialTitle ?? suggestTitle(view, system)} />
          </Card>
          <p className="text-xs text-ink-faint" suppressHydrationWarning>Recomputed in {ms < 0.1 ? 'under 0.1' : ms.toFixed(1)} ms.</p>
        </div>
      </div>
    </div>
  );
}
