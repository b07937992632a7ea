'use server';

import { revalidatePath } from 'next/cache';
import { formAction, zodFieldErrors, type FormState } from '@/lib/action';
import { displayUnit, toStorage } from '@/lib/plating';
import { dispositionBake, recordBake } from '@/lib/quality/bake/records';
import { issueCertificate } from '@/lib/quality/certificate';
import { dispositionNonconformance, openNonconformance } from '@/lib/quality/nonconformances';
import {
  bakeDispositionSchema,
  bakeSchema,
  csvReadingsSchema,
  dispositionSchema,
  issueCertificateSchema,
  manualReadingsSchema,
  openNonconformanceSchema,
  readingRowSchema,
  voidReadingSchema,
} from '@/lib/quality/schemas';
import { CsvRejected, recordReadings, recordReadingsCsv, voidReading } from '@/lib/quality/thickness';
import { PROCESS_RECORD_LABELS, processRecordSchema, voidProcessRecordSchema } from '@/lib/quality/process/rules';
import { recordProcessRecord, voidProcessRecord } from '@/lib/quality/process/records';

const refresh = (workOrderId: string) => revalidatePath(`/quality/orders/${workOrderId}`);

export const recordReadingsAction = formAction('quality.record', manualReadingsSchema, async (input, user): Promise<FormState> => {
  const unit = displayUnit('thickness', user.unitSystem);
  const fieldErrors: Record<string, string[]> = {};
  const rows = input.rows
    .map((raw, i) => ({ i, parsed: readingRowSchema.safeParse(raw) }))
    .filter(({ i, parsed }) => {
      if (parsed.success) return true;
      for (const [k, v] of Object.entries(zodFieldErrors(parsed.error))) fieldErrors[`rows.${i}.${k}`] = v;
      return false;
    })
    .map(({ parsed }) => parsed.data!);
  if (Object.keys(fieldErrors).length) return { ok: false, message: 'Check the highlighted readings; nothing was saved.', fieldErrors };
  const r = await recordReadings(user, {
    workOrderId: input.workOrderId,
    entry: 'manual',
    readings: rows.map((row) => ({
      partNo: row.partNo,
      location: row.location,
      method: input.method,
      thicknessUm: Math.round(toStorage(row.thickness, unit) * 1e4) / 1e4,
    })),
  });
  refresh(input.workOrderId);
  return {
    ok: r.failCount === 0,
    message: r.failCount === 0 ? `Saved ${r.count} readings. ${r.message}` : `Saved ${r.count} readings. ${r.message} A nonconformance is open for the lot.`,
  };
});

export const uploadReadingsCsvAction = formAction('quality.record', csvReadingsSchema, async (input, user, formData): Promise<FormState> => {
  const file = formData.get('file');
  if (!(file instanceof File) || file.size === 0) return { ok: false, message: 'Choose the CSV file from the instrument.', fieldErrors: { file: ['Choose a CSV file.'] } };
  try {
    const r = await recordReadingsCsv(user, {
      workOrderId: input.workOrderId,
      fileName: file.name,
      bytes: new Uint8Array(await file.arrayBuffer()),
      declaredType: file.type,
      defaultMethod: input.method ?? null,
    });
    refresh(input.workOrderId);
    return { ok: r.failCount === 0, message: `Saved ${r.count} readings from ${file.name}. ${r.message}${r.failCount ? ' A nonconformance is open for the lot.' : ''}` };
  } catch (err) {
    if (err instanceof CsvRejected) {
      return { ok: false, message: err.message, fieldErrors: { file: err.problems.map((p) => (p.row ? `Row ${p.row}${p.column ? `, ${p.column}` : ''}: ${p.message}` : p.message)) } };
    }
    throw err;
  }
});

export const voidReadingAction = formAction('quality.disposition', voidReadingSchema, async (input, user, formData) => {
  await voidReading(user, input);
  refresh(String(formData.get('workOrderId') ?? ''));
  return { ok: true, message: 'The reading is void and stays on record with the reason.' };
});

export const recordBakeAction = formAction('quality.record', bakeSchema, async (input, user): Promise<FormState> => {
  const unit = displayUnit('temperature', user.unitSystem);
  const r = await recordBake(user, {
    workOrderId: input.workOrderId,
    platingEnded: input.platingEnded,
    bakeStarted: input.bakeStarted,
    oven: input.oven,
    tempMinC: Math.round(toStorage(input.tempMin, unit) * 10) / 10,
    tempMaxC: Math.round(toStorage(input.tempMax, unit) * 10) / 10,
    durationH: input.durationH,
    chartFileId: input.chartFileId ?? null,
    notes: input.notes,
  });
  refresh(input.workOrderId);
  return r.verdict === 'pass'
    ? { ok: true, message: 'Bake recorded: it meets the requirement.' }
    : { ok: false, message: `Bake recorded, but it does not meet the requirement: ${r.messages.join(' ')} A supervisor's disposition is needed.` };
});

export const dispositionBakeAction = formAction('quality.disposition', bakeDispositionSchema, async (input, user, formData) => {
  await dispositionBake(user, input);
  refresh(String(formData.get('workOrderId') ?? ''));
  return { ok: true, message: 'Disposition recorded: the order may now be marked baked.' };
});

export const openNonconformanceAction = formAction('quality.record', openNonconformanceSchema, async (input, user) => {
  await openNonconformance(user, input);
  refresh(input.workOrderId);
  return { ok: true, message: 'Nonconformance opened. The order is held from invoicing until it is dispositioned.' };
});

export const dispositionAction = formAction('quality.disposition', dispositionSchema, async (input, user, formData) => {
  await dispositionNonconformance(user, {
    nonconformanceId: input.nonconformanceId,
    disposition: input.disposition,
    customerApprovalRef: input.customerApprovalRef || null,
    note: input.note || null,
  });
  refresh(String(formData.get('workOrderId') ?? ''));
  revalidatePath('/quality/nonconformances');
  return { ok: true, message: 'Dispositioned and closed.' };
});

// Checked as quality.read here so that anyone else hears the certificate rule itself (lib/quality/certificate).
export const issueCertificateAction = formAction('quality.read', issueCertificateSchema, async (input, user) => {
  const c = await issueCertificate(user, input.workOrderId);
  refresh(input.workOrderId);
  revalidatePath('/quality/certificates');
  return { ok: true, message: `Certificate ${c.number} issued and signed by ${user.name}.` };
});

export const recordProcessRecordAction = formAction('quality.record', processRecordSchema, async (input, user): Promise<FormState> => {
  const r = await recordProcessRecord(user, input);
  refresh(input.workOrderId);
  return { ok: true, message: r.verdict === 'pass' ? `${PROCESS_RECORD_LABELS[input.kind]} recorded: passes.` : `${PROCESS_RECORD_LABELS[input.kind]} recorded: fails. ${r.reasons.join(' ')}` };
});

export const voidProcessRecordAction = formAction('quality.disposition', voidProcessRecordSchema, async (input, user): Promise<FormState> => {
  await voidProcessRecord(user, input);
  refresh(input.workOrderId);
  return { ok: true, message: 'Record voided.' };
});
