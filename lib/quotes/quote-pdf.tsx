import 'server-only';
import { Document, Page, Text, View, renderToBuffer } from '@react-pdf/renderer';
import { formatMoney } from '@/components/money';
import { cautionTexts, SAFETY_DEFERRAL } from '@/components/ui/caution';
import { appUrl } from '@/lib/email/mailer';
import { getShopSettings } from '@/lib/users/queries';
import { BASIS_LABELS } from './basis';
import { formatDay, formatUnitPrice } from './format';
import { Labelled, PageFooter, pdf, registerPdfFonts, ShopBlock, type ShopHeader } from './pdf-theme';
import type { QuoteDetail } from './queries';
import { quoteLabel } from './status';
import { turnaroundText } from '@/lib/schedule/turnaround';

type PdfQuote = Pick<
  QuoteDetail,
  | 'id' | 'number' | 'revision' | 'customer_name' | 'billing_address' | 'shipping_address' | 'contact_name' | 'creator_name'
  | 'creator_email' | 'sent_at' | 'created_at' | 'expires_at' | 'valid_days' | 'is_rush' | 'notes' | 'total_cents' | 'payment_terms_days' | 'lines' | 'turnaround_days'
>;

const COLS = { no: '5%', part: '25%', finish: '32%', qty: '9%', unit: '14%', total: '15%' } as const;

function Lines({ quote }: { quote: PdfQuote }) {
  return (
    <View style={pdf.section}>
      <View style={pdf.tableHead} fixed>
        <Text style={[pdf.th, { width: COLS.no }]}>#</Text>
        <Text style={[pdf.th, { width: COLS.part }]}>Part</Text>
        <Text style={[pdf.th, { width: COLS.finish }]}>Finish and specification</Text>
        <Text style={[pdf.th, pdf.num, { width: COLS.qty }]}>Quantity</Text>
        <Text style={[pdf.th, pdf.num, { width: COLS.unit }]}>Unit price</Text>
        <Text style={[pdf.th, pdf.num, { width: COLS.total }]}>Line total</Text>
      </View>
      {quote.lines.map((l) => (
        <View key={l.id} style={pdf.tableRow} wrap={false}>
          <Text style={[pdf.td, { width: COLS.no }]}>{l.lineNo}</Text>
          <View style={[pdf.td, { width: COLS.part }]}>
            <Text style={pdf.mono}>{l.partNumber}{l.partRevision ? ` rev ${l.partRevision}` : ''}</Text>
            <Text style={pdf.small}>{l.partDescription}</Text>
          </View>
          <View style={[pdf.td, { width: COLS.finish }]}>
            <Text>{l.finishName}</Text>
            {l.specText ? <Text style={pdf.small}>{l.specText}</Text> : null}
            {l.cost.bake.applies ? <Text style={pdf.small}>Includes an embrittlement-relief bake.</Text> : null}
          </View>
          <Text style={[pdf.td, pdf.num, { width: COLS.qty }]}>{l.quantity.toLocaleString('en-US')}</Text>
          <View style={[pdf.td, { width: COLS.unit }]}>
            <Text style={pdf.num}>{formatUnitPrice(l.unitPriceCents)}</Text>
            <Text style={[pdf.small, pdf.num]}>{BASIS_LABELS[l.basis]}</Text>
          </View>
          <Text style={[pdf.td, pdf.num, { width: COLS.total }]}>{formatMoney(l.totalCents)}</Text>
        </View>
      ))}
      <View style={[pdf.row, { justifyContent: 'flex-end', marginTop: 6 }]}>
        <Text style={{ fontWeight: 600, marginRight: 12 }}>Total</Text>
        <Text style={{ fontWeight: 700, width: COLS.total, textAlign: 'right' }}>{formatMoney(quote.total_cents)}</Text>
      </View>
      <Text style={[pdf.small, { textAlign: 'right' }]}>Taxes, where they apply, are added on the invoice.</Text>
    </View>
  );
}

