import type { Metadata } from 'next';
import Link from 'next/link';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { Badge } from '@/components/ui/badge';
import { LinkButton } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { formatWhen } from '@/lib/bath/display';
import { countOpenAlerts } from '@/lib/bath/alerts';
import { findTankSummaries } from '@/lib/bath/queries';

export const metadata: Metadata = { title: 'Baths' };

export default async function BathsBoardPage() {
  const user = await requirePageUser('bath.read', '/baths');
  const [tanks, openAlerts] = await Promise.all([findTankSummaries(), countOpenAlerts()]);
  const lines = [...new Set(tanks.map((t) => t.lineName))];
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Baths"
        description="Every tank at a glance: the worst of its latest analyses, analyses due and open alerts."
        actions={
          <>
            <LinkButton href="/baths/alerts" variant={openAlerts > 0 ? 'primary' : 'secondary'}>
              Alerts{openAlerts > 0 ? ` (${openAlerts} open)` : ''}
            </LinkButton>
            {can(user, 'bath.log') ? <LinkButton href="/baths/upload" variant="secondary">Upload lab results</LinkButton> : null}
          </>
        }
      />
      {tanks.length === 0 ? <EmptyState title="No tanks yet" description="Lines and tanks are set up first; their analytes come from the bath template." /> : null}
      {lines.map((line) => (
        <section key={line} className="flex flex-col gap-3">
          <h2 className="text-base font-semibold text-ink-muted">{line}</h2>
          <ul className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
            {tanks
              .filter((t) => t.lineName === line)
              .map((t) => (
                <li key={t.id}>
                  <Link href={`/baths/${t.id}`} className="flex h-full flex-col gap-2 rounded-lg border border-surface-line bg-surface p-4 shadow-xs hover:border-action">
                    <span className="flex items-start justify-between gap-2">
                      <span>
                        <span className="block text-lg font-semibold text-ink">{t.code}</span>
                        <span className="block text-sm text-ink">{t.name}</span>
                      </span>
                      <VerdictBadge verdict={t.worst} />
                    </span>
                    {t.templateName !== t.name ? <span className="text-xs text-ink-muted">{t.templateName}</span> : null}
                    {t.age ? (
                      <span className={`text-sm ${t.age.atEndOfLife ? 'font-semibold text-out' : 'text-ink'}`}>
                        {t.age.atEndOfLife ? '▲ ' : ''}Bath age: {t.age.text}
                      </span>
                    ) : null}
                    <span className="flex flex-wrap gap-2">
                      {t.openAlerts > 0 ? <Badge tone="copper">{t.openAlerts} open alert{t.openAlerts === 1 ? '' : 's'}</Badge> : null}
                      {t.overdue > 0 ? <Badge tone="outline">{t.overdue} {t.overdue === 1 ? 'analysis' : 'analyses'} due</Badge> : null}
                      {t.analyteCount === 0 ? <Badge tone="outline">No analytes set up</Badge> : null}
                    </span>
                    <span className="text-xs text-ink-muted">{t.lastAnalysedAt ? `Last analysis ${formatWhen(t.lastAnalysedAt)}` : 'Not analysed yet'}</span>
                  </Link>
                </li>
              ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
