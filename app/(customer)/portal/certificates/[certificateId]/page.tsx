import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { formatStoredQuantity } from '@/lib/plating';
import { getCustomerCertificate } from '@/lib/quality/certificate';
import { formatShopTime } from '@/lib/quality/shop-time';

export const metadata: Metadata = { title: 'Certificate' };

export default async function PortalCertificatePage({ params }: { params: Promise<{ certificateId: string }> }) {
  const { certificateId } = await params;
  const user = await requirePageUser('portal.use', `/portal/certificates/${certificateId}`);
  // Another company's certificate id gives the same "not found" as one that does not exist.
  const cert = await getCustomerCertificate(user, certificateId);
  if (!cert) notFound();
  const c = cert.content;
  const q = (um: number) => formatStoredQuantity(um, 'thickness', user.unitSystem);
  const rows: [string, string][] = [
    ['Purchase order', c.order.poNumber],
    ['Part', `${c.part.number}${c.part.revision ? ` rev ${c.part.revision}` : ''} · ${c.part.description}`],
    ['Quantity', `${c.order.quantity.toLocaleString('en-US')} pieces`],
    ['Finish', `${c.finish.name} · ${c.finish.specText}`],
    ...(c.process ? ([['Process', c.process.statement]] as [string, string][]) : []),
    ...(c.process?.records.map((r) => [r.label, `${r.result} (${r.verdict === 'pass' ? 'conforms' : 'does not conform'})`] as [string, string]) ?? []),
    ...(c.process?.runConditions.length ? ([['Conditions', c.process.runConditions.join('; ')]] as [string, string][]) : []),
    ...(c.process?.life ? ([['Expected coating life', `${c.process.life.text} in ${c.process.life.category} (${c.process.life.standard}). ${c.process.life.note}`]] as [string, string][]) : []),
    ...(c.process?.reportsThickness === false ? [] : ([['Thickness', `${c.thickness.count} readings on ${c.thickness.partsMeasured} parts: mean ${q(c.thickness.meanUm)}, minimum ${q(c.thickness.minUm)}, maximum ${q(c.thickness.maxUm)} (specified minimum ${q(c.finish.minThicknessUm)})`]] as [string, string][])),
    ['Relief bake', c.bake.required ? `${c.bake.durationH} h at ${formatStoredQuantity(c.bake.tempMinC, 'temperature', user.unitSystem)} to ${formatStoredQuantity(c.bake.tempMaxC, 'temperature', user.unitSystem)} in ${c.bake.oven}, started ${formatShopTime(c.bake.bakeStartedAt, c.timeZone)}` : c.bake.note],
    ['Signed', `${c.signedBy.name}, ${c.signedBy.role}, ${formatShopTime(c.signedAt, c.timeZone)}`],
  ];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/portal/certificates">Certificates</Link>}
        title={<span className="font-mono">{cert.number}</span>}
        description={`Certificate of conformance for work order ${cert.work_order_number}.`}
        actions={
          <a className={buttonClasses({ size: 'lg' })} href={`/api/portal/certificates/${cert.id}?download=1`}>
            Download the PDF
          </a>
        }
      />
      <Card title="Summary" description="The PDF is the signed record; this summary is taken from it.">
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[10rem_1fr]">
          {rows.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-ink-muted">{k}</dt>
              <dd>{v}</dd>
            </div>
          ))}
        </dl>
      </Card>
    </div>
  );
}
