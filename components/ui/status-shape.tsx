import { cx } from './cx';

export type Status = 'ok' | 'near' | 'out' | 'none';

// Shape, colour and word go together everywhere, so a reader who cannot tell the colours apart
// still reads the status from the shape or the word.
export const statusWords: Record<Status, string> = {
  ok: 'In range',
  near: 'Near limit',
  out: 'Out of range',
  none: 'No reading',
};

export const statusText: Record<Status, string> = {
  ok: 'text-ok',
  near: 'text-near',
  out: 'text-out',
  none: 'text-ink-muted',
};

export const statusSoft: Record<Status, string> = {
  ok: 'bg-ok-soft',
  near: 'bg-near-soft',
  out: 'bg-out-soft',
  none: 'bg-surface-sunken',
};

type StatusShapeProps = { status: Status; className?: string; title?: string };

/**
 * The bare shape: check mark (in range), half-filled diamond (near a limit), filled triangle
 * (out of range), dashed ring (no reading). Decorative unless a `title` is given.
 */
export function StatusShape({ status, className, title }: StatusShapeProps) {
  return (
    <svg
      viewBox="0 0 16 16"
      className={cx('size-4 shrink-0', className)}
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
      focusable="false"
    >
      {status === 'ok' ? (
        <path d="M2.6 8.6 6.2 12.1 13.4 3.9" fill="none" stroke="currentColor" strokeWidth="2.4" strokeLinecap="round" strokeLinejoin="round" />
      ) : status === 'near' ? (
        <>
          <path d="M8 1.6 14.4 8 8 14.4 1.6 8Z" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinejoin="round" />
          <path d="M1.6 8h12.8L8 14.4Z" fill="currentColor" />
        </>
      ) : status === 'out' ? (
        <path d="M8 1.5 15 14.2H1Z" fill="currentColor" stroke="currentColor" strokeWidth="1" strokeLinejoin="round" />
      ) : (
        <circle cx="8" cy="8" r="5.6" fill="none" stroke="currentColor" strokeWidth="1.6" strokeDasharray="2.6 2" />
      )}
    </svg>
  );
}
