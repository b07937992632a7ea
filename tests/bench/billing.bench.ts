// Benchmark of the invoice PDF: render time of a one-line invoice and of a long one (60 lines,
// several pages), warm (fonts loaded), as the median of several renders. Run alone with
// `npm run bench -- billing`. The renderer is ESM-only, so it is imported dynamically.
import { performance } from 'node:perf_hooks';
import { createElement } from 'react';
import type { InvoicePdfData } from '../../lib/billing/pdf/invoice-layout';
import { medianRender } from './stats';
import type { BenchRow } from './types';

const RUNS = 9;
const TARGET_ONE_LINE_MS = 300; // our own target: a PDF opens without a noticeable wait

function invoiceWith(lineCount: number): InvoicePdfData {
  const lines = Array.from({ length: lineCount }, (_, i) => ({
    lineNo: i + 1,
    description: `W2026-${String(40 + i).padStart(5, '0')} · PO 4500${i} · HX-0816 rev C · Zinc, clear trivalent passivate (barrel) · 2,450 pc shipped`,
    quantity: 24.5,
    unit: '100 pc',
    unitPriceCents: 1234.5678,
    amountCents: 30_247,
  }));
  const subtotal = 30_247 * lineCount;
  const tax = Math.floor((subtotal * 725 + 5000) / 10_000);
  return {
    shop: { name: 'Bench Plating Works', address: '1 Test Street, Sampletown', phone: '(555) 010-0000', email: 'office@bench.test' },
    number: 'I2026-99999',
    issuedOn: '2026-12-01',
    dueOn: '2026-12-31',
    paymentTermsDays: 30,
    billTo: { name: 'Bench Customer Ltd', address: '2 Example Road, Sampletown', email: 'ap@bench-customer.test' },
    lines,
    subtotalCents: subtotal,
    taxRateBp: 725,
    taxCents: tax,
    totalCents: subtotal + tax,
    creditedCents: 0,
    paidCents: 0,
    openCents: subtotal + tax,
    creditNotes: [],
    roundingRule: 'Each line is quantity × unit price, rounded half-up to the cent.',
    notes: '',
    payUrl: 'http://127.0.0.1:3000/portal/invoices/bench',
  };
}

export async function run(): Promise<BenchRow[]> {
  const pdf = await import('@react-pdf/renderer');
  const { makeInvoiceDocument } = await import('../../lib/billing/pdf/invoice-layout');
  const Doc = makeInvoiceDocument(pdf);
  const render = (d: InvoicePdfData) => pdf.renderToBuffer(createElement(Doc, { d }) as Parameters<typeof pdf.renderToBuffer>[0]);

  const timeOf = (d: InvoicePdfData) => medianRender(RUNS, () => render(d));

  const cold0 = performance.now();
  await render(invoiceWith(1)); // loads and parses the fonts once
  const coldMs = performance.now() - cold0;
  const one = await timeOf(invoiceWith(1));
  const long = await timeOf(invoiceWith(60));
  const ratio = long.ms / one.ms;
  return [
    {
      area: 'billing',
      what: 'invoice PDF, 1 line (median of 9, warm)',
      value: `${one.ms.toFixed(1)} ms (${(one.bytes / 1024).toFixed(1)} KiB)`,
      baseline: `first render incl. fonts ${coldMs.toFixed(0)} ms`,
      ratio: null,
      target: `≤ ${TARGET_ONE_LINE_MS} ms`,
      met: one.ms <= TARGET_ONE_LINE_MS,
    },
    {
      area: 'billing',
      what: 'invoice PDF, 60 lines over several pages',
      value: `${long.ms.toFixed(1)} ms (${(long.bytes / 1024).toFixed(1)} KiB)`,
      baseline: `1 line ${one.ms.toFixed(1)} ms`,
      ratio: Number(ratio.toFixed(2)),
      target: '≤ 10× the 1-line render',
      met: ratio <= 10,
    },
  ];
}