export function QuoteDocument({ quote, shop }: { quote: PdfQuote; shop: ShopHeader | null }) {
  const label = quoteLabel(quote);
  const needsBake = quote.lines.some((l) => l.cost.bake.applies);
  const bake = cautionTexts['high-strength-steel-bake'];
  return (
    <Document title={`Quotation ${label}`} author={shop?.name ?? 'Ampwright'} creator="Ampwright">
      <Page size="LETTER" style={pdf.page}>
        <View style={pdf.header}>
          <ShopBlock shop={shop} />
          <View>
            <Text style={pdf.title}>Quotation</Text>
            <Text style={[pdf.mono, { textAlign: 'right', fontSize: 11 }]}>{label}</Text>
            <Text style={[pdf.small, { textAlign: 'right' }]}>Dated {formatDay(quote.sent_at ?? quote.created_at)}</Text>
          </View>
        </View>
        <View style={[pdf.row, pdf.section, { gap: 16 }]}>
          <Labelled label="Prepared for" style={{ width: '40%' }}>
            <Text style={{ fontWeight: 600 }}>{quote.customer_name}</Text>
            <Text>{quote.billing_address}</Text>
            {quote.contact_name ? <Text>Attention: {quote.contact_name}</Text> : null}
          </Labelled>
          <Labelled label="Ship to" style={{ width: '30%' }}>{quote.shipping_address || quote.billing_address}</Labelled>
          <Labelled label="Your estimator" style={{ width: '30%' }}>
            <Text>{quote.creator_name ?? '—'}</Text>
            {quote.creator_email ? <Text style={pdf.small}>{quote.creator_email}</Text> : null}
          </Labelled>
        </View>
        {quote.is_rush ? (
          <View style={pdf.note}>
            <Text>Rush service: these prices include our rush charge for a shortened lead time.</Text>
          </View>
        ) : null}
        <Lines quote={quote} />
        {quote.notes ? <Labelled label="Notes" style={pdf.section}>{quote.notes}</Labelled> : null}
        <Labelled label="Validity" style={pdf.section}>
          {quote.expires_at
            ? `This quotation is valid until ${formatDay(quote.expires_at)} (${quote.valid_days} days from the date it was sent).`
            : `This quotation is valid for ${quote.valid_days} days from the date it is sent.`}
        </Labelled>
        {quote.turnaround_days !== null ? <Labelled label="Turnaround" style={pdf.section}>{`${turnaroundText(quote.turnaround_days)}.`}</Labelled> : null}
        <Labelled label="Terms" style={pdf.section}>
          <Text>Payment: net {quote.payment_terms_days} days from invoice. Prices cover the finish and specification stated on each line.</Text>
          <Text>Thickness is measured on significant surfaces as the cited specification defines them. Parts should arrive free of paint, heavy scale and heavy oil; extra cleaning or stripping is quoted separately.</Text>
          <Text>To accept, reply in the customer area with your purchase-order number: {appUrl(`/portal/quotes/${quote.id}`)}</Text>
        </Labelled>
        {needsBake ? (
          <View style={pdf.note} wrap={false}>
            <Text style={{ fontWeight: 600 }}>{bake.title}</Text>
            <Text>{bake.text}</Text>
            <Text style={pdf.small}>{SAFETY_DEFERRAL}</Text>
          </View>
        ) : null}
        <PageFooter left={`${shop?.name ?? ''} · Quotation ${label}`} />
      </Page>
    </Document>
  );
}

export async function renderQuotePdf(quote: PdfQuote): Promise<Buffer> {
  registerPdfFonts();
  const shop = await getShopSettings();
  return renderToBuffer(<QuoteDocument quote={quote} shop={shop} />);
}

export function quotePdfFileName(quote: { number: string; revision: string }): string {
  return `quotation-${quote.number}-${quote.revision}.pdf`;
}
