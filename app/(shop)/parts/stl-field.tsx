'use client';

import { useEffect, useState } from 'react';
import { SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { uploadFile } from '@/lib/files/upload-client';
import { StlParser, SUBSTRATES, type StlAnalysis, type SubstrateId, type UnitSystem } from '@/lib/plating';
import { formatArea, formatLength, formatVolume, formatWeight } from '@/lib/parts/display';
import { LENGTH_UNITS, type LengthUnit } from '@/lib/parts/shapes';

type Props = {
  unitSystem: UnitSystem;
  substrate: SubstrateId;
  defaults: { fileId: string; fileName: string; unit: LengthUnit };
  errors: (k: string) => string[] | undefined;
};

// The browser reads the model with the engine's streaming parser for an instant preview; the
// server stores it, and on save measures it again from the stored bytes.
async function analyse(file: File, unit: LengthUnit, substrate: SubstrateId): Promise<StlAnalysis> {
  const parser = new StlParser({ unit, densityGPerCm3: SUBSTRATES[substrate].densityGPerCm3 });
  const reader = file.stream().getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    parser.push(value);
  }
  return parser.finish();
}

export function StlField({ unitSystem, substrate, defaults, errors }: Props) {
  const [file, setFile] = useState<File | null>(null);
  const [fileId, setFileId] = useState(defaults.fileId);
  const [fileName, setFileName] = useState(defaults.fileName);
  const [unit, setUnit] = useState<LengthUnit>(defaults.unit);
  const [analysis, setAnalysis] = useState<StlAnalysis | null>(null);
  const [status, setStatus] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);

  useEffect(() => {
    if (!file) return;
    let live = true;
    analyse(file, unit, substrate).then(
      (a) => live && setAnalysis(a),
      (e: unknown) => live && setStatus({ tone: 'error', text: e instanceof Error ? e.message : 'The model could not be read.' }),
    );
    return () => {
      live = false;
    };
  }, [file, unit, substrate]);

  async function onChoose(chosen: File | undefined) {
    if (!chosen) return;
    setFile(chosen);
    setFileId('');
    setAnalysis(null);
    setStatus({ tone: 'info', text: `Uploading ${chosen.name}…` });
    try {
      const stored = await uploadFile(chosen, 'stl', { unit, substrate });
      setFileId(stored.id);
      setFileName(stored.name);
      setStatus(null);
    } catch (e) {
      setStatus({ tone: 'error', text: e instanceof Error ? e.message : 'The upload failed.' });
    }
  }

  const fileErrors = errors('stlFile');
  return (
    <div className="flex flex-col gap-4">
      <input type="hidden" name="stlFileId" value={fileId} />
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <label htmlFor="stl-file" className="text-sm font-medium text-ink">
            STL model (binary or ASCII, up to 64 MB)
          </label>
          <input id="stl-file" type="file" accept=".stl,model/stl,application/sla" onChange={(e) => onChoose(e.target.files?.[0])} className="text-sm" aria-describedby="stl-file-errors" />
          {fileName && !file ? <p className="text-sm text-ink-muted">Stored model: {fileName}</p> : null}
          <div id="stl-file-errors" aria-live="polite">
            {fileErrors?.map((m) => (
              <p key={m} className="text-sm text-out">
                {m}
              </p>
            ))}
          </div>
        </div>
        <SelectField label="The model is drawn in" name="stlUnit" value={unit} onChange={(e) => setUnit(e.target.value as LengthUnit)} options={LENGTH_UNITS} errors={errors('stlUnit')} />
      </div>
      {status ? <FormMessage tone={status.tone} message={status.text} /> : null}
      {analysis ? (
        <dl aria-live="polite" className="grid gap-x-6 gap-y-1 rounded-md bg-surface-muted px-3 py-2 text-sm sm:grid-cols-2">
          <dt className="text-ink-muted">Area per part</dt>
          <dd className="tabular font-semibold" data-testid="stl-area">{formatArea(analysis.areaDm2, unitSystem)}</dd>
          <dt className="text-ink-muted">Bounding box</dt>
          <dd className="tabular">{analysis.boundingBoxMm.size.map((mm) => formatLength(mm, unit)).join(' × ')}</dd>
          <dt className="text-ink-muted">Volume</dt>
          <dd className="tabular">{formatVolume(analysis.volumeCm3, unitSystem)}</dd>
          <dt className="text-ink-muted">Weight in {SUBSTRATES[substrate].name.toLowerCase()}</dt>
          <dd className="tabular">{analysis.weightG ? formatWeight(analysis.weightG, unitSystem) : '—'}</dd>
          <dt className="text-ink-muted">Triangles</dt>
          <dd className="tabular">{analysis.triangleCount.toLocaleString('en-US')} ({analysis.format})</dd>
        </dl>
      ) : null}
      {analysis && analysis.signedVolumeCm3 <= 0 ? (
        <FormMessage tone="info" message="The model’s facets face inwards or it is not closed: the area is still right, but check the volume and weight." />
      ) : null}
    </div>
  );
}
