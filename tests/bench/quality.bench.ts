// Benchmark of the certificate of conformance PDF: render time of a one-page certificate (8
// readings) and of a long lot (125 readings, 40 printed, two pages), warm, as the median of several
// renders, beside a one-line page in the same fonts measured in the same run. Run alone with
// `npm run bench -- quality`.
import { performance } from 'node:perf_hooks';
import { buildCertificateContent, type CertificateContent } from '../../lib/quality/certificate/content';
import { makeLot, reading } from '../unit/quality/lot-factory';
import { medianRender } from './stats';
import type { BenchRow } from './types';

const RUNS = 7;
const TARGET_MS = 500; // our own target: a supervisor's click signs and shows the PDF without a wait

function content(readings: number): CertificateContent {
  const lot = makeLot({ readings: Array.from({ length: readings }, (_, i) => reading(i + 1, 9 + (i % 7) / 3)) });
  return buildCertificateContent(lot, {
    number: 'CC2026-99999',
    signedAt: new Date('2026-12-01T15:00:00Z'),
    signer: { name: 'Bench Supervisor', role: 'Supervisor' },
    shop: { name: 'Bench Plating Works', address: '1 Test Street, Sampletown', phone: '(555) 010-0000', email: 'office@bench.test' },
    bath: {
      available: true,
      tanks: [{ code: 'Z-ZN1', name: 'Alkaline zinc', inControl: true, note: null, analyses: [{ analyte: 'Zinc metal', value: 9.5, unit: 'g/L', analysedAt: '2026-06-10T10:00:00Z', status: 'in_range' }] }],
    },
    timeZone: 'America/New_York',
  });
}

const timeOf = (render: () => Promise<Buffer>) => medianRender(RUNS, render);

export async function run(): Promise<BenchRow[]> {
  const { renderCertificatePdf } = await import('../../lib/quality/certificate/pdf');
  const k = await import('@react-pdf/renderer');
  const { createElement: h } = await import('react');
  const short = content(8);
  const long = content(125);

  const cold0 = performance.now();
  await renderCertificatePdf(short); // unpacks and registers the fonts once
  const coldMs = performance.now() - cold0;
  // Baseline: one line of text on one page, in the fonts the certificate registered.
  const line = () => k.renderToBuffer(h(k.Document, null, h(k.Page, { size: 'LETTER' }, h(k.Text, { style: { fontFamily: 'Plex Sans' } }, 'Certificate of conformance'))) as never);
  const base = await timeOf(line);
  const one = await timeOf(() => renderCertificatePdf(short));
  const two = await timeOf(() => renderCertificatePdf(long));
  return [
    {
      area: 'quality',
      what: 'certificate PDF, 8 readings, 1 page (median of 7, warm)',
      value: `${one.ms.toFixed(1)} ms (${(one.bytes / 1024).toFixed(1)} KiB)`,
      baseline: `1-line page ${base.ms.toFixed(1)} ms; first render incl. fonts ${coldMs.toFixed(0)} ms`,
      ratio: Number((one.ms / base.ms).toFixed(2)),
      target: `≤ ${TARGET_MS} ms`,
      met: one.ms <= TARGET_MS,
    },
    {
      area: 'quality',
      what: 'certificate PDF, 125 readings, 2 pages',
      value: `${two.ms.toFixed(1)} ms (${(two.bytes / 1024).toFixed(1)} KiB)`,
      baseline: `8 readings ${one.ms.toFixed(1)} ms`,
      ratio: Number((two.ms / one.ms).toFixed(2)),
      target: '≤ 4× the 1-page certificate',
      met: two.ms / one.ms <= 4,
    },
  ];
}
