'use client';
// The line's plan as a board: a row per tank, a column per working day, a chip per job's loads.
// A supervisor moves a job by dragging its chip to another day or tank of the same finish, or,
// without a mouse, by choosing the chip and then "Place here" in a cell.
import { useMemo, useState, useTransition } from 'react';
import { FormMessage } from '@/components/ui/form-message';
import { cx } from '@/components/ui/cx';
import type { FormState } from '@/lib/action-state';
import { placeJobAction, unplaceJobAction } from './actions';

export type BoardChip = { jobId: string; number: string; finishId: string; finishCode: string; loads: number; placed: boolean; late: boolean; title: string };
export type BoardCell = { loads: number; capacity: number; overloaded: boolean; chips: BoardChip[] };
export type BoardTank = { id: string; code: string; name: string; loadsPerDay: number; finishIds: string[]; later: number };
export type BoardDay = { day: string; label: string; weekday: string };

const key = (tankId: string, day: string) => `${tankId}|${day}`;

export function ScheduleBoard({ days, tanks, cells, canPlan }: { days: BoardDay[]; tanks: BoardTank[]; cells: Record<string, BoardCell>; canPlan: boolean }) {
  const [moving, setMoving] = useState<BoardChip | null>(null);
  const [state, setState] = useState<FormState>({});
  const [pending, startTransition] = useTransition();

  const send = (action: typeof placeJobAction, fields: Record<string, string>) => {
    const form = new FormData();
    for (const [k, v] of Object.entries(fields)) form.set(k, v);
    startTransition(async () => {
      setState(await action({}, form));
      setMoving(null);
    });
  };
  const place = (chip: BoardChip, tankId: string, day: string) => send(placeJobAction, { workOrderId: chip.jobId, tankId, day });
  const accepts = (tank: BoardTank) => moving !== null && tank.finishIds.includes(moving.finishId);
  // A drop names its chip in the drag data, so it does not depend on the render after dragstart.
  const chipsById = useMemo(() => new Map(Object.values(cells).flatMap((c) => c.chips.map((chip) => [chip.jobId, chip] as const))), [cells]);

  return (
    <div className="flex flex-col gap-2">
      <div aria-live="polite" className="min-h-6">
        {moving ? (
          <p className="text-sm">
            Moving <span className="font-mono">{moving.number}</span> ({moving.finishCode}): choose “Place here” on a day of a tank that runs it.{' '}
            <button type="button" className="underline" onClick={() => setMoving(null)}>
              Cancel
            </button>
            {moving.placed ? (
              <>
                {' · '}
                <button type="button" className="underline" onClick={() => send(unplaceJobAction, { workOrderId: moving.jobId })}>
                  Give back to the planner
                </button>
              </>
            ) : null}
          </p>
        ) : (
          <FormMessage tone={state.ok ? 'success' : 'error'} message={pending ? 'Saving…' : (state.message ?? (state.fieldErrors ? Object.values(state.fieldErrors).flat().join(' ') : undefined))} />
        )}
      </div>
      <div className="overflow-x-auto rounded border border-surface-line bg-surface">
        <table className="w-full border-collapse text-sm" aria-label="Loads planned per tank and day">
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 z-10 bg-surface p-2 text-left">Tank</th>
              {days.map((d) => (
                <th key={d.day} scope="col" className="min-w-28 p-2 text-left font-medium">
                  <div className="text-xs text-ink-muted">{d.weekday}</div>
                  {d.label}
                </th>
              ))}
              <th scope="col" className="p-2 text-left font-medium">Later</th>
            </tr>
          </thead>
          <tbody>
            {tanks.map((t) => (
              <tr key={t.id} className="border-t border-surface-line align-top">
                <th scope="row" className="sticky left-0 z-10 bg-surface p-2 text-left font-normal">
                  <div className="font-mono font-medium">{t.code}</div>
                  <div className="text-xs text-ink-muted">{t.name}</div>
                  <div className="text-xs text-ink-muted">{t.loadsPerDay} loads a day</div>
                </th>
                {days.map((d) => {
                  const cell = cells[key(t.id, d.day)];
                  const ok = accepts(t);
                  return (
                    <td
                      key={d.day}
                      data-cell={`${t.code} ${d.day}`}
                      className={cx('p-1.5', cell?.overloaded && 'bg-out-soft', moving && !ok && 'opacity-40')}
                      onDragOver={(e) => {
                        if (canPlan) e.preventDefault();
                      }}
                      onDrop={(e) => {
                        e.preventDefault();
                        const chip = chipsById.get(e.dataTransfer.getData('text/plain')) ?? moving;
                        if (!chip) return;
                        if (t.finishIds.includes(chip.finishId)) place(chip, t.id, d.day);
                        else {
                          setMoving(null);
                          setState({ ok: false, message: `${t.code} does not run ${chip.finishCode}: drop ${chip.number} on a tank of its finish.` });
                        }
                      }}
                    >
                      <div className={cx('mb-1 text-xs', cell?.overloaded ? 'font-semibold text-out' : 'text-ink-muted')}>
                        {cell ? `${cell.loads} / ${cell.capacity}` : `0 / ${t.loadsPerDay}`}
                        {cell?.overloaded ? ' overloaded' : ''}
                      </div>
                      <ul className="flex flex-col gap-1">
                        {cell?.chips.map((c) => (
                          <li key={c.jobId}>
                            <button
                              type="button"
                              draggable={canPlan}
                              disabled={!canPlan}
                              title={c.title}
                              onDragStart={(e) => {
                                e.dataTransfer.setData('text/plain', c.jobId);
                                e.dataTransfer.effectAllowed = 'move';
                                // Chromium ends a drag whose source changes during dragstart: mark it after.
                                setTimeout(() => setMoving(c), 0);
                              }}
                              onClick={() => setMoving(moving?.jobId === c.jobId ? null : c)}
                              aria-pressed={moving?.jobId === c.jobId}
                              className={cx(
                                'w-full rounded border px-1.5 py-1 text-left text-xs',
                                c.late ? 'border-out bg-out-soft' : 'border-surface-line bg-surface-sunken',
                                moving?.jobId === c.jobId && 'ring-2 ring-action',
                                canPlan && 'cursor-grab',
                              )}
                            >
                              <span className="font-mono">{c.number}</span> · {c.loads} {c.loads === 1 ? 'load' : 'loads'}
                              {c.placed ? <span className="ml-1 text-ink-muted">· placed</span> : null}
                              {c.late ? <span className="block font-medium text-out">misses its date</span> : null}
                            </button>
                          </li>
                        ))}
                      </ul>
                      {canPlan && moving && ok ? (
                        <button type="button" className="mt-1 w-full rounded border border-dashed border-action px-1 py-0.5 text-xs text-action" onClick={() => place(moving, t.id, d.day)}>
                          Place here
                        </button>
                      ) : null}
                    </td>
                  );
                })}
                <td className="p-2 text-xs text-ink-muted">{t.later > 0 ? `${t.later} loads` : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
