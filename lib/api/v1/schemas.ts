// The shapes of /api/v1: what each endpoint takes and answers. The OpenAPI document is generated
// from these very schemas (lib/api/v1/openapi.ts), and every answer is parsed through its schema
// before it is sent, so the document cannot drift from what the API does.
import { z } from 'zod';
import { ENTRY_KEY } from '@/lib/bath/schemas';

export const pageQuery = z.object({
  limit: z.coerce.number({ error: 'limit must be a number.' }).int('limit must be a whole number.').min(1, 'limit is at least 1.').max(200, 'limit is at most 200.').default(50)
    .meta({ description: 'Rows per page (1–200, default 50).' }),
  after: z.string().max(300, 'after is too long.').regex(/^[A-Za-z0-9_-]+$/, 'after must be the `next` of an earlier page.').optional()
    .meta({ description: 'The `next` of the previous page; leave out for the first page.' }),
});
export type PageQuery = z.infer<typeof pageQuery>;

export function pageOf<T extends z.ZodType>(item: T, name: string) {
  return z.object({
    data: z.array(item),
    next: z.string().nullable().meta({ description: 'Pass as `after` for the next page; null on the last page.' }),
  }).meta({ id: `${name}Page` });
}

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/).meta({ description: 'A day in the shop’s time zone, YYYY-MM-DD.' });
const instant = z.string().meta({ description: 'An instant, ISO 8601 in UTC.', format: 'date-time' });
const cents = z.number().int().meta({ description: 'An amount of money in cents of the invoice’s currency.' });

export const apiError = z.object({
  error: z.object({ code: z.string(), message: z.string(), fields: z.record(z.string(), z.array(z.string())).optional() }),
}).meta({ id: 'Error' });

export const part = z.object({
  id: z.uuid(),
  customerId: z.uuid(),
  partNumber: z.string(),
  revision: z.string(),
  description: z.string(),
  substrate: z.string(),
  areaDm2: z.number().meta({ description: 'Surface area of one piece, dm².' }),
  weightG: z.number().nullable().meta({ description: 'Mass of one piece, g.' }),
}).meta({ id: 'Part' });

export const QUOTE_STATUSES = ['sent', 'accepted', 'declined', 'expired', 'draft', 'superseded'] as const;
export const quote = z.object({
  id: z.uuid(),
  number: z.string(),
  revision: z.string(),
  customerId: z.uuid(),
  status: z.enum(QUOTE_STATUSES),
  isRush: z.boolean(),
  totalCents: cents,
  poNumber: z.string().nullable(),
  turnaroundDays: z.number().int().nullable().meta({ description: 'Working days from receipt of parts to shipping, from the line’s load when the quote was sent.' }),
  sentAt: instant.nullable(),
  expiresAt: instant.nullable(),
  decidedAt: instant.nullable(),
}).meta({ id: 'Quote' });
export const quoteListQuery = pageQuery.extend({ status: z.enum(QUOTE_STATUSES, { error: 'Not a quote status.' }).optional() });

export const WORK_ORDER_STATES = ['accepted', 'received', 'in_process', 'plated', 'baked', 'inspected', 'shipped', 'invoiced'] as const;
export const workOrder = z.object({
  id: z.uuid(),
  number: z.string(),
  customerId: z.uuid(),
  partId: z.uuid(),
  partNumber: z.string(),
  finishCode: z.string(),
  specification: z.string(),
  poNumber: z.string(),
  state: z.enum(WORK_ORDER_STATES),
  isRush: z.boolean(),
  quantities: z.object({ ordered: z.number().int(), received: z.number().int(), shipped: z.number().int(), scrapped: z.number().int(), held: z.number().int() }),
  dueDate: day.nullable().meta({ description: 'The promised ship date.' }),
  planned: z.object({ start: day.nullable(), finish: day.nullable(), isLate: z.boolean() }).nullable()
    .meta({ description: 'The line’s plan for an open order: the first and last day it runs, and whether that misses the due date. Null once it has run.' }),
  actual: z.object({ firstReceivedAt: instant.nullable(), lastShippedAt: instant.nullable() }),
}).meta({ id: 'WorkOrder' });
export const workOrderListQuery = pageQuery.extend({ state: z.enum(WORK_ORDER_STATES, { error: 'Not a work-order state.' }).optional() });

