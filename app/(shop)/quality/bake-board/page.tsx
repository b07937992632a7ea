import type { Metadata } from 'next';
import Link from 'next/link';
import { Countdown } from '@/components/countdown/countdown';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findOpenBakeWindows } from '@/lib/quality/bake/alerts';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';
import { RefreshEvery } from './refresh-every';

export const metadata: Metadata = { title: 'Bake windows' };

const RECENT_MS = 12 * 3_600_000;

/** The floor screen by the ovens: every plated lot still waiting for its relief bake, the closest window first. */
export default async function BakeBoardPage() {
  await requirePageUser('quality.read', '/quality/bake-board');
  const all = await findOpenBakeWindows();
  const tz = shopTimeZone();
  const nowMs = Date.now();
  const now = new Date(nowMs).toISOString();
  // Cards for windows still open or closed within the last shift; older misses in a short list.
  const windows = all.filter((w) => w.deadlineAt.getTime() > nowMs - RECENT_MS);
  const stale = all.filter((w) => w.deadlineAt.getTime() <= nowMs - RECENT_MS);
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Bake windows" description="Lots plated and waiting for their embrittlement-relief bake. The list refreshes itself every minute." />
      <RefreshEvery seconds={60} />
      <Caution kind={['high-strength-steel-bake', 'heat']} compact />
      {windows.length === 0 ? (
        <EmptyState title="No bake waiting" description="When a lot that needs a relief bake finishes plating, its window appears here with a countdown." />
      ) : (
        <ul className="grid gap-4 lg:grid-cols-2">
          {windows.map((w) => (
            <li key={w.workOrderId} className="flex flex-col gap-2 rounded-lg border-2 border-surface-line bg-surface p-5">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <Link href={`/quality/orders/${w.workOrderId}`} className="font-mono text-2xl font-semibold">
                  {w.number}
                </Link>
                <span className="text-lg">{w.partNumber}</span>
              </div>
              <p className="text-ink-muted">{w.finishName}</p>
              <Countdown deadline={w.deadlineAt.toISOString()} now={now} size="lg" />
              <p className="text-base">
                Plating ended {formatShopTime(w.platingEndedAt, tz)} · start by <strong>{formatShopTime(w.deadlineAt, tz)}</strong>
              </p>
            </li>
          ))}
        </ul>
      )}
      {stale.length ? (
        <section aria-label="Windows closed more than 12 hours ago without a bake record" className="text-sm">
          <h2 className="font-semibold">Closed more than 12 h ago, no bake recorded ({stale.length})</h2>
          <p className="text-ink-muted">Record the bake if it was done, or open a nonconformance for the lot.</p>
          <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
            {stale.slice(0, 50).map((w) => (
              <li key={w.workOrderId}>
                <Link className="font-mono" href={`/quality/orders/${w.workOrderId}`}>
                  {w.number}
                </Link>{' '}
                <span className="text-ink-muted">closed {formatShopTime(w.deadlineAt, tz)}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
