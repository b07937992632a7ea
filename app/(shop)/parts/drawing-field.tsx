'use client';

import { useState } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { uploadFile } from '@/lib/files/upload-client';

/** Uploads a drawing (PDF or image) at once and keeps its id for the part form. */
export function DrawingField({ defaults, errors }: { defaults: { fileId: string; fileName: string }; errors?: string[] }) {
  const [fileId, setFileId] = useState(defaults.fileId);
  const [fileName, setFileName] = useState(defaults.fileName);
  const [status, setStatus] = useState<{ tone: 'error' | 'info'; text: string } | null>(null);

  async function onChoose(file: File | undefined) {
    if (!file) return;
    setStatus({ tone: 'info', text: `Uploading ${file.name}…` });
    try {
      const stored = await uploadFile(file, 'drawing');
      setFileId(stored.id);
      setFileName(stored.name);
      setStatus(null);
    } catch (e) {
      setStatus({ tone: 'error', text: e instanceof Error ? e.message : 'The upload failed.' });
    }
  }

  return (
    <div className="flex flex-col gap-1">
      <input type="hidden" name="drawingFileId" value={fileId} />
      <label htmlFor="drawing-file" className="text-sm font-medium text-ink">
        Drawing (PDF or image, up to 25 MB)
      </label>
      <input id="drawing-file" type="file" accept=".pdf,.png,.jpg,.jpeg,.gif,.webp,application/pdf,image/*" onChange={(e) => onChoose(e.target.files?.[0])} className="text-sm" />
      {fileId ? (
        <p className="text-sm">
          <a href={`/api/files/${fileId}?inline=1`} target="_blank" rel="noopener">
            {fileName || 'Open the drawing'}
          </a>
        </p>
      ) : null}
      {status ? <FormMessage tone={status.tone} message={status.text} /> : null}
      {errors?.map((m) => (
        <p key={m} className="text-sm text-out" aria-live="polite">
          {m}
        </p>
      ))}
    </div>
  );
}
