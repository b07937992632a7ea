// Rendered like the certificate: @react-pdf arrives as a `kit` through import(), and a process
// under the react-server condition (the seed) renders in a child process (packing-slip-cli.ts).
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import type { Styles } from '@react-pdf/renderer';
import { formatShopTime } from '@/lib/quality/shop-time';

type Kit = typeof import('@react-pdf/renderer');
type ShopHeader = { name: string; address: string; phone: string; email: string };

// The app's palette, as the quote and traveler PDFs print it.
const C = { ink: '#1f2326', muted: '#565c61', line: '#ddd7cf', soft: '#f6f4f1', teal: '#0f5e63' } as const;
const pdf = {
  page: { fontFamily: 'Helvetica', fontSize: 9, color: C.ink, paddingTop: 36, paddingBottom: 48, paddingHorizontal: 40, lineHeight: 1.35 },
  header: { flexDirection: 'row', justifyContent: 'space-between', borderBottomWidth: 2, borderBottomColor: C.teal, paddingBottom: 10, marginBottom: 14 },
  shopName: { fontSize: 15, fontFamily: 'Helvetica-Bold', color: C.teal, lineHeight: 1.2, marginBottom: 3 },
  small: { fontSize: 8, color: C.muted },
  title: { fontSize: 13, fontFamily: 'Helvetica-Bold', textAlign: 'right', lineHeight: 1.2, marginBottom: 2 },
  label: { fontSize: 7.5, color: C.muted, textTransform: 'uppercase', letterSpacing: 0.6, marginBottom: 2 },
  row: { flexDirection: 'row' },
  section: { marginBottom: 12 },
  th: { fontSize: 7.5, fontFamily: 'Helvetica-Bold', color: C.muted, paddingVertical: 4, paddingHorizontal: 4 },
  td: { paddingVertical: 5, paddingHorizontal: 4 },
  tableHead: { flexDirection: 'row', backgroundColor: C.soft, borderBottomWidth: 1, borderBottomColor: C.line },
  tableRow: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: C.line },
  num: { textAlign: 'right' },
  mono: { fontFamily: 'Courier' },
  bold: { fontFamily: 'Helvetica-Bold' },
  footer: { position: 'absolute', bottom: 20, left: 40, right: 40, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: C.muted },
} satisfies Styles;

// The paper that goes in the box: what is in it and what it was done to, and, below, the summary
// a carrier signs for. Our own layout.

export type PackingSlipData = {
  shop: ShopHeader | null;
  number: string;
  /** ISO instant. */
  shippedAt: string;
  timeZone: string;
  customer: { name: string; code: string; shipTo: string };
  poNumber: string;
  workOrderNumber: string;
  part: { number: string; revision: string; description: string };
  customerPartNumbers: string[];
  customerLots: string[];
  finish: { code: string; name: string; spec: string };
  certificateNumber: string | null;
  quantity: number;
  containers: number;
  weightKg: number | null;
  counts: { received: number; shippedBefore: number; scrapped: number; held: number; remaining: number };
  carrier: string;
  trackingNumber: string;
  isRework: boolean;
};

const LB_PER_KG = 1 / 0.45359237; // 1 lb = 0.45359237 kg exactly (international yard and pound, 1959)
export const formatWeight = (kg: number | null) => (kg === null ? 'Not weighed' : `${kg.toLocaleString('en-US', { maximumFractionDigits: 2 })} kg (${(kg * LB_PER_KG).toLocaleString('en-US', { maximumFractionDigits: 1 })} lb)`);
const n = (v: number) => v.toLocaleString('en-US');

function Labelled({ k, label, children, style }: { k: Kit; label: string; children: React.ReactNode; style?: Styles[string] }) {
  const { Text, View } = k;
  return (
    <View style={style}>
      <Text style={pdf.label}>{label}</Text>
      {typeof children === 'string' ? <Text>{children}</Text> : children}
    </View>
  );
}

