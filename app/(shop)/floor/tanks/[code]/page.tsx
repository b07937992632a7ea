import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BathCaution } from '@/components/bath/bath-caution';
import { formatBathValue } from '@/components/bath/bath-value';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { LinkButton } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findBathAges } from '@/lib/bath/bath-age';
import { getFloorTank } from '@/lib/bath/floor-queries';
import { OutboxPanel } from '../../_ui/outbox-panel';

export const metadata: Metadata = { title: 'Tank' };

export default async function FloorTankPage({ params }: { params: Promise<{ code: string }> }) {
  const { code } = await params;
  const user = await requirePageUser('bath.log', `/floor/tanks/${code}`);
  const tank = await getFloorTank({ code });
  if (!tank) notFound();
  const age = (await findBathAges([tank.id])).get(tank.id) ?? null;
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-5">
      <PageHeader
        eyebrow={<Link href="/floor" className="text-action underline">Floor</Link>}
        title={`${tank.code} · ${tank.name}`}
        description={`${tank.templateName} · ${formatBathValue(tank.volumeL, 'L', user.unitSystem)} · ${tank.lineName}`}
      />
      <OutboxPanel />
      {age ? (
        <p className={`rounded-lg border px-4 py-3 text-lg ${age.atEndOfLife ? 'border-out bg-out-soft font-semibold' : 'border-surface-line bg-surface'}`}>
          {age.atEndOfLife ? '▲ End of life reached: ' : 'Bath age: '}
          {age.text}
        </p>
      ) : null}
      <BathCaution hazards={tank.hazards} />
      <section aria-labelledby="analyses-h" className="flex flex-col gap-2">
        <h2 id="analyses-h" className="text-lg font-semibold text-ink">Log an analysis</h2>
        {tank.analytes.length === 0 ? <EmptyState title="No analytes set up" description="A supervisor sets them up from the bath template on the Baths page." /> : null}
        <ul className="grid gap-3 sm:grid-cols-2">
          {tank.analytes.map((a) => (
            <li key={a.id}>
              <Link
                href={`/floor/tanks/${tank.code}/analytes/${a.key}`}
                className="flex min-h-20 flex-col justify-center gap-1 rounded-lg border border-surface-line bg-surface px-4 py-3 shadow-xs hover:border-action hover:bg-action-soft focus-visible:outline-3 focus-visible:outline-action-ring"
              >
                <span className="flex items-center justify-between gap-2">
                  <span className="text-lg font-semibold text-ink">{a.name}</span>
                  <VerdictBadge verdict={a.lastVerdict} size="sm" />
                </span>
                <span className="text-sm text-ink-muted">
                  {a.lastValue !== null ? `Last ${formatBathValue(a.lastValue, a.unit, user.unitSystem)}` : 'Not analysed yet'}
                  {a.isOverdue ? <strong className="ml-2 font-semibold text-near">Due now</strong> : null}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      </section>
      <section aria-label="Other entries" className="grid gap-3 sm:grid-cols-2">
        <LinkButton size="lg" variant="secondary" href={`/floor/tanks/${tank.code}/addition`}>Record an addition</LinkButton>
        {tank.hasAhMeter ? (
          <LinkButton size="lg" variant="secondary" href={`/floor/tanks/${tank.code}/meter`}>Amp-hour meter reading</LinkButton>
        ) : null}
        {tank.takesHullCell ? <LinkButton size="lg" variant="secondary" href={`/floor/tanks/${tank.code}/hull-cell`}>Hull cell panel</LinkButton> : null}
        <LinkButton size="lg" variant="ghost" href={`/floor/tanks/${tank.code}/label`}>Print this tank&apos;s QR label</LinkButton>
      </section>
    </div>
  );
}
