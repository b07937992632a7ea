// The certificate of conformance as a PDF, drawn from its frozen content. Our own layout: a teal
// rule under the shop's name, facts in two columns, then thickness, bake, baths and signature.
// Fonts are the IBM Plex .woff files in fonts/ (woff2 renders blank in @react-pdf), unpacked once.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { Document, Font, Page, Text, View, renderToBuffer } from '@react-pdf/renderer';
import type { CertificateContent } from './certificate-content';
import { formatShopTime } from './shop-time';
import { BathSection, BakeSection, ReadingsTable } from './certificate-pdf-sections';
import { Fact, pdfStyles, um } from './certificate-pdf-style';
import { woffToSfnt } from './woff-to-sfnt';

let fontsReady = false;

// Registered as unpacked fonts in data URLs: see woff-to-sfnt.ts for why not the .woff files.
function fontSource(file: string): string {
  const sfnt = woffToSfnt(readFileSync(path.join(process.cwd(), 'fonts', file)));
  return `data:font/ttf;base64,${sfnt.toString('base64')}`;
}

function registerFonts(): void {
  if (fontsReady) return;
  Font.register({
    family: 'Plex Sans',
    fonts: [
      { src: fontSource('ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: fontSource('ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
    ],
  });
  Font.register({ family: 'Plex Mono', src: fontSource('ibm-plex-mono-latin-400-normal.woff') });
  // Words are not hyphenated: part numbers and specification texts must print whole.
  Font.registerHyphenationCallback((word) => [word]);
  fontsReady = true;
}

export function CertificateDocument({ c }: { c: CertificateContent }) {
  const at = (t: string) => formatShopTime(t, c.timeZone);
  const t = c.thickness;
  const limits = `minimum ${um(c.finish.minThicknessUm)} on significant surfaces${c.finish.maxThicknessUm ? `, maximum ${um(c.finish.maxThicknessUm)}` : ''}`;
  return (
    <Document title={`Certificate of conformance ${c.number}`} author={c.shop.name} subject={`Work order ${c.order.number}`} creator="Ampwright">
      <Page size="LETTER" style={pdfStyles.page}>
        <View style={{ flexDirection: 'row', justifyContent: 'space-between' }}>
          <View>
            <Text style={pdfStyles.shop}>{c.shop.name}</Text>
            <Text style={pdfStyles.muted}>{[c.shop.address, c.shop.phone, c.shop.email].filter(Boolean).join('  ·  ')}</Text>
          </View>
          <View style={{ alignItems: 'flex-end' }}>
            <Text style={pdfStyles.title}>Certificate of conformance</Text>
            <Text style={pdfStyles.number}>{c.number}</Text>
          </View>
        </View>
        <View style={pdfStyles.rule} />
        <View style={pdfStyles.grid}>
          <Fact label="Customer" value={`${c.customer.name} (${c.customer.code})`} />
          <Fact label="Purchase order" value={c.order.poNumber} />
          <Fact label="Part number" value={c.part.number} />
          <Fact label="Revision" value={c.part.revision} />
          <Fact label="Description" value={c.part.description} />
          <Fact label="Quantity" value={`${c.order.quantity} pieces`} />
          <Fact label="Work order" value={c.order.number} />
          <Fact label="Substrate" value={c.part.substrate} />
          <Fact label="Finish" value={`${c.finish.name} (${c.finish.code})`} />
          <Fact label="Specification" value={c.finish.specText} />
        </View>

        <View style={pdfStyles.section}>
          <Text style={pdfStyles.h2}>Coating thickness</Text>
          <Text>Requirement: {limits}.</Text>
          <Text>
            Sample: {t.partsMeasured} of {t.sampleSize} parts required from a lot of {t.lotSize}
            {t.codeLetter ? ` (code letter ${t.codeLetter})` : ' (every part)'} per {t.planName}. Method: {t.methods.join(', ') || '—'}.
          </Text>
          <View style={[pdfStyles.grid, { marginTop: 3 }]}>
            <Fact label="Readings" value={String(t.count)} />
            <Fact label="Mean" value={um(t.meanUm)} />
            <Fact label="Minimum" value={um(t.minUm)} />
            <Fact label="Maximum" value={um(t.maxUm)} />
            <Fact label="Std deviation" value={t.stdDevUm === null ? '— (one reading)' : um(t.stdDevUm)} />
            <Fact label="Verdict" value={t.failingAcceptedByDisposition ? `${t.failingAcceptedByDisposition} failing ${t.failingAcceptedByDisposition === 1 ? 'reading' : 'readings'} accepted by disposition` : 'All readings conform'} />
          </View>
          <ReadingsTable readings={t.readings} />
        </View>

        <BakeSection c={c} at={at} />
        <BathSection c={c} at={at} />

        {c.nonconformances.length ? (
          <View style={pdfStyles.section} wrap={false}>
            <Text style={pdfStyles.h2}>Nonconformances on this lot</Text>
            {c.nonconformances.map((n, i) => (
              <Text key={i}>
                {n.description} Disposition: {n.disposition}
                {n.customerApprovalRef ? `, customer approval ${n.customerApprovalRef}` : ''}
                {n.closedAt ? `, closed ${at(n.closedAt)}` : ''}.
              </Text>
            ))}
          </View>
        ) : null}

        <View style={pdfStyles.section} wrap={false}>
          <Text>{c.statement}</Text>
          <View style={pdfStyles.signature}>
            <Fact label="Signed" value={`${c.signedBy.name}, ${c.signedBy.role}`} />
            <Fact label="Date" value={at(c.signedAt)} />
          </View>
        </View>

        <View style={pdfStyles.footer} fixed>
          <Text>
            {c.number} · work order {c.order.number} · PO {c.order.poNumber}
          </Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}

export async function renderCertificatePdf(content: CertificateContent): Promise<Buffer> {
  registerFonts();
  return renderToBuffer(<CertificateDocument c={content} />);
}
