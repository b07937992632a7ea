// The invoice as a PDF: the shop's letterhead, the lines, the totals and what is still owed, the
// rounding rule and where to pay. The renderer's primitives are passed in (see invoice-document.ts)
// so that scripts run by tsx, which must import the ESM-only renderer dynamically, can use it too.
import path from 'node:path';
import type * as ReactPdf from '@react-pdf/renderer';
import { formatMoney } from '@/components/money';
import { formatDay, formatUnitPrice } from '@/lib/quotes/format';
import { formatTaxRate } from '../arithmetic';

export type InvoicePdfLine = { lineNo: number; description: string; quantity: number; unit: string; unitPriceCents: number; amountCents: number };

export type InvoicePdfData = {
  shop: { name: string; address: string; phone: string; email: string };
  number: string;
  issuedOn: string;
  dueOn: string;
  paymentTermsDays: number;
  billTo: { name: string; address: string; email: string | null };
  lines: InvoicePdfLine[];
  subtotalCents: number;
  taxRateBp: number;
  taxCents: number;
  totalCents: number;
  creditedCents: number;
  paidCents: number;
  openCents: number;
  creditNotes: { number: string; amountCents: number; reason: string }[];
  roundingRule: string;
  notes: string;
  payUrl: string;
};

export type ReactPdfModule = typeof ReactPdf;

const FONT = 'IBM Plex Sans';

// Static .woff files: @react-pdf renders woff2 blank (see the project's stack notes).
function registerFonts(Font: ReactPdfModule['Font']): void {
  const dir = path.join(process.cwd(), 'fonts');
  Font.register({
    family: FONT,
    fonts: [
      { src: path.join(dir, 'ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: path.join(dir, 'ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
    ],
  });
  Font.registerHyphenationCallback((word) => [word]);
}

const INK = '#1f2a30';
const MUTED = '#5b6770';
const LINE = '#d9dde0';
const TEAL = '#0f5f5c';

const styles = {
  page: { fontFamily: FONT, fontSize: 9, color: INK, paddingTop: 40, paddingBottom: 56, paddingHorizontal: 44, lineHeight: 1.35 },
  head: { flexDirection: 'row', justifyContent: 'space-between', marginBottom: 22 },
  shopName: { fontSize: 14, lineHeight: 1.2, fontWeight: 600, color: TEAL, marginBottom: 3 },
  muted: { color: MUTED },
  title: { fontSize: 18, lineHeight: 1.2, fontWeight: 600, textAlign: 'right' },
  facts: { flexDirection: 'row', justifyContent: 'space-between', marginBottom: 18 },
  label: { fontSize: 7.5, color: MUTED, textTransform: 'uppercase', letterSpacing: 0.6, marginBottom: 2 },
  factRow: { flexDirection: 'row', justifyContent: 'flex-end' },
  factKey: { width: 70, color: MUTED, textAlign: 'right', marginRight: 8 },
  factValue: { width: 80, textAlign: 'right' },
  tableHead: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: INK, paddingBottom: 4, fontWeight: 600 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: LINE, paddingVertical: 5 },
  cNo: { width: 20 },
  cDesc: { flex: 1, paddingRight: 8 },
  cQty: { width: 58, textAlign: 'right' },
  cUnit: { width: 40, paddingLeft: 4 },
  cPrice: { width: 66, textAlign: 'right' },
  cAmount: { width: 70, textAlign: 'right' },
  totals: { marginTop: 10, marginLeft: 'auto', width: 230 },
  totalRow: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 2 },
  grand: { flexDirection: 'row', justifyContent: 'space-between', borderTopWidth: 1, borderTopColor: INK, marginTop: 3, paddingTop: 4, marginBottom: 3, lineHeight: 1.2, fontWeight: 600, fontSize: 10.5 },
  due: { flexDirection: 'row', justifyContent: 'space-between', backgroundColor: '#eef5f4', marginTop: 6, padding: 5, fontWeight: 600, fontSize: 10.5, color: TEAL },
  block: { marginTop: 18 },
  footer: { position: 'absolute', bottom: 24, left: 44, right: 44, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: MUTED },
} satisfies Record<string, ReactPdf.Styles[string]>;

const qtyFormat = new Intl.NumberFormat('en-US', { maximumFractionDigits: 4 });

export type InvoiceDocumentComponent = (props: { d: InvoicePdfData }) => React.ReactElement;

