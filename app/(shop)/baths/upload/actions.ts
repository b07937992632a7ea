'use server';

import { after } from 'next/server';
import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { formAction } from '@/lib/action';
import { notifyNewAlerts } from '@/lib/bath/floor-entries';
import { importLabCsv } from '@/lib/bath/lab-import';

const MAX_BYTES = 2 * 1024 * 1024;

// Row errors travel in fieldErrors as "row:<n>:<column>" so the form can list them by row and column.
export const uploadLabCsvAction = formAction('bath.log', z.object({}), async (_input, user, formData) => {
  const file = formData.get('file');
  if (!(file instanceof File) || file.size === 0) return { ok: false, message: 'Choose a CSV file.', fieldErrors: { file: ['Choose a CSV file.'] } };
  if (file.size > MAX_BYTES) return { ok: false, message: 'The file is larger than 2 MB.', fieldErrors: { file: ['At most 2 MB.'] } };
  const text = await file.text();
  const result = await importLabCsv(user, text);
  if (!result.ok) {
    const fieldErrors: Record<string, string[]> = {};
    for (const e of result.errors) (fieldErrors[`row:${e.row}:${e.column}`] ??= []).push(e.message);
    return { ok: false, message: `Nothing was saved: ${result.errors.length} problem${result.errors.length === 1 ? '' : 's'} to fix first.`, fieldErrors };
  }
  if (result.newAlertIds.length) after(() => notifyNewAlerts(result.newAlertIds));
  revalidatePath('/baths', 'layout');
  return {
    ok: true,
    message: `${result.imported} result${result.imported === 1 ? '' : 's'} saved${result.alreadyImported ? `; ${result.alreadyImported} were already saved from this file` : ''}.`,
  };
});
