import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { roleCan } from '@/lib/auth/roles';
import { formatDay } from '@/lib/quotes/format';
import { planLine } from '@/lib/schedule/queries';
import { ScheduleBoard, type BoardCell, type BoardChip, type BoardTank } from './board';
import { CapacityForm } from './capacity-form';

export const metadata: Metadata = { title: 'Schedule' };

/** Working days the board shows; the plan itself looks further ahead. */
const BOARD_DAYS = 10;
const WEEKDAY = new Intl.DateTimeFormat('en-GB', { weekday: 'short', timeZone: 'UTC' });

export default async function SchedulePage() {
  const user = await requirePageUser('schedule.read', '/schedule');
  const canPlan = roleCan(user.role, 'schedule.plan');
  const { input, plan } = await planLine();
  const shown = plan.days.slice(0, BOARD_DAYS);
  const shownSet = new Set(shown);
  const jobs = new Map(input.jobs.map((j) => [j.id, j]));

  const cells: Record<string, BoardCell> = {};
  const later = new Map<string, number>();
  for (const td of plan.tankDays) {
    if (shownSet.has(td.day)) cells[`${td.tankId}|${td.day}`] = { loads: td.loads, capacity: td.capacity, overloaded: td.isOverloaded, chips: [] };
    else later.set(td.tankId, (later.get(td.tankId) ?? 0) + td.loads);
  }
  for (const s of plan.slots) {
    const cell = cells[`${s.tankId}|${s.day}`];
    const j = jobs.get(s.jobId)!;
    if (!cell) continue;
    const late = plan.jobs.get(s.jobId)?.isLate ?? false;
    const chip: BoardChip = {
      jobId: j.id, number: j.number, finishId: j.finishId, finishCode: j.finishCode, loads: s.loads, placed: s.placed, late,
      title: `${j.number} · ${j.customerName} · ${j.partNumber} · ${j.finishCode} · ${j.pieces.toLocaleString('en-US')} parts · due ${formatDay(j.due)}${j.isRush ? ' · rush' : ''}`,
    };
    cell.chips.push(chip);
  }
  const tanks: BoardTank[] = input.tanks.map((t) => ({ id: t.id, code: t.code, name: t.name, loadsPerDay: t.loadsPerDay, finishIds: [...t.finishIds], later: later.get(t.id) ?? 0 }));

  const planned = input.jobs.map((j) => ({ job: j, p: plan.jobs.get(j.id)! })).filter((x) => x.p);
  const late = planned.filter((x) => x.p.isLate);
  const unplanned = planned.filter((x) => x.p.unplannedLoads > 0);
  const overloaded = plan.tankDays.filter((d) => d.isOverloaded);
  const totalLoads = input.jobs.reduce((a, j) => a + j.loads, 0);
  const tankCode = new Map(input.tanks.map((t) => [t.id, t.code]));

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Schedule"
        description={`${input.jobs.length} open ${input.jobs.length === 1 ? 'job' : 'jobs'}, ${totalLoads.toLocaleString('en-US')} loads, planned by promised date and each tank's loads a day from ${formatDay(input.today)}. Rush jobs go first.`}
      />
      {late.length > 0 || overloaded.length > 0 || unplanned.length > 0 ? (
        <Card title="Before it happens">
          <ul className="flex flex-col gap-1 text-sm">
            {late.map(({ job, p }) => (
              <li key={job.id}>
                <Link href={`/work-orders/${job.id}`} className="font-mono">{job.number}</Link> ({job.customerName}) will miss its promised date {formatDay(job.due)}:{' '}
                {p.finish ? `its last load runs ${formatDay(p.finish)}` : 'it does not fit in the plan'}{p.noTank ? ', and no active tank runs its finish' : ''}.
              </li>
            ))}
            {overloaded.map((d) => (
              <li key={`${d.tankId}${d.day}`}>
                {tankCode.get(d.tankId)} is overloaded on {formatDay(d.day)}: {d.loads} loads placed by hand where it runs {d.capacity}.
              </li>
            ))}
            {unplanned.filter((x) => !x.p.isLate).map(({ job, p }) => (
              <li key={`u${job.id}`}>
                <Link href={`/work-orders/${job.id}`} className="font-mono">{job.number}</Link>: {p.unplannedLoads} of {job.loads} loads do not fit in the next {plan.days.length} working days{p.noTank ? ' (no active tank runs its finish)' : ''}.
              </li>
            ))}
          </ul>
        </Card>
      ) : (
        <p className="text-sm text-ink-muted">Every open job fits its promised date and no tank is overloaded.</p>
      )}
      {tanks.length === 0 ? (
        <p className="text-sm">No active tank runs a finish yet.</p>
      ) : (
        <ScheduleBoard
          days={shown.map((d) => ({ day: d, label: formatDay(d), weekday: WEEKDAY.format(new Date(`${d}T00:00:00Z`)) }))}
          tanks={tanks}
          cells={cells}
          canPlan={canPlan}
        />
      )}
      {canPlan ? <p className="text-xs text-ink-muted">Drag a job to another day or to another tank that runs its finish, or choose it and then “Place here”. A job you place stays there, even past the tank&apos;s loads a day; the day then shows as overloaded.</p> : null}

      <Card title="Open jobs" padding="none">
        <Table dense caption="Open jobs and their planned dates" captionHidden>
          <THead>
            <tr>
              <Th>Order</Th>
              <Th>Customer</Th>
              <Th>Finish</Th>
              <Th numeric>Parts left</Th>
              <Th numeric>Loads</Th>
              <Th>Promised</Th>
              <Th>Planned start</Th>
              <Th>Planned finish</Th>
            </tr>
          </THead>
          <TBody>
            {planned
              .sort((a, b) => (a.p.start ?? '9999').localeCompare(b.p.start ?? '9999') || a.job.number.localeCompare(b.job.number))
              .map(({ job, p }) => (
                <Tr key={job.id}>
                  <Td>
                    <Link href={`/work-orders/${job.id}`} className="font-mono">{job.number}</Link>
                    {job.isRush ? <span className="ml-1 text-xs text-copper-deep">rush</span> : null}
                  </Td>
                  <Td>{job.customerName}</Td>
                  <Td className="font-mono">{job.finishCode}</Td>
                  <Td numeric>{job.pieces.toLocaleString('en-US')}</Td>
                  <Td numeric>{job.loads}</Td>
                  <Td>{formatDay(job.due)}</Td>
                  <Td>{formatDay(p.start)}</Td>
                  <Td className={p.isLate ? 'font-semibold text-out' : undefined}>{p.finish ? formatDay(p.finish) : 'not in the plan'}{p.isLate ? ' (late)' : ''}</Td>
                </Tr>
              ))}
          </TBody>
        </Table>
      </Card>

      {roleCan(user.role, 'tanks.capacity') ? (
        <Card title="What each tank runs in a day" description="Loads a day = whole cycles in a shift × shifts. A load carries the finish's parts per load, or fewer where the rack or barrel holds less work area.">
          <ul className="flex flex-col gap-3">
            {input.tanks.map((t) => (
              <li key={t.id} className="flex flex-col gap-1 border-b border-surface-line pb-3 last:border-0">
                <div className="text-sm"><span className="font-mono font-medium">{t.code}</span> {t.name}: {t.loadsPerDay} loads a day</div>
                <CapacityForm tank={t} />
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
    </div>
  );
}
