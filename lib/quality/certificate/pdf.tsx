// The certificate of conformance as a PDF, drawn from its frozen content. Our own layout: a teal
// rule under the shop's name, facts in two columns, then thickness, bake, baths and signature.
// Fonts are the IBM Plex .woff files in fonts/ (woff2 renders blank in @react-pdf), unpacked once.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { CertificateContent } from './content';
import { formatShopTime } from '../shop-time';
import { BathSection, BakeSection, ReadingsTable } from './pdf-sections';
import { Fact, type Kit, pdfStyles, um } from './pdf-style';
import { woffToSfnt } from './woff-to-sfnt';

let fontsReady = false;

// Registered as unpacked fonts in data URLs: see woff-to-sfnt.ts for why not the .woff files.
function fontSource(file: string): string {
  const sfnt = woffToSfnt(readFileSync(path.join(process.cwd(), 'fonts', file)));
  return `data:font/ttf;base64,${sfnt.toString('base64')}`;
}

function registerFonts({ Font }: Kit): void {
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

export function CertificateDocument({ k, c }: { k: Kit; c: CertificateContent }) {
  const { Document, Page, Text, View } = k;
  const at = (t: string) => formatShopTime(t, c.timeZone);
  const t = c.thickness;
  const limits = `minimum ${um(c.finish.minThicknessUm)} on significant surfaces${c.finish.maxThicknessUm ? `, maximum ${um(c.finish.maxThicknessUm)}` : ''}`;
  return (
    <Document title={`Certificate of conformance ${c.number}`} author={c.shop.name} subject={`Work order ${c.order.number}`} creator="Ampwright">
      <Page size="LETTER" style={pdfStyles.page}>
        <View style={pdfStyles.body}>
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
            <Fact k={k} label="Customer" value={`${c.customer.name} (${c.customer.code})`} />
            <Fact k={k} label="Purchase order" value={c.order.poNumber} />
            <Fact k={k} label="Part number" value={c.part.number} />
            <Fact k={k} label="Revision" value={c.part.revision} />
            <Fact k={k} label="Description" value={c.part.description} />
            <Fact k={k} label="Quantity" value={`${c.order.quantity} pieces`} />
            <Fact k={k} label="Work order" value={c.order.number} />
            <Fact k={k} label="Substrate" value={c.part.substrate} />
            <Fact k={k} label="Finish" value={`${c.finish.name} (${c.finish.code})`} />
            <Fact k={k} label="Specification" value={c.finish.specText} />
          </View>

          {c.process ? (
            <View style={pdfStyles.section} wrap={false}>
              <Text style={pdfStyles.h2}>Process: {c.process.family}</Text>
              <Text>{c.process.statement}</Text>
              {c.process.runConditions.map((r, i) => (
                <Text key={`run-${i}`}>{r}</Text>
              ))}
              {c.process.records.map((r, i) => (
                <Text key={`rec-${i}`}>
                  {r.label}: {r.result} ({r.verdict === 'pass' ? 'conforms' : 'does not conform'}, {at(r.recordedAt)}).
                </Text>
              ))}
              {c.process.life ? (
                <Text>
                  Estimated coating life in corrosivity category {c.process.life.category}: {c.process.life.text} ({c.process.life.standard}). {c.process.life.note}
                </Text>
              ) : null}
            </View>
          ) : null}

          {c.process?.reportsThickness === false ? null : (
          <View style={pdfStyles.section}>
            <Text style={pdfStyles.h2}>Coating thickness</Text>
            <Text>Requirement: {limits}.</Text>
            <Text>
              Sample: {t.partsMeasured} of {t.sampleSize} parts required from a lot of {t.lotSize}
              {t.codeLetter ? ` (code letter ${t.codeLetter})` : ' (every part)'} per {t.planName}. Method: {t.methods.join(', ') || '—'}.
            </Text>
            <View style={[pdfStyles.grid, { marginTop: 3 }]}>
              <Fact k={k} label="Readings" value={String(t.count)} />
              <Fact k={k} label="Mean" value={um(t.meanUm)} />
              <Fact k={k} label="Minimum" value={um(t.minUm)} />
              <Fact k={k} label="Maximum" value={um(t.maxUm)} />
              <Fact k={k} label="Std deviation" value={t.stdDevUm === null ? '— (one reading)' : um(t.stdDevUm)} />
              <Fact k={k} label="Verdict" value={t.failingAcceptedByDisposition ? `${t.failingAcceptedByDisposition} failing ${t.failingAcceptedByDisposition === 1 ? 'reading' : 'readings'} accepted by disposition` : 'All readings conform'} />
            </View>
            <ReadingsTable k={k} readings={t.readings} />
          </View>
          )}

          <BakeSection k={k} c={c} at={at} />
          <BathSection k={k} c={c} at={at} />

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
              <Fact k={k} label="Signed" value={`${c.signedBy.name}, ${c.signedBy.role}`} />
              <Fact k={k} label="Date" value={at(c.signedAt)} />
            </View>
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

// Scripts started with --conditions=react-server (the seed) get React's server build, which
// @react-pdf's reconciler cannot use; they render in a child process without that condition.
const UNDER_REACT_SERVER = process.execArgv.some((a) => a.includes('react-server'));

function renderInChildProcess(content: CertificateContent): Buffer {
  const cli = path.join(process.cwd(), 'lib', 'quality', 'certificate', 'pdf-cli.ts');
  const execArgv = process.execArgv.filter((a) => !a.includes('react-server') && a !== '--conditions');
  const r = spawnSync(process.execPath, [...execArgv, cli], { input: JSON.stringify(content), maxBuffer: 64 * 1024 * 1024, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`The certificate PDF could not be rendered: ${r.stderr || r.error?.message || 'unknown error'}`);
  return Buffer.from(r.stdout, 'base64');
}

export async function renderCertificatePdf(content: CertificateContent): Promise<Buffer> {
  if (UNDER_REACT_SERVER) return renderInChildProcess(content);
  const k: Kit = await import('@react-pdf/renderer');
  registerFonts(k);
  return k.renderToBuffer(<CertificateDocument k={k} c={content} />);
}
