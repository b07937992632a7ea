import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { LinkButton } from '@/components/ui/button';
import { Badge } from '@/components/ui/badge';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { STATE_LABELS } from '@/lib/orders/states';
import { phosphorusRangeFor } from '@/lib/families/electroless-nickel';
import { certificateChecks, lotBake, lotChecks, lotFamily, thicknessState } from '@/lib/quality/lot-checks';
import { getLotView } from '@/lib/quality/lot-view';
import { shopTimeZone } from '@/lib/quality/shop-time';
import { BakeCard } from './bake-card';
import { CertificateCard } from './certificate-card';
import { NonconformanceCard } from './nonconformance-card';
import type { RecordKindForForm } from './process-record-forms';
import { ProcessRecordsCard } from './process-records-card';
import { ThicknessCard } from './thickness-card';

export const metadata: Metadata = { title: 'Lot quality' };

const OPEN_STATES = new Set(['in_process', 'plated', 'baked']);

export default async function LotQualityPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  const user = await requirePageUser('quality.read', `/quality/orders/${workOrderId}`);
  const view = await getLotView(workOrderId);
  if (!view) notFound();
  const { lot, bath } = view;
  const tz = shopTimeZone();
  const now = new Date();
  const t = thicknessState(lot);
  const req = lotBake(lot);
  const checks = lotChecks(lot);
  const { family, params: fp } = lotFamily(lot);
  const needsThickness = family.quality.some((q) => q.kind === 'thickness');
  // The family's own records with a form (passivation conditions come with each run; salt spray only when asked).
  const recordKinds = family.quality
    .map((q) => q.kind)
    .filter((k): k is RecordKindForForm => k === 'seal_test' || k === 'phosphorus_content' || k === 'passivation_test' || (k === 'salt_spray' && typeof fp.saltSprayHours === 'number'));
  const units = user.unitSystem;
  const o = lot.order;
  const bake = req.required ? (
    <BakeCard lot={lot} req={req} units={units} tz={tz} canRecord={can(user, 'quality.record')} canDisposition={can(user, 'quality.disposition')} now={now} />
  ) : null;
  // The bake cannot wait (its window runs from plating end); until it is recorded it comes first.
  const bakeFirst = req.required && lot.bakes.length === 0;

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={
          <>
            <Link href="/quality">Quality</Link> · <Link href={`/work-orders/${o.id}`}>Work order {o.number}</Link>
          </>
        }
        title={
          <>
            Lot quality · <span className="font-mono">{o.number}</span>
          </>
        }
        meta={
          <>
            <Badge tone="action">{STATE_LABELS[o.state]}</Badge>
            {req.required ? <Badge tone="copper">Bake required</Badge> : null}
          </>
        }
        description={`${o.customerName} · PO ${o.poNumber} · ${lot.part.partNumber}${lot.part.revision ? ` rev ${lot.part.revision}` : ''} · ${lot.finish.code} · ${(o.quantityReceived || o.quantityOrdered).toLocaleString('en-US')} parts`}
        actions={
          <LinkButton href={`/work-orders/${o.id}`} variant="secondary">
            Move the order on
          </LinkButton>
        }
      />
      <CertificateCard lot={lot} checks={certificateChecks(lot)} bath={bath} tz={tz} canIssue={can(user, 'certificates.issue')} />
      {bakeFirst ? bake : null}
      {needsThickness ? (
        <ThicknessCard lot={lot} t={t} units={units} tz={tz} canRecord={can(user, 'quality.record')} canVoid={can(user, 'quality.disposition')} open={OPEN_STATES.has(o.state)} />
      ) : null}
      {recordKinds.length ? (
        <ProcessRecordsCard
          lot={lot}
          kinds={recordKinds}
          checks={checks}
          tz={tz}
          canRecord={can(user, 'quality.record')}
          canVoid={can(user, 'quality.disposition')}
          phosphorusRange={typeof fp.phosphorusWtPct === 'number' ? phosphorusRangeFor(fp.phosphorusWtPct) : null}
          saltSprayHours={typeof fp.saltSprayHours === 'number' ? fp.saltSprayHours : null}
        />
      ) : null}
      {req.required && !bakeFirst ? bake : null}
      <NonconformanceCard lot={lot} tz={tz} canOpen={can(user, 'quality.record')} canDisposition={can(user, 'quality.disposition')} />
    </div>
  );
}
