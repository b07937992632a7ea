'use client';

import { useEffect, useState } from 'react';
import { StatusShape, type Status } from '../ui/status-shape';
import { cx } from '../ui/cx';

export type CountdownProps = {
  /** The moment the window closes, as an ISO string (the server's instant, not a local time). */
  deadline: string;
  /** Shown before the time left, e.g. "Start the bake within". */
  label?: string;
  /** Below this many minutes left the countdown shows "near" (half-filled diamond). */
  warnMinutes?: number;
  /** `lg` for floor screens: large type readable from the oven. */
  size?: 'md' | 'lg';
  /** The server's "now", so the first paint matches the server's text before the clock ticks. */
  now?: string;
  className?: string;
};

/** "2 h 05 min left" / "closed 12 min ago", from a number of milliseconds. Pure; exported for tests. */
export function describeRemaining(ms: number): { text: string; closed: boolean } {
  if (!Number.isFinite(ms)) return { text: '—', closed: false };
  const closed = ms < 0;
  const totalMin = Math.floor(Math.abs(ms) / 60_000);
  const h = Math.floor(totalMin / 60);
  const m = totalMin % 60;
  const span = h > 0 ? `${h} h ${String(m).padStart(2, '0')} min` : `${m} min`;
  if (!closed && totalMin === 0) return { text: 'less than a minute left', closed };
  return { text: closed ? `closed ${span} ago` : `${span} left`, closed };
}

export function countdownStatus(ms: number, warnMinutes: number): Status {
  if (!Number.isFinite(ms)) return 'none';
  if (ms < 0) return 'out';
  return ms <= warnMinutes * 60_000 ? 'near' : 'ok';
}

/**
 * A live countdown to a deadline that ticks every second, with the status as shape and word as
 * well as colour. The remaining time is announced politely once a minute, not every tick.
 */
export function Countdown({ deadline, label, warnMinutes = 60, size = 'md', now, className }: CountdownProps) {
  const end = Date.parse(deadline);
  const [current, setCurrent] = useState(() => (now ? Date.parse(now) : Date.now()));
  useEffect(() => {
    setCurrent(Date.now());
    const id = window.setInterval(() => setCurrent(Date.now()), 1000);
    return () => window.clearInterval(id);
  }, []);
  const ms = end - current;
  const { text } = describeRemaining(ms);
  const status = countdownStatus(ms, warnMinutes);
  const tone = status === 'out' ? 'text-out' : status === 'near' ? 'text-near' : status === 'ok' ? 'text-ok' : 'text-ink-muted';
  const minuteText = `${label ? `${label}: ` : ''}${text}`;
  return (
    <span className={cx('inline-flex items-center gap-2 tabular', size === 'lg' ? 'text-3xl font-semibold' : 'text-sm font-medium', tone, className)}>
      <StatusShape status={status} className={size === 'lg' ? 'size-8' : 'size-4'} />
      <span aria-hidden="true">
        {label ? <span className="font-normal text-ink-muted">{label} </span> : null}
        {text}
        {size === 'lg' && ms > 0 && ms < 3_600_000 ? (
          <span className="ml-2 text-lg font-normal text-ink-muted">{String(Math.floor((ms % 60_000) / 1000)).padStart(2, '0')} s</span>
        ) : null}
      </span>
      <span className="sr-only" aria-live="polite">
        {minuteText}
      </span>
    </span>
  );
}
