import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { StatusShape } from '@/components/ui/status-shape';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { formatWhen } from '@/lib/bath/display';
import { ALERT_KIND_LABEL, ALERT_STATE_LABEL, findAlerts } from '@/lib/bath/alerts';
import { getBathSettings } from '@/lib/bath/settings';
import { AcknowledgeForm } from './ack-form';
import { BathSettingsForm } from './settings-form';

export const metadata: Metadata = { title: 'Bath alerts' };

export default async function BathAlertsPage() {
  const user = await requirePageUser('bath.read', '/baths/alerts');
  const [open, done, settings] = await Promise.all([findAlerts({ open: true }), findAlerts({ open: false, limit: 30 }), getBathSettings()]);
  const mayAck = can(user, 'alerts.ack');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/baths" className="text-action underline">Baths</Link>}
        title="Bath alerts"
        description={`Supervisors are e-mailed when an alert is raised; one not acknowledged within ${settings.escalateAfterHours} h goes to the owner.`}
      />
      <section aria-labelledby="open-h" className="flex flex-col gap-3">
        <h2 id="open-h" className="text-lg font-semibold text-ink">Open ({open.length})</h2>
        {open.length === 0 ? <EmptyState title="No open alerts" description="Every bath alert has been acknowledged." /> : null}
        {open.map((a) => (
          <Card key={a.id} headingLevel={3} title={<span className="flex items-center gap-2"><StatusShape status="out" className="text-out" />{ALERT_KIND_LABEL[a.kind]} · {a.tank_code} {a.tank_name}{a.analyte_name ? `, ${a.analyte_name}` : ''}</span>}
            actions={a.state === 'escalated' ? <Badge tone="copper">{ALERT_STATE_LABEL.escalated}</Badge> : <Badge tone="outline">{ALERT_STATE_LABEL.open}</Badge>}
          >
            <div className="flex flex-col gap-3" data-testid="open-alert">
              <p className="text-sm text-ink">{a.message}</p>
              <p className="text-xs text-ink-muted">
                Raised {formatWhen(a.raised_at)}{a.occurrences > 1 ? ` · seen ${a.occurrences} times, last ${formatWhen(a.last_seen_at)}` : ''}
                {a.escalated_at ? ` · escalated ${formatWhen(a.escalated_at)}` : ''} ·{' '}
                <Link href={`/baths/${a.tank_id}`} className="text-action underline">tank</Link>
                {a.analyte_id ? <> · <Link href={`/baths/${a.tank_id}/analytes/${a.analyte_id}`} className="text-action underline">chart</Link></> : null}
              </p>
              {mayAck ? <AcknowledgeForm alertId={a.id} /> : <p className="text-xs text-ink-muted">A supervisor acknowledges it with the corrective action.</p>}
            </div>
          </Card>
        ))}
      </section>
      <Card title="Recently acknowledged" padding="sm">
        {done.length === 0 ? (
          <p className="text-sm text-ink-muted">None yet.</p>
        ) : (
          <ul className="flex flex-col gap-2 text-sm">
            {done.map((a) => (
              <li key={a.id}>
                <span className="font-medium">{ALERT_KIND_LABEL[a.kind]} · {a.tank_code}{a.analyte_name ? `, ${a.analyte_name}` : ''}</span>: {a.message}
                <span className="block text-ink-muted">
                  {a.acknowledged_by_name}, {a.acknowledged_at ? formatWhen(a.acknowledged_at) : ''} — {a.corrective_action}
                </span>
              </li>
            ))}
          </ul>
        )}
      </Card>
      {can(user, 'settings.manage') ? (
        <Card title="Alert timing" description="When alerts escalate, and how much grace the checks allow. Defaults: 4 h, 2 h and 1 h.">
          <BathSettingsForm settings={settings} />
        </Card>
      ) : null}
    </div>
  );
}