function Row({ k, cells }: { k: Kit; cells: [string, string, string?][] }) {
  const { Text, View } = k;
  return (
    <View style={pdf.tableRow} wrap={false}>
      {cells.map(([w, text, align], i) => (
        <Text key={i} style={[pdf.td, { width: w }, align === 'right' ? pdf.num : {}]}>
          {text}
        </Text>
      ))}
    </View>
  );
}

export function PackingSlipDocument({ k, d }: { k: Kit; d: PackingSlipData }) {
  const { Document, Page, Text, View } = k;
  const part = `${d.part.number}${d.part.revision ? ` rev ${d.part.revision}` : ''}`;
  return (
    <Document title={`Packing slip ${d.number}`} creator="Ampwright">
      <Page size="LETTER" style={pdf.page}>
        <View style={pdf.header}>
          <View>
            <Text style={pdf.shopName}>{d.shop?.name ?? 'Our shop'}</Text>
            {d.shop ? <Text style={pdf.small}>{d.shop.address}</Text> : null}
            {d.shop ? <Text style={pdf.small}>{[d.shop.phone, d.shop.email].filter(Boolean).join('  ·  ')}</Text> : null}
          </View>
          <View>
            <Text style={pdf.title}>Packing slip</Text>
            <Text style={[pdf.mono, { fontSize: 14, textAlign: 'right', lineHeight: 1.2 }]}>{d.number}</Text>
            <Text style={[pdf.small, { textAlign: 'right' }]}>Shipped {formatShopTime(d.shippedAt, d.timeZone)}</Text>
          </View>
        </View>
        <View style={[pdf.row, pdf.section, { gap: 16 }]}>
          <Labelled k={k} label="Ship to" style={{ width: '40%' }}>
            <Text style={pdf.bold}>{d.customer.name}</Text>
            <Text>{d.customer.shipTo || 'Address as on the purchase order'}</Text>
          </Labelled>
          <Labelled k={k} label="Your order" style={{ width: '30%' }}>
            <Text style={pdf.bold}>PO {d.poNumber}</Text>
            <Text>Our work order {d.workOrderNumber}</Text>
            {d.isRework ? <Text>Rework, returned parts</Text> : null}
          </Labelled>
          <Labelled k={k} label="Certificate" style={{ width: '30%' }}>
            <Text style={pdf.bold}>{d.certificateNumber ?? 'None issued'}</Text>
            {d.certificateNumber ? <Text style={pdf.small}>Certificate of conformance enclosed / e-mailed</Text> : null}
          </Labelled>
        </View>
        <View style={pdf.section}>
          <View style={pdf.tableHead}>
            <Text style={[pdf.th, { width: '24%' }]}>Part</Text>
            <Text style={[pdf.th, { width: '22%' }]}>Your part no. / lot</Text>
            <Text style={[pdf.th, { width: '34%' }]}>Finish and specification</Text>
            <Text style={[pdf.th, { width: '20%' }, pdf.num]}>Quantity</Text>
          </View>
          <View style={pdf.tableRow} wrap={false}>
            <View style={[pdf.td, { width: '24%' }]}>
              <Text style={pdf.mono}>{part}</Text>
              <Text style={pdf.small}>{d.part.description}</Text>
            </View>
            <View style={[pdf.td, { width: '22%' }]}>
              <Text>{d.customerPartNumbers.join(', ') || '—'}</Text>
              <Text style={pdf.small}>Lot {d.customerLots.join(', ') || '—'}</Text>
            </View>
            <View style={[pdf.td, { width: '34%' }]}>
              <Text>
                {d.finish.code} · {d.finish.name}
              </Text>
              {d.finish.spec ? <Text style={pdf.small}>{d.finish.spec}</Text> : null}
            </View>
            <Text style={[pdf.td, { width: '20%', fontFamily: 'Helvetica-Bold' }, pdf.num]}>{n(d.quantity)} pc</Text>
          </View>
        </View>
        <View style={pdf.section}>
          <Text style={pdf.label}>Counts on this order</Text>
          <View style={pdf.tableHead}>
            {['Received', 'Shipped before', 'This shipment', 'Scrapped', 'Held', 'Still here'].map((h) => (
              <Text key={h} style={[pdf.th, { width: `${100 / 6}%` }, pdf.num]}>
                {h}
              </Text>
            ))}
          </View>
          <Row
            k={k}
            cells={[d.counts.received, d.counts.shippedBefore, d.quantity, d.counts.scrapped, d.counts.held, d.counts.remaining].map(
              (v) => [`${100 / 6}%`, n(v), 'right'] as [string, string, string],
            )}
          />
        </View>

        <View style={[pdf.section, { borderWidth: 1, borderColor: C.line, padding: 8 }]} wrap={false}>
          <Text style={{ fontFamily: 'Helvetica-Bold', color: C.teal, marginBottom: 4 }}>Carrier summary</Text>
          <View style={[pdf.row, { gap: 16, marginBottom: 6 }]}>
            <Labelled k={k} label="Shipper" style={{ width: '50%' }}>
              <Text>{d.shop?.name ?? 'Our shop'}</Text>
              <Text style={pdf.small}>{d.shop?.address ?? ''}</Text>
            </Labelled>
            <Labelled k={k} label="Consignee" style={{ width: '50%' }}>
              <Text>{d.customer.name}</Text>
              <Text style={pdf.small}>{d.customer.shipTo}</Text>
            </Labelled>
          </View>
          <View style={pdf.tableHead}>
            <Text style={[pdf.th, { width: '20%' }, pdf.num]}>Containers</Text>
            <Text style={[pdf.th, { width: '40%' }]}>Description of goods</Text>
            <Text style={[pdf.th, { width: '40%' }, pdf.num]}>Gross weight</Text>
          </View>
          <Row
            k={k}
            cells={[
              ['20%', n(d.containers), 'right'],
              ['40%', `Finished metal parts, ${d.part.description || part}`],
              ['40%', formatWeight(d.weightKg), 'right'],
            ]}
          />
          <View style={[pdf.row, { gap: 16, marginTop: 6 }]}>
            <Labelled k={k} label="Carrier" style={{ width: '50%' }}>
              {d.carrier}
            </Labelled>
            <Labelled k={k} label="Tracking / pro number" style={{ width: '50%' }}>
              <Text style={pdf.mono}>{d.trackingNumber || '—'}</Text>
            </Labelled>
          </View>
          <View style={[pdf.row, { gap: 16, marginTop: 18 }]}>
            {['Shipper signature / date', 'Carrier signature / date', 'Received by / date'].map((s) => (
              <Text key={s} style={[pdf.small, { width: '33%', borderTopWidth: 0.5, borderTopColor: C.ink, paddingTop: 3 }]}>
                {s}
              </Text>
            ))}
          </View>
        </View>
        <View style={pdf.footer} fixed>
          <Text>{`${d.number} · work order ${d.workOrderNumber} · PO ${d.poNumber}`}</Text>
          <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
        </View>
      </Page>
    </Document>
  );
}

const UNDER_REACT_SERVER = process.execArgv.some((a) => a.includes('react-server'));

function renderInChildProcess(d: PackingSlipData): Buffer {
  const cli = path.join(process.cwd(), 'lib', 'dock', 'packing-slip-cli.ts');
  const execArgv = process.execArgv.filter((a) => !a.includes('react-server') && a !== '--conditions');
  const r = spawnSync(process.execPath, [...execArgv, cli], { input: JSON.stringify(d), maxBuffer: 64 * 1024 * 1024, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`The packing slip could not be rendered: ${r.stderr || r.error?.message || 'unknown error'}`);
  return Buffer.from(r.stdout, 'base64');
}

export async function renderPackingSlipPdf(d: PackingSlipData): Promise<Buffer> {
  if (UNDER_REACT_SERVER) return renderInChildProcess(d);
  const k: Kit = await import('@react-pdf/renderer');
  return k.renderToBuffer(<PackingSlipDocument k={k} d={d} />);
}

