import type { Metadata } from 'next';
import Link from 'next/link';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findTankSummaries } from '@/lib/bath/queries';
import { OutboxPanel } from './_ui/outbox-panel';

export const metadata: Metadata = { title: 'Floor' };

export default async function FloorPage() {
  await requirePageUser('bath.log', '/floor');
  const tanks = await findTankSummaries();
  const lines = [...new Set(tanks.map((t) => t.lineName))];
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-5">
      <PageHeader title="Floor" description="Pick a tank to log an analysis, an addition or a meter reading. Scanning a tank's label opens it directly." />
      <OutboxPanel />
      {tanks.length === 0 ? <EmptyState title="No tanks yet" description="A supervisor sets up lines and tanks first." /> : null}
      {lines.map((line) => (
        <section key={line} aria-labelledby={`line-${line}`} className="flex flex-col gap-2">
          <h2 id={`line-${line}`} className="text-base font-semibold text-ink-muted">
            {line}
          </h2>
          <ul className="grid gap-3 sm:grid-cols-2">
            {tanks
              .filter((t) => t.lineName === line)
              .map((t) => (
                <li key={t.id}>
                  <Link
                    href={`/floor/tanks/${t.code}`}
                    className="flex min-h-20 flex-col justify-center gap-1 rounded-lg border border-surface-line bg-surface px-4 py-3 shadow-xs hover:border-action hover:bg-action-soft focus-visible:outline-3 focus-visible:outline-action-ring"
                  >
                    <span className="flex items-center justify-between gap-2">
                      <span className="text-xl font-semibold text-ink">{t.code}</span>
                      <VerdictBadge verdict={t.worst} />
                    </span>
                    <span className="text-base text-ink">{t.name}</span>
                    {t.overdue > 0 ? <span className="text-sm font-medium text-near">{t.overdue} {t.overdue === 1 ? 'analysis' : 'analyses'} due</span> : null}
                  </Link>
                </li>
              ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
