import 'server-only';
import { Document, Image, Page, Text, View, renderToBuffer } from '@react-pdf/renderer';
import QRCode from 'qrcode';
import { cautionTexts, SAFETY_DEFERRAL } from '@/components/ui/caution';
import { appUrl } from '@/lib/email/mailer';
import type { Hazard } from '@/lib/bath/hazards';
import { bathHazardsByFinish } from '@/lib/finishes/bath-hazards';
import { finishHazards } from '@/lib/finishes/hazards';
import { formatStoredQuantity, type UnitSystem } from '@/lib/plating';
import { formatDay } from '@/lib/quotes/format';
import { Labelled, PageFooter, PDF_COLORS, pdf, registerPdfFonts, ShopBlock, type ShopHeader } from '@/lib/quotes/pdf-theme';
import { getShopSettings } from '@/lib/users/queries';
import type { WorkOrderDetail } from './queries';

// The paper that travels with the parts: what to do, in what order, with a box to initial at
// each step, and a QR code that opens the order on a phone.

function Step({ n, title, note }: { n: number; title: string; note?: string }) {
  return (
    <View style={[pdf.tableRow, { minHeight: 26, alignItems: 'center' }]} wrap={false}>
      <Text style={[pdf.td, { width: '6%' }]}>{n}</Text>
      <View style={[pdf.td, { width: '54%' }]}>
        <Text>{title}</Text>
        {note ? <Text style={pdf.small}>{note}</Text> : null}
      </View>
      <Text style={[pdf.td, { width: '20%', color: PDF_COLORS.muted }]}>Date / time</Text>
      <Text style={[pdf.td, { width: '20%', color: PDF_COLORS.muted }]}>Initials</Text>
    </View>
  );
}

export function TravelerDocument({ wo, shop, qrPng, units, bathHazards }: { wo: WorkOrderDetail; shop: ShopHeader | null; qrPng: Buffer; units: UnitSystem; bathHazards: readonly Hazard[] }) {
  const steps = [
    { title: 'Receive and count parts', note: `Ordered ${wo.quantity_ordered.toLocaleString('en-US')}` },
    ...wo.process_route.map((s) => ({ title: s.step, note: s.note })),
    ...(wo.bake_required && !wo.process_route.some((s) => /bake/i.test(s.step))
      ? [{ title: 'Embrittlement-relief bake', note: wo.bake_temp_c && wo.bake_hours ? `${wo.bake_temp_c} °C for ${wo.bake_hours} h, start within ${wo.bake_window_hours} h of plating` : 'As the specification requires' }]
      : []),
    { title: 'Inspect: thickness on significant surfaces, appearance', note: `Minimum ${formatStoredQuantity(wo.min_thickness_um, 'thickness', units)}` },
    { title: 'Pack and ship', note: wo.shipping_address },
  ];
  const bake = cautionTexts['high-strength-steel-bake'];
  // The finish's own cautions, as its screens show them; the bake has its own box above.
  const cautions = finishHazards({
    family: wo.family,
    familyParams: wo.family_params,
    element: wo.element,
    ionCharge: wo.ion_charge,
    route: wo.process_route,
    bakeRequired: false,
    words: `${wo.finish_name} ${wo.spec_text}`,
    bathHazards,
  }).map((k) => cautionTexts[k]);
  return (
    <Document title={`Traveler ${wo.number}`} creator="Ampwright">
      <Page size="LETTER" style={pdf.page}>
        <View style={pdf.header}>
          <ShopBlock shop={shop} />
          <View style={[pdf.row, { gap: 10, alignItems: 'center' }]}>
            <View>
              <Text style={pdf.title}>Traveler</Text>
              <Text style={[pdf.mono, { fontSize: 16, textAlign: 'right', lineHeight: 1.2, marginBottom: 2 }]}>{wo.number}</Text>
              <Text style={[pdf.small, { textAlign: 'right' }]}>Scan to open on a phone</Text>
            </View>
            <Image src={{ data: qrPng, format: 'png' }} style={{ width: 72, height: 72 }} />
          </View>
        </View>
        <View style={[pdf.row, pdf.section, { gap: 16 }]}>
          <Labelled label="Customer" style={{ width: '34%' }}>
            <Text style={{ fontWeight: 600 }}>{wo.customer_name}</Text>
            <Text>PO {wo.po_number}</Text>
          </Labelled>
          <Labelled label="Part" style={{ width: '33%' }}>
            <Text style={pdf.mono}>{wo.part_number}{wo.part_revision ? ` rev ${wo.part_revision}` : ''}</Text>
            <Text style={pdf.small}>{wo.part_description}</Text>
          </Labelled>
          <Labelled label="Due" style={{ width: '33%' }}>
            <Text style={{ fontWeight: 600 }}>{formatDay(wo.due_date)}{wo.is_rush ? '  (RUSH)' : ''}</Text>
            <Text>Quantity {wo.quantity_ordered.toLocaleString('en-US')}</Text>
          </Labelled>
        </View>
        <Labelled label="Finish" style={pdf.section}>
          <Text style={{ fontWeight: 600 }}>{wo.finish_code} · {wo.finish_name}</Text>
          {wo.spec_text ? <Text>{wo.spec_text}</Text> : null}
          <Text style={pdf.small}>
            {wo.method === 'rack' ? 'Rack' : 'Barrel'}{wo.current_density_adm2 !== null ? ` · ${formatStoredQuantity(wo.current_density_adm2, 'currentDensity', units)}` : ''} · minimum{' '}
            {formatStoredQuantity(wo.min_thickness_um, 'thickness', units)} on significant surfaces
          </Text>
        </Labelled>
        <View style={pdf.section}>
          <View style={pdf.tableHead}>
            <Text style={[pdf.th, { width: '6%' }]}>#</Text>
            <Text style={[pdf.th, { width: '54%' }]}>Step</Text>
            <Text style={[pdf.th, { width: '20%' }]}>Done</Text>
            <Text style={[pdf.th, { width: '20%' }]}>By</Text>
          </View>
          {steps.map((s, i) => (
            <Step key={i} n={i + 1} title={s.title} note={s.note} />
          ))}
        </View>
        {wo.bake_required ? (
          <View style={pdf.note} wrap={false}>
            <Text style={{ fontWeight: 600 }}>{bake.title}</Text>
            <Text>{bake.text}</Text>
          </View>
        ) : null}
        <View style={pdf.note} wrap={false}>
          <Text style={{ fontWeight: 600 }}>Cautions: {cautions.map((c) => c.title).join(' · ')}</Text>
          {cautions.map((c) => (
            <Text key={c.title}>
              {c.title}: {c.text}
            </Text>
          ))}
          <Text style={pdf.small}>{SAFETY_DEFERRAL}</Text>
        </View>
        <PageFooter left={`${wo.number} · ${appUrl(`/work-orders/${wo.id}`)}`} />
      </Page>
    </Document>
  );
}

export async function renderTravelerPdf(wo: WorkOrderDetail, units: UnitSystem): Promise<Buffer> {
  registerPdfFonts();
  const [shop, qrPng, hazards] = await Promise.all([
    getShopSettings(),
    QRCode.toBuffer(appUrl(`/work-orders/${wo.id}`), { errorCorrectionLevel: 'M', margin: 1, width: 240 }),
    bathHazardsByFinish([wo.finish_id]),
  ]);
  return renderToBuffer(<TravelerDocument wo={wo} shop={shop} qrPng={qrPng} units={units} bathHazards={hazards.get(wo.finish_id) ?? []} />);
}
