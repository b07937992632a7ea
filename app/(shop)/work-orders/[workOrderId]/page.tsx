import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Money } from '@/components/money';
import { Badge } from '@/components/ui/badge';
import { buttonClasses, LinkButton } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { bathHazardsByFinish } from '@/lib/finishes/bath-hazards';
import { finishHazards } from '@/lib/finishes/hazards';
import { PageHeader } from '@/components/ui/page-header';
import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { getJobCost } from '@/lib/orders/job-cost';
import { findPlatingRuns, findWorkOrderEvents, getWorkOrder } from '@/lib/orders/queries';
import { getFamily } from '@/lib/families';
import { nextState, STATE_LABELS, WORK_ORDER_STATES } from '@/lib/orders/states';
import { formatNumber, formatStoredQuantity } from '@/lib/plating';
import { BASIS_LABELS } from '@/lib/quotes/basis';
import { formatDateTime, formatDay, formatUnitPrice } from '@/lib/quotes/format';
import { plannedDatesOf } from '@/lib/schedule/queries';
import { plannedText } from '@/lib/schedule/turnaround';
import { findCountMoves, findReceipts, findReworkOrders, findShipments } from '@/lib/dock/queries';
import { DockCard } from './dock-card';
import { DueDateForm } from './due-date-form';
import { JobCostCard } from './job-cost-card';
import { NextStepForm, OtherStepForm } from './next-step-form';
import { Timeline } from './timeline';