export const shipment = z.object({
  id: z.uuid(),
  number: z.string(),
  workOrderId: z.uuid(),
  workOrderNumber: z.string(),
  customerId: z.uuid(),
  shippedAt: instant,
  quantity: z.number().int(),
  containers: z.number().int(),
  weightKg: z.number().nullable(),
  carrier: z.string(),
  trackingNumber: z.string(),
  certificateNumber: z.string().nullable(),
}).meta({ id: 'Shipment' });

export const certificate = z.object({
  id: z.uuid(),
  number: z.string(),
  workOrderId: z.uuid(),
  workOrderNumber: z.string(),
  customerId: z.uuid(),
  signedAt: instant,
  signedBy: z.string(),
  pdf: z.string().meta({ description: 'Path of the certificate’s PDF under this API.' }),
}).meta({ id: 'Certificate' });

export const INVOICE_STATUSES = ['issued', 'partly_paid', 'paid', 'overpaid', 'credited'] as const;
export const invoice = z.object({
  id: z.uuid(),
  number: z.string(),
  customerId: z.uuid(),
  status: z.enum(INVOICE_STATUSES),
  issuedOn: day,
  dueOn: day,
  currency: z.string(),
  totalCents: cents,
  creditedCents: cents,
  paidCents: cents,
  openCents: cents.meta({ description: 'What is still owed: total − credited − paid, never below 0.' }),
  creditOnAccountCents: cents.meta({ description: 'Paid beyond the total, held as the customer’s credit.' }),
}).meta({ id: 'Invoice' });

export const ANALYSIS_VERDICTS = ['in_range', 'near_limit', 'out_of_range'] as const;
export const analysis = z.object({
  id: z.uuid(),
  tankId: z.uuid(),
  tankCode: z.string(),
  analyteId: z.uuid(),
  analyte: z.string(),
  value: z.number(),
  unit: z.string(),
  verdict: z.enum(ANALYSIS_VERDICTS),
  source: z.enum(['floor', 'office', 'lab', 'seed']),
  takenAt: instant,
  supersedesId: z.uuid().nullable(),
}).meta({ id: 'Analysis' });
export const analysisListQuery = pageQuery.extend({
  tankId: z.uuid({ error: 'tankId must be a tank id.' }).optional(),
  since: z.iso.datetime({ offset: true, error: 'since must be an ISO date and time.' }).optional().meta({ description: 'Only analyses taken at or after this instant.' }),
});

/** A laboratory's result, already in the analyte's unit. Sending the same key again stores nothing new. */
export const analysisIn = z.strictObject({
  key: ENTRY_KEY.meta({ description: 'Your own unique id for this result (8–120 of A–Z a–z 0–9 _ : . -); a resend with the same key is answered with the stored analysis.' }),
  tankId: z.uuid({ error: 'tankId must be a tank id.' }),
  analyteId: z.uuid({ error: 'analyteId must be an analyte id.' }),
  value: z.number({ error: 'value must be a number.' }).finite(),
  takenAt: z.iso.datetime({ offset: true, error: 'takenAt must be an ISO date and time.' })
    .refine((t) => new Date(t).getTime() <= Date.now() + 10 * 60_000, 'takenAt is in the future: check the sending system’s clock.'),
  note: z.string().max(500, 'Keep the note under 500 characters.').optional(),
}).meta({ id: 'AnalysisIn' });

export const analysisLogged = z.object({
  analysis,
  duplicate: z.boolean(),
  verdict: z.string(),
  message: z.string(),
}).meta({ id: 'AnalysisLogged' });
