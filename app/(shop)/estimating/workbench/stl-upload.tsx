'use client';

import { useRef, useState } from 'react';
import { SelectField } from '@/components/ui/field';
import { PlatingInputError, StlError, type StlUnit, type UnitSystem } from '@/lib/plating';
import type { StlGeometry } from '@/lib/estimating/calculation-schema';
import { analyzeStlBlob, stlGeometryOf } from '@/lib/estimating/stl-file';

const STL_UNITS: { value: StlUnit; label: string }[] = [
  { value: 'mm', label: 'millimetres (mm)' },
  { value: 'in', label: 'inches (in)' },
];

const MB = 1024 * 1024;

type Props = {
  value: StlGeometry | null;
  system: UnitSystem;
  error?: string[];
  onChange: (stl: StlGeometry | null) => void;
};

/**
 * Reads the chosen STL file in this browser, chunk by chunk, with the engine's streaming parser:
 * the file is not uploaded, and a large one never sits in memory whole.
 */
export function StlUpload({ value, system, error, onChange }: Props) {
  const [file, setFile] = useState<File | null>(null);
  const [unit, setUnit] = useState<StlUnit>(value?.unit ?? (system === 'us' ? 'in' : 'mm'));
  const [percent, setPercent] = useState<number | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const run = useRef(0);

  async function measure(f: File, u: StlUnit) {
    const id = ++run.current;
    const current = () => id === run.current;
    setProblem(null);
    setPercent(0);
    onChange(null);
    try {
      const analysis = await analyzeStlBlob(
        f,
        u,
        (read, total) => {
          // Whole percents only, so a large file does not re-render for every chunk.
          const next = total > 0 ? Math.floor((read / total) * 100) : 100;
          if (current()) setPercent((prev) => (prev === next ? prev : next));
        },
        () => !current(),
      );
      if (analysis && current()) onChange(stlGeometryOf(f.name, analysis));
    } catch (e) {
      if (!current()) return;
      if (e instanceof StlError || e instanceof PlatingInputError) setProblem(`${f.name}: ${e.message}`);
      else setProblem(`${f.name} could not be read.`);
    } finally {
      if (current()) setPercent(null);
    }
  }

  const messages = [...(problem ? [problem] : []), ...(!problem && !value && percent === null ? (error ?? []) : [])];
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-[1fr_12rem]">
        <div className="flex flex-col gap-1">
          <label htmlFor="workbench-stl" className="text-sm font-medium">
            STL file
          </label>
          <input
            id="workbench-stl"
            type="file"
            accept=".stl,model/stl,application/sla,application/vnd.ms-pki.stl,application/octet-stream"
            aria-describedby="workbench-stl-status"
            className="text-sm file:mr-3 file:rounded-md file:border file:border-surface-line file:bg-surface file:px-3 file:py-1.5 file:text-sm"
            onChange={(e) => {
              const f = e.target.files?.[0] ?? null;
              setFile(f);
              if (f) void measure(f, unit);
            }}
          />
        </div>
        <SelectField
          label="Model units"
          name="stlUnit"
          value={unit}
          hint="STL files carry no unit."
          onChange={(e) => {
            const u = e.target.value as StlUnit;
            setUnit(u);
            if (file) void measure(file, u);
          }}
          options={STL_UNITS}
        />
      </div>
      <div id="workbench-stl-status" aria-live="polite" className="text-sm">
        {percent !== null ? (
          <div className="flex items-center gap-3">
            <progress max={100} value={percent} className="h-2 w-48" aria-label="Reading the STL file" />
            <span className="tabular text-ink-muted">
              Reading {percent} %{file && file.size > MB ? ` of ${(file.size / MB).toFixed(1)} MB` : ''}…
            </span>
          </div>
        ) : value ? (
          <p className="text-ink-muted">
            Measured from <span className="font-medium text-ink">{value.fileName}</span> in {value.unit === 'in' ? 'inches' : 'millimetres'}.
            {file ? null : ' Choose the file again to re-measure it.'}
          </p>
        ) : null}
        {messages.length ? <p className="text-out">{messages.join(' ')}</p> : null}
      </div>
    </div>
  );
}
