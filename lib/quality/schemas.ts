// Form inputs of the quality screens. Numbers arrive as text in the user's unit system and are
// converted to storage units (µm, °C) by the actions through lib/plating's units.
import { z } from 'zod';
import { numberField, optionalText, requiredText, uuidField } from '@/lib/records/fields';
import { DISPOSITIONS_LIST } from './lot-types';
import { METHOD_CODES } from './methods';

const method = z.enum(METHOD_CODES, { error: 'Choose the test method.' });

/** Rows of a hand entry travel as one JSON field built by the form. */
export const readingRowSchema = z.object({
  partNo: numberField('the part number', { integer: true, min: 1, max: 100000 }),
  location: requiredText('where on the part', 120),
  thickness: numberField('the thickness', { min: 0, max: 200000 }),
});

export const manualReadingsSchema = z.object({
  workOrderId: uuidField('a work order'),
  method,
  rows: z.string().transform((s, ctx) => {
    try {
      const v: unknown = JSON.parse(s);
      if (Array.isArray(v)) return v as unknown[];
    } catch {
      // reported below
    }
    ctx.addIssue({ code: 'custom', message: 'The readings could not be read; reload the page.' });
    return z.NEVER;
  }),
});

export const csvReadingsSchema = z.object({
  workOrderId: uuidField('a work order'),
  method: z.preprocess((v) => (v === '' ? undefined : v), method.optional()),
});

export const voidReadingSchema = z.object({ readingId: uuidField('a reading'), reason: requiredText('why the reading is void', 500) });

export const bakeSchema = z.object({
  workOrderId: uuidField('a work order'),
  platingEnded: requiredText('when plating ended', 40),
  bakeStarted: requiredText('when the bake started', 40),
  oven: requiredText('the oven', 60),
  tempMin: numberField('the lowest part temperature', { min: -50, max: 2000 }),
  tempMax: numberField('the highest part temperature', { min: -50, max: 2000 }),
  durationH: numberField('the bake time', { min: 0, max: 500 }),
  chartFileId: z.preprocess((v) => (v === '' ? undefined : v), z.uuid().optional()),
  notes: optionalText(1000),
});

export const bakeDispositionSchema = z.object({ bakeId: uuidField('a bake record'), reason: requiredText('the reason for the disposition', 1000) });

export const openNonconformanceSchema = z.object({
  workOrderId: uuidField('a work order'),
  source: z.enum(['thickness', 'bake', 'other'], { error: 'Say what failed.' }),
  description: requiredText('what does not conform', 2000),
});

export const dispositionSchema = z.object({
  nonconformanceId: uuidField('a nonconformance'),
  disposition: z.enum(DISPOSITIONS_LIST, { error: 'Choose a disposition.' }),
  customerApprovalRef: optionalText(120),
  note: optionalText(2000),
});

export const issueCertificateSchema = z.object({ workOrderId: uuidField('a work order') });

export const samplingPlanSchema = z.object({
  name: requiredText('a name for the plan', 200),
  source: optionalText(300),
  rows: z.string().transform((s, ctx) => {
    try {
      const v: unknown = JSON.parse(s);
      if (Array.isArray(v)) return v as { minLot: unknown; maxLot: unknown; codeLetter: unknown; sampleSize: unknown }[];
    } catch {
      // reported below
    }
    ctx.addIssue({ code: 'custom', message: 'The table could not be read; reload the page.' });
    return z.NEVER;
  }),
});