export const metadata: Metadata = { title: 'Work order' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function WorkOrderPage({ params }: { params: Promise<{ workOrderId: string }> }) {
  const { workOrderId } = await params;
  const user = await requirePageUser('orders.read', `/work-orders/${workOrderId}`);
  const wo = UUID.test(workOrderId) ? await getWorkOrder(workOrderId) : null;
  if (!wo) notFound();
  const bathHazards = (await bathHazardsByFinish([wo.finish_id])).get(wo.finish_id);
  const [events, runs, cost, receipts, shipments, moves, rework, plannedMap] = await Promise.all([
    findWorkOrderEvents(wo.id),
    findPlatingRuns(wo.id),
    can(user, 'reports.read') ? getJobCost(wo.id) : null,
    findReceipts(wo.id),
    findShipments(wo.id),
    findCountMoves(wo.id),
    findReworkOrders(wo.id),
    plannedDatesOf([wo.id]),
  ]);
  const planned = plannedMap.get(wo.id);
  const plannedWords = plannedText(planned, wo.state);
  const next = nextState(wo.state, wo.bake_required);
  const family = getFamily(wo.family);
  const runsWithCurrent = family.runsWithCurrent;
  const units = user.unitSystem;
  const mayLog = can(user, 'runs.log') && (wo.state === 'received' || wo.state === 'in_process');
  const dueIso = wo.due_date ? wo.due_date.toISOString().slice(0, 10) : null;

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={<Link href="/work-orders">Work orders</Link>}
        title={<span className="font-mono">{wo.number}</span>}
        meta={
          <>
            <Badge tone="action">{STATE_LABELS[wo.state]}</Badge>
            {wo.is_rush ? <Badge tone="copper">Rush</Badge> : null}
            {wo.bake_required ? <Badge tone="copper">Bake required</Badge> : null}
          </>
        }
        description={`${wo.customer_name} · PO ${wo.po_number} · due ${formatDay(wo.due_date)}`}
        actions={
          <>
            {mayLog ? (
              <LinkButton href={`/work-orders/${wo.id}/log-run`} size="lg">
                {runsWithCurrent ? 'Log a plating run' : 'Log a run'}
              </LinkButton>
            ) : null}
            <a className={buttonClasses({ variant: 'secondary' })} href={`/api/work-orders/${wo.id}/traveler`} target="_blank" rel="noopener">
              Traveler PDF
            </a>
            <LinkButton href={`/quality/orders/${wo.id}`} variant="secondary">
              Quality record
            </LinkButton>
          </>
        }
      />

      <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
        <Card title="Order">
          <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[9rem_1fr]">
            <dt className="text-ink-muted">Part</dt>
            <dd>
              <span className="font-mono">{wo.part_number}</span>
              {wo.part_revision ? ` rev ${wo.part_revision}` : ''} · {wo.part_description} ({formatStoredQuantity(wo.area_dm2, 'area', units)} each)
            </dd>
            <dt className="text-ink-muted">Finish</dt>
            <dd>
              {wo.finish_code} · {wo.finish_name}
              {wo.spec_text ? <div className="text-xs text-ink-muted">{wo.spec_text}</div> : null}
            </dd>
            {family.makesCoating ? (
              <>
                <dt className="text-ink-muted">Minimum thickness</dt>
                <dd>{formatStoredQuantity(wo.min_thickness_um, 'thickness', units)} on significant surfaces</dd>
              </>
            ) : null}
            <dt className="text-ink-muted">Quantity</dt>
            <dd className="tabular">
              {wo.quantity_ordered.toLocaleString('en-US')} ordered · {wo.quantity_received.toLocaleString('en-US')} received · {wo.quantity_shipped.toLocaleString('en-US')} shipped
              {wo.quantity_scrapped ? ` · ${wo.quantity_scrapped.toLocaleString('en-US')} scrapped` : ''}
              {wo.quantity_held ? ` · ${wo.quantity_held.toLocaleString('en-US')} held` : ''}
            </dd>
            <dt className="text-ink-muted">Price</dt>
            <dd>
              <Money cents={wo.total_cents} /> ({formatUnitPrice(wo.unit_price_cents)} {BASIS_LABELS[wo.pricing_basis]})
            </dd>
            <dt className="text-ink-muted">Planned on the line</dt>
            <dd>
              {can(user, 'schedule.read') ? <Link href="/schedule">{plannedWords}</Link> : plannedWords}
              {planned?.isLate ? (
                <span className="ml-2">
                  <StatusBadge status="out" label="Misses its promised date" size="sm" />
                </span>
              ) : null}
            </dd>
            <dt className="text-ink-muted">Quote</dt>
            <dd>{wo.quote_id ? <Link href={`/quotes/${wo.quote_id}`}>{wo.quote_number} rev {wo.quote_revision}</Link> : '—'}</dd>
          </dl>
          {can(user, 'quotes.write') && wo.state !== 'shipped' && wo.state !== 'invoiced' ? (
            <div className="mt-4 border-t border-surface-line pt-3">
              <DueDateForm workOrderId={wo.id} dueDate={dueIso} />
            </div>
          ) : null}
        </Card>
        <Card title="Next step">
          {can(user, 'orders.advance') ? (
            <div className="flex flex-col gap-4">
              <NextStepForm workOrderId={wo.id} next={next} />
              <details className="text-sm">
                <summary className="cursor-pointer text-ink-muted">Another step…</summary>
                <div className="pt-3">
                  <OtherStepForm workOrderId={wo.id} options={WORK_ORDER_STATES.filter((s) => s !== wo.state && s !== 'accepted').map((s) => ({ value: s, label: STATE_LABELS[s] }))} />
                </div>
              </details>
            </div>
          ) : (
            <p className="text-sm text-ink-muted">Next: {next ? STATE_LABELS[next] : 'none'}. Platers, supervisors and the owner move orders on.</p>
          )}
          <div className="mt-4 border-t border-surface-line pt-3">
            <Timeline events={events} labels={STATE_LABELS} />
          </div>
        </Card>
      </div>

      <DockCard wo={wo} receipts={receipts} shipments={shipments} moves={moves} rework={rework} may={{ receive: can(user, 'dock.receive'), ship: can(user, 'dock.ship'), move: can(user, 'orders.advance') }} />

      <Caution
        kind={finishHazards({
          family: wo.family,
          familyParams: wo.family_params,
          element: wo.element,
          ionCharge: wo.ion_charge,
          route: wo.process_route,
          bakeRequired: wo.bake_required,
          words: `${wo.finish_name} ${wo.spec_text}`,
          bathHazards,
        })}
      />

      <Card title={runsWithCurrent ? 'Plating runs' : 'Runs'} padding="none" actions={mayLog ? <LinkButton href={`/work-orders/${wo.id}/log-run`} variant="secondary" size="sm">Log a run</LinkButton> : null}>
        {runs.length === 0 ? (
          <p className="p-4 text-sm text-ink-muted">No runs logged yet.</p>
        ) : (
          <Table dense caption="Plating runs" captionHidden>
            <THead>
              <tr>
                <Th>Ended</Th>
                <Th>Tank</Th>
                <Th numeric>Current</Th>
                <Th numeric>Amp-hours</Th>
                <Th numeric>Loads × parts</Th>
                <Th numeric>{family.makesCoating ? 'Predicted average' : 'Bath'}</Th>
                <Th>Verdict</Th>
                <Th>Logged by</Th>
              </tr>
            </THead>
            <TBody>
              {runs.map((r) => (
                <Tr key={r.id}>
                  <Td>{formatDateTime(r.ended_at)}</Td>
                  <Td>{r.tank_code}</Td>
                  <Td numeric>{r.current_a !== null ? `${formatNumber(r.current_a, 4)} A` : r.meter_start_ah !== null ? `meter ${formatNumber(r.meter_start_ah, 6)}→${formatNumber(r.meter_stop_ah ?? 0, 6)}` : 'no current'}</Td>
                  <Td numeric>{r.amp_hours === null ? '—' : `${formatNumber(r.amp_hours, 4)} A·h`}</Td>
                  <Td numeric>
                    {r.loads} × {r.parts_per_load}
                  </Td>
                  <Td numeric>
                    {family.makesCoating
                      ? formatStoredQuantity(r.predicted_thickness_um, 'thickness', units)
                      : [r.conditions.temperatureC !== undefined ? formatStoredQuantity(r.conditions.temperatureC, 'temperature', units) : null, r.conditions.concentration !== undefined ? `${r.conditions.concentration} %` : null].filter(Boolean).join(' · ') || '—'}
                  </Td>
                  <Td>
                    {r.is_outside_window ? (
                      <StatusBadge status="out" label="Outside the window" size="sm" />
                    ) : !family.makesCoating ? (
                      <StatusBadge status="ok" label="Inside the window" size="sm" />
                    ) : r.is_below_minimum ? (
                      <StatusBadge status="out" label="Below minimum" size="sm" />
                    ) : (
                      <StatusBadge status="ok" label="Meets minimum" size="sm" />
                    )}
                  </Td>
                  <Td>{r.logged_by_name ?? '—'}</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        )}
      </Card>

      {cost ? <JobCostCard c={cost} hasRuns={runs.length > 0} /> : null}
    </div>
  );
}
