import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BathCaution } from '@/components/bath/bath-caution';
import { formatBathValue } from '@/components/bath/bath-value';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { getCorrectionTarget, getFloorTank, recentForAnalyte } from '@/lib/bath/floor-queries';
import { formatWhen } from '@/lib/bath/display';
import { getMethod } from '@/lib/bath/methods';
import { supplyMaterial } from '@/lib/bath/templates/supplies';
import { OutboxPanel } from '../../../../_ui/outbox-panel';
import { AnalysisEntry } from './analysis-entry';

export const metadata: Metadata = { title: 'Log an analysis' };

type Params = { params: Promise<{ code: string; key: string }>; searchParams: Promise<{ correct?: string }> };

export default async function FloorAnalytePage({ params, searchParams }: Params) {
  const { code, key } = await params;
  const user = await requirePageUser('bath.log', `/floor/tanks/${code}/analytes/${key}`);
  const tank = await getFloorTank({ code });
  const analyte = tank?.analytes.find((a) => a.key === key);
  if (!tank || !analyte) notFound();
  const { correct } = await searchParams;
  const [correcting, recent] = await Promise.all([getCorrectionTarget(analyte.id, correct), recentForAnalyte(tank.id, analyte.id)]);
  const method = getMethod(analyte.methodId);
  // A value worked out from other analyses starts from their latest values (same keys).
  const prefill: Record<string, number> = {};
  if (method?.kind === 'derived') {
    for (const i of method.inputs) {
      const v = tank.analytes.find((a) => a.key === i.key)?.lastValue;
      if (v != null) prefill[i.key] = v;
    }
  }
  const fmt = (v: number | null) => formatBathValue(v, analyte.unit, user.unitSystem);
  const band = `${fmt(analyte.lowerControl)} to ${fmt(analyte.upperControl)}`;
  return (
    <div className="mx-auto flex max-w-xl flex-col gap-5">
      <PageHeader
        eyebrow={<Link href={`/floor/tanks/${tank.code}`} className="text-action underline">{tank.code} · {tank.name}</Link>}
        title={analyte.name}
        description={`Target ${fmt(analyte.target)}; control limits ${band}.`}
      />
      <OutboxPanel />
      <BathCaution hazards={tank.hazards} compact />
      <AnalysisEntry
        tank={{ id: tank.id, code: tank.code, name: tank.name, volumeL: tank.volumeL }}
        analyte={analyte}
        system={user.unitSystem}
        correcting={correcting}
        prefill={prefill}
        additionTargets={tank.analytes.filter((a) => a.supply).map((a) => ({ id: a.id, name: a.name, material: a.supply ? supplyMaterial(a.supply) : null }))}
      />
      {recent.length > 0 ? (
        <section aria-label="Recent analyses" className="flex flex-col gap-1 text-sm">
          <h2 className="font-semibold text-ink">Recent</h2>
          <ul className="flex flex-col gap-1">
            {recent.map((r) => (
              <li key={r.id} className={`flex flex-wrap items-center gap-2 ${r.supersededBy ? 'text-ink-faint line-through' : ''}`}>
                <span className="tabular">{formatWhen(r.takenAt)}</span>
                <span className="tabular font-medium">{formatBathValue(r.value, r.unit, user.unitSystem)}</span>
                {r.supersededBy ? <span className="no-underline">(corrected)</span> : <VerdictBadge verdict={r.verdict} size="sm" />}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
