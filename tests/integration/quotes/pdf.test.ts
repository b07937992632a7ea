import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { getWorkOrder } from '@/lib/orders/queries';
import { renderTravelerPdf } from '@/lib/orders/traveler-pdf';
import { getQuote } from '@/lib/quotes/queries';
import { renderQuotePdf } from '@/lib/quotes/quote-pdf';

afterAll(() => db.destroy());

// The seeded demo quotes and orders (lib/seed/quotes.ts) are enough to render both documents.
describe('PDFs', () => {
  it('renders a quotation with the registered fonts', async () => {
    const row = await db.selectFrom('quotes').select('id').where('status', '=', 'accepted').orderBy('number').limit(1).executeTakeFirstOrThrow();
    const pdf = await renderQuotePdf((await getQuote(row.id))!);
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // The embedded IBM Plex subset, not a built-in Helvetica.
    expect(pdf.toString('latin1')).toMatch(/IBMPlex|Plex/);
    expect(pdf.length).toBeGreaterThan(5000);
  }, 60_000);

  it('renders a traveler with its QR code image', async () => {
    const row = await db.selectFrom('work_orders').select('id').where('quote_line_id', 'is not', null).orderBy('number').limit(1).executeTakeFirstOrThrow();
    const pdf = await renderTravelerPdf((await getWorkOrder(row.id))!, 'us');
    const text = pdf.toString('latin1');
    expect(text.startsWith('%PDF-')).toBe(true);
    expect(text).toMatch(/\/Subtype\s*\/Image/);
  }, 60_000);
});
