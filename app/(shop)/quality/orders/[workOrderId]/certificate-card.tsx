import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { StatusBadge } from '@/components/ui/status-badge';
import type { BathSnapshot } from '@/lib/quality/certificate/content';
import type { LotCheck } from '@/lib/quality/lot-checks';
import type { LotRecord } from '@/lib/quality/lot-types';
import { formatShopTime } from '@/lib/quality/shop-time';
import { IssueCertificateForm } from './small-forms';

const TITLES: Record<LotCheck['key'], string> = {
  runs: 'Process runs',
  thickness_count: 'Thickness sample',
  thickness_pass: 'Thickness verdict',
  bake: 'Relief bake',
  nonconformance: 'Nonconformances',
  seal_test: 'Seal quality',
  phosphorus_content: 'Phosphorus content',
  passivation_lot: 'Passivation window',
  passivation_test: 'Verification test',
  salt_spray: 'Salt spray',
  inspected: 'Inspection',
};

/** Where the lot stands against each record a certificate needs, and the certificate itself. */
export function CertificateCard({ lot, checks, bath, tz, canIssue }: { lot: LotRecord; checks: LotCheck[]; bath: BathSnapshot; tz: string; canIssue: boolean }) {
  const ready = checks.every((c) => c.ok);
  const cert = lot.certificate;
  return (
    <Card title="Certificate of conformance" description={cert ? undefined : 'Issued by a supervisor once every record below is present and passing.'}>
      <div className="flex flex-col gap-4">
        <ul className="flex flex-col gap-2 text-sm">
          {checks.map((c) => (
            <li key={c.key} className="grid gap-1 sm:grid-cols-[11rem_1fr]">
              <StatusBadge status={c.ok ? 'ok' : 'out'} label={TITLES[c.key]} size="sm" className="self-start" />
              <span>{c.message}</span>
            </li>
          ))}
          <li className="grid gap-1 sm:grid-cols-[11rem_1fr]">
            <StatusBadge
              status={!bath.available ? 'none' : bath.tanks.every((t) => t.inControl) ? 'ok' : 'near'}
              label="Bath condition"
              size="sm"
              className="self-start"
            />
            <span>
              {!bath.available
                ? bath.note
                : bath.tanks
                    .map(
                      (t) =>
                        `${t.code}: ${t.inControl === null ? 'no analysis before the run' : t.inControl ? 'in control' : 'not in control'}` +
                        `${t.withinSpec === false ? ', outside a specification limit' : ''}${t.rulesFired?.length ? ` (control rule fired on ${t.rulesFired.join(', ')})` : ''}`,
                    )
                    .join('; ')}
              . The certificate prints each analysis against its specification limits; the control band and rules stay in the shop.
            </span>
          </li>
        </ul>
        {cert ? (
          <div className="flex flex-wrap items-center gap-3 rounded-md border border-ok/40 bg-ok-soft p-3">
            <StatusBadge status="ok" label={`Issued ${cert.number}`} />
            <span className="text-sm">
              Signed by {cert.signedByName}, {formatShopTime(cert.signedAt, tz)}
            </span>
            <a className={buttonClasses({ variant: 'secondary', size: 'sm' })} href={`/api/quality/certificates/${cert.id}`} target="_blank" rel="noopener">
              Open the PDF
            </a>
          </div>
        ) : canIssue ? (
          <IssueCertificateForm workOrderId={lot.order.id} ready={ready} />
        ) : (
          <p className="text-sm text-ink-muted">A supervisor signs and issues the certificate.</p>
        )}
      </div>
    </Card>
  );
}
