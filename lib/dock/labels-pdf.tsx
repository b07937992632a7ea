import 'server-only';
import { Document, Image, Page, Text, View, renderToBuffer } from '@react-pdf/renderer';
import QRCode from 'qrcode';
import { appUrl } from '@/lib/email/mailer';
import { pdf, PDF_COLORS, registerPdfFonts } from '@/lib/quotes/pdf-theme';
import { formatDay } from '@/lib/quotes/format';

// One 4 × 6 in label per container of a receipt, with a QR code that opens the work order on a phone.

export type LabelData = {
  receiptNumber: string;
  workOrderId: string;
  workOrderNumber: string;
  customerName: string;
  poNumber: string;
  partNumber: string;
  finishCode: string;
  customerLot: string;
  quantity: number;
  containers: number;
  receivedAt: Date;
  dueDate: Date | null;
};

const LABEL = [288, 432] as [number, number]; // 4 × 6 in at 72 pt per inch

export async function renderReceiptLabels(d: LabelData): Promise<Buffer> {
  registerPdfFonts();
  const qr = await QRCode.toBuffer(appUrl(`/work-orders/${d.workOrderId}`), { errorCorrectionLevel: 'M', margin: 1, width: 360 });
  const doc = (
    <Document title={`Labels ${d.receiptNumber}`} creator="Ampwright">
      {Array.from({ length: d.containers }, (_, i) => (
        <Page key={i} size={LABEL} style={{ ...pdf.page, padding: 18, paddingBottom: 18, fontSize: 11 }}>
          <Text style={{ fontSize: 9, color: PDF_COLORS.muted }}>{d.customerName}</Text>
          <Text style={[pdf.mono, { fontSize: 22, marginTop: 4 }]}>{d.workOrderNumber}</Text>
          <Text style={{ fontSize: 12, marginTop: 2 }}>PO {d.poNumber}</Text>
          <View style={{ alignItems: 'center', marginVertical: 10 }}>
            <Image src={{ data: qr, format: 'png' }} style={{ width: 150, height: 150 }} />
            <Text style={{ fontSize: 8, color: PDF_COLORS.muted }}>Scan to open the order</Text>
          </View>
          <Text style={pdf.mono}>{d.partNumber}</Text>
          <Text>Finish {d.finishCode}</Text>
          {d.customerLot ? <Text>Customer lot {d.customerLot}</Text> : null}
          <Text>
            Receipt {d.receiptNumber} · {d.quantity.toLocaleString('en-US')} pc in {d.containers}
          </Text>
          <Text>Received {formatDay(d.receivedAt)} · due {formatDay(d.dueDate)}</Text>
          <Text style={{ fontSize: 26, fontWeight: 700, textAlign: 'right', marginTop: 8 }}>
            {i + 1} of {d.containers}
          </Text>
        </Page>
      ))}
    </Document>
  );
  return renderToBuffer(doc);
}
