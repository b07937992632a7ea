import { describe, expect, it } from 'vitest';
import { buildCertificateContent, CONFORMANCE_STATEMENT } from '@/lib/quality/certificate/content';
import { renderCertificatePdf } from '@/lib/quality/certificate/pdf';
import { tankStatus } from '@/lib/quality/certificate/bath-snapshot';
import { makeLot, reading } from './lot-factory';

const shop = { name: 'Kestrel Lane Plating', address: '14 Kestrel Lane', phone: '(555) 010-4410', email: 'office@kestrel-plating.test' };
const bath = { available: false as const, note: 'No analyses.' };

function content(readings = [9, 10, 11, 12, 9.5, 10.5, 11.5, 10].map((t, i) => reading(i + 1, t))) {
  return buildCertificateContent(makeLot({ readings }), {
    number: 'CC2026-00007', signedAt: new Date('2026-06-12T15:00:00Z'), signer: { name: 'Priya Natarajan', role: 'Supervisor' }, shop, bath, timeZone: 'America/New_York',
  });
}

describe('buildCertificateContent', () => {
  it('carries the order, part, finish, sample and statistics of the lot', () => {
    const c = content();
    expect(c).toMatchObject({
      number: 'CC2026-00007',
      customer: { name: 'Northgate Fastener Co.', code: 'NGF' },
      order: { number: 'W2026-00042', poNumber: 'PO-7781', quantity: 40 },
      part: { number: 'NGF-HX-0816', revision: 'C' },
      finish: { specText: 'ASTM B633 Fe/Zn 8 (SC2) Type III', minThicknessUm: 8, maxThicknessUm: null },
      thickness: { lotSize: 40, sampleSize: 8, codeLetter: 'D', partsMeasured: 8, count: 8, minUm: 9, maxUm: 12, methods: ['ASTM B499 (magnetic)'] },
      bake: { required: false, note: 'No relief bake required for this lot.' },
      runs: [{ tankCode: 'Z-ZN1', endedAt: '2026-06-10T14:00:00.000Z', ampHours: 12 }],
      statement: CONFORMANCE_STATEMENT,
      signedBy: { name: 'Priya Natarajan', role: 'Supervisor' },
      signedAt: '2026-06-12T15:00:00.000Z',
    });
    // Hand computation: Σ = 83.5 over 8 → mean 10.4375.
    expect(c.thickness.meanUm).toBeCloseTo(10.4375, 10);
  });

  it('judges a tank "in control" only when every analysis is in its limits with no rule fired; the customer sees the specification', () => {
    const asOf = new Date('2026-06-10T14:00:00Z');
    const row = (over: object) => ({ analyte_name: 'Zinc metal', frequency_hours: 8, value: 9.5, unit: 'g/L', verdict: 'in_range' as const, severity: 0, rules: [], taken_at: new Date('2026-06-10T10:00:00Z'), ...over });
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({})])).toMatchObject({ inControl: true, withinSpec: true, note: null });
    // Outside the control band but inside the specification: the shop's concern, not the customer's.
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({ verdict: 'out_of_range', severity: 2 })])).toMatchObject({ inControl: false, withinSpec: true });
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({ verdict: 'out_of_range', severity: 3 })])).toMatchObject({ inControl: false, withinSpec: false });
    // A fired control rule stays with the supervisor: no note for the certificate.
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({ rules: ['we1_beyond_3s'] })])).toMatchObject({ inControl: false, withinSpec: true, note: null, rulesFired: ['Zinc metal'] });
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({ taken_at: new Date('2026-06-09T14:00:00Z') })]).note).toBe(
      'Zinc metal was last analysed 24 h before the run (schedule: every 8 h).',
    );
    expect(tankStatus('Z-ZN1', 'Alkaline zinc', asOf, [row({ taken_at: null, value: null })])).toMatchObject({ inControl: null, note: 'No analysis before the run for Zinc metal.' });
  });
});

describe('renderCertificatePdf', () => {
  it('renders a PDF, on more than one page when the readings run long', async () => {
    const one = await renderCertificatePdf(content());
    expect(one.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(one.toString('latin1')).toMatch(/\/Type \/Pages[\s\S]*?\/Count 1\b/);
    const many = await renderCertificatePdf(content(Array.from({ length: 60 }, (_, i) => reading(i + 1, 9 + (i % 5) / 2))));
    expect(many.toString('latin1')).toMatch(/\/Type \/Pages[\s\S]*?\/Count [2-9]\b/);
  }, 30_000);
});

describe('woffToSfnt', () => {
  it('unpacks the shipped WOFF into a TrueType file with the same tables', async () => {
    const { readFileSync } = await import('node:fs');
    const { woffToSfnt } = await import('@/lib/quality/certificate/woff-to-sfnt');
    const woff = readFileSync('fonts/ibm-plex-sans-latin-400-normal.woff');
    const sfnt = woffToSfnt(woff);
    // Source: W3C WOFF 1.0 §3: the flavor field is the wrapped font's sfnt version; numTables at offset 12.
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    expect(sfnt.readUInt16BE(4)).toBe(woff.readUInt16BE(12));
    // The totalSfntSize field (offset 16) is the size of the unpacked font, padding included.
    expect(sfnt.length).toBe(woff.readUInt32BE(16));
    expect(() => woffToSfnt(new Uint8Array(10))).toThrow('Not a WOFF 1.0 font.');
  });
});
