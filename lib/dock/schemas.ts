// What the dock's forms and API send, checked with zod; each message names the field in words.
import { z } from 'zod';

const blank = (v: unknown) => (v === '' || v === undefined || v === null ? undefined : v);

export const wholeCount = (label: string) =>
  z.coerce.number({ error: `Enter ${label}.` }).int(`Enter a whole number of ${label}.`).min(1, 'Enter at least 1.').max(100_000_000, 'That is more than 100 million.');

const optionalWeight = z.preprocess(
  blank,
  z.coerce.number({ error: 'Enter the weight in kilograms.' }).gt(0, 'Enter a weight above 0.').lt(1_000_000, 'That weight is too large.').optional(),
);

const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).default('');

export const DISCREPANCIES = ['none', 'short', 'over', 'damaged', 'wrong_part'] as const;
/** The discrepancy in a word or two, for badges and subjects. */
export const DISCREPANCY_SHORT: Record<(typeof DISCREPANCIES)[number], string> = { none: 'None', short: 'Short', over: 'Over', damaged: 'Damaged', wrong_part: 'Wrong part' };

export const DISCREPANCY_LABELS: Record<(typeof DISCREPANCIES)[number], string> = {
  none: 'None: as expected',
  short: 'Short: fewer parts than expected',
  over: 'Over: more parts than expected',
  damaged: 'Damaged on arrival',
  wrong_part: 'Wrong part',
};

const photoIds = z.preprocess(
  (v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : String(v).split(',').filter(Boolean)),
  z.array(z.uuid('A photo reference is not valid; upload the photo again.')).max(12, 'Attach at most 12 photos.'),
);

export const receiptSchema = z
  .object({
    workOrderId: z.uuid({ error: 'Choose the work order the parts arrived for.' }),
    quantity: wholeCount('parts received'),
    containers: wholeCount('containers').max(1000, 'Use at most 1,000 containers.'),
    weightKg: optionalWeight,
    customerPartNumber: text(80),
    customerLot: text(80),
    conditionNote: text(2000),
    discrepancy: z.enum(DISCREPANCIES, { error: 'Choose what, if anything, was wrong.' }).default('none'),
    discrepancyNote: text(2000),
    photoIds,
  })
  .superRefine((v, ctx) => {
    if (v.discrepancy !== 'none' && v.discrepancyNote.length < 3) {
      ctx.addIssue({ code: 'custom', path: ['discrepancyNote'], message: 'Say what is wrong: the customer receives this text.' });
    }
  });
export type ReceiptInput = z.infer<typeof receiptSchema>;

export const reworkReturnSchema = z
  .object({
    originalWorkOrderId: z.uuid({ error: 'Choose the order the parts were shipped on.' }),
    nonconformanceId: z.preprocess(blank, z.uuid('Choose the nonconformance from the list.').optional()),
    poNumber: z.string().trim().min(1, 'Enter the return or PO reference.').max(60, 'Use at most 60 characters.'),
    quantity: wholeCount('parts returned'),
    containers: wholeCount('containers').max(1000, 'Use at most 1,000 containers.'),
    weightKg: optionalWeight,
    customerLot: text(80),
    conditionNote: text(2000),
    reason: z.string().trim().min(3, 'Say why the parts came back.').max(2000, 'Use at most 2000 characters.'),
  });
export type ReworkReturnInput = z.infer<typeof reworkReturnSchema>;

export const countMoveSchema = z.object({
  workOrderId: z.uuid(),
  kind: z.enum(['scrap', 'hold', 'release', 'scrap_held'], { error: 'Choose what happens to the parts.' }),
  quantity: wholeCount('parts'),
  reason: z.string().trim().min(3, 'Say why, in a few words.').max(500, 'Use at most 500 characters.'),
});
export type CountMoveInput = z.infer<typeof countMoveSchema>;

export const shipmentSchema = z.object({
  workOrderId: z.uuid({ error: 'Choose the work order to ship.' }),
  quantity: wholeCount('parts shipped'),
  containers: wholeCount('containers').max(1000, 'Use at most 1,000 containers.'),
  weightKg: optionalWeight,
  carrier: z.string().trim().min(1, 'Enter the carrier (or "Customer pickup").').max(100, 'Use at most 100 characters.'),
  trackingNumber: text(100),
  emailCustomer: z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean()),
});
export type ShipmentInput = z.infer<typeof shipmentSchema>;