/** Builds the document component from the renderer's primitives; fonts are registered once. */
export function makeInvoiceDocument(pdf: ReactPdfModule): InvoiceDocumentComponent {
  const { Document, Page, Text, View } = pdf;
  const s = pdf.StyleSheet.create(styles);
  registerFonts(pdf.Font);
  const Money = ({ cents }: { cents: number }) => <Text>{formatMoney(cents)}</Text>;

  return function InvoiceDocument({ d }: { d: InvoicePdfData }) {
    return (
      <Document title={`Invoice ${d.number}`} author={d.shop.name} subject={`Invoice ${d.number} for ${d.billTo.name}`}>
        <Page size="LETTER" style={s.page}>
          <View style={s.head}>
            <View>
              <Text style={s.shopName}>{d.shop.name}</Text>
              <Text style={s.muted}>{d.shop.address}</Text>
              <Text style={s.muted}>{[d.shop.phone, d.shop.email].filter(Boolean).join(' · ')}</Text>
            </View>
            <View>
              <Text style={s.title}>Invoice {d.number}</Text>
            </View>
          </View>

          <View style={s.facts}>
            <View style={{ width: 240 }}>
              <Text style={s.label}>Bill to</Text>
              <Text style={{ fontWeight: 600 }}>{d.billTo.name}</Text>
              <Text>{d.billTo.address}</Text>
              {d.billTo.email ? <Text style={s.muted}>{d.billTo.email}</Text> : null}
            </View>
            <View>
              {[
                ['Invoice date', formatDay(d.issuedOn)],
                ['Terms', d.paymentTermsDays === 0 ? 'Due on receipt' : `Net ${d.paymentTermsDays} days`],
                ['Due date', formatDay(d.dueOn)],
              ].map(([k, v]) => (
                <View key={k} style={s.factRow}>
                  <Text style={s.factKey}>{k}</Text>
                  <Text style={s.factValue}>{v}</Text>
                </View>
              ))}
            </View>
          </View>

          <View style={s.tableHead} fixed>
            <Text style={s.cNo}>#</Text>
            <Text style={s.cDesc}>Description</Text>
            <Text style={s.cQty}>Quantity</Text>
            <Text style={s.cUnit}>Unit</Text>
            <Text style={s.cPrice}>Unit price</Text>
            <Text style={s.cAmount}>Amount</Text>
          </View>
          {d.lines.map((l) => (
            <View key={l.lineNo} style={s.row} wrap={false}>
              <Text style={s.cNo}>{l.lineNo}</Text>
              <Text style={s.cDesc}>{l.description}</Text>
              <Text style={s.cQty}>{qtyFormat.format(l.quantity)}</Text>
              <Text style={s.cUnit}>{l.unit}</Text>
              <Text style={s.cPrice}>{formatUnitPrice(l.unitPriceCents)}</Text>
              <Text style={s.cAmount}>{formatMoney(l.amountCents)}</Text>
            </View>
          ))}

          <View style={s.totals} wrap={false}>
            <View style={s.totalRow}>
              <Text>Subtotal</Text>
              <Money cents={d.subtotalCents} />
            </View>
            <View style={s.totalRow}>
              <Text>Tax ({formatTaxRate(d.taxRateBp)})</Text>
              <Money cents={d.taxCents} />
            </View>
            <View style={s.grand}>
              <Text>Total</Text>
              <Money cents={d.totalCents} />
            </View>
            {d.creditedCents > 0 ? (
              <View style={s.totalRow}>
                <Text>Credited</Text>
                <Text>−{formatMoney(d.creditedCents)}</Text>
              </View>
            ) : null}
            {d.paidCents > 0 ? (
              <View style={s.totalRow}>
                <Text>Paid</Text>
                <Text>−{formatMoney(d.paidCents)}</Text>
              </View>
            ) : null}
            <View style={s.due}>
              <Text>{d.openCents < 0 ? 'Credit on account' : 'Balance due'}</Text>
              <Money cents={Math.abs(d.openCents)} />
            </View>
          </View>

          {d.creditNotes.length ? (
            <View style={s.block} wrap={false}>
              <Text style={s.label}>Credit notes</Text>
              {d.creditNotes.map((c) => (
                <Text key={c.number}>
                  {c.number}: {formatMoney(c.amountCents)} — {c.reason}
                </Text>
              ))}
            </View>
          ) : null}
          {d.notes ? (
            <View style={s.block} wrap={false}>
              <Text style={s.label}>Notes</Text>
              <Text>{d.notes}</Text>
            </View>
          ) : null}
          <View style={s.block} wrap={false}>
            <Text style={s.label}>How to pay</Text>
            <Text>{d.openCents > 0 ? `Pay online by card at ${d.payUrl}, or quote ${d.number} with your payment.` : d.openCents < 0 ? 'Nothing is due on this invoice; the amount paid above it is your credit on account.' : 'Nothing is due on this invoice.'}</Text>
            <Text style={[s.muted, { marginTop: 8 }]}>Rounding: {d.roundingRule}</Text>
          </View>

          <View style={s.footer} fixed>
            <Text>
              {d.shop.name} · Invoice {d.number}
            </Text>
            <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
          </View>
        </Page>
      </Document>
    );
  };
}
