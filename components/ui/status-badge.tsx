import type { ReactNode } from 'react';
import { cx } from './cx';
import { StatusShape, statusSoft, statusText, statusWords, type Status } from './status-shape';

export type { Status } from './status-shape';
export { StatusShape, statusWords } from './status-shape';

export type StatusBadgeProps = {
  status: Status;
  /** Replaces the standard word ("In range"…) when a screen needs a more specific one. */
  label?: ReactNode;
  /** Extra words after the status, e.g. "above 60 g/L". */
  detail?: ReactNode;
  /** `lg` for the floor verdict shown before saving. */
  size?: 'sm' | 'md' | 'lg';
  className?: string;
};

const sizes = {
  sm: { box: 'gap-1 px-1.5 py-0.5 text-xs', shape: 'size-3' },
  md: { box: 'gap-1.5 px-2 py-0.5 text-sm', shape: 'size-3.5' },
  lg: { box: 'gap-2.5 px-3.5 py-2 text-xl font-semibold', shape: 'size-6' },
} as const;

/** Status as shape + word + colour; never colour alone. */
export function StatusBadge({ status, label, detail, size = 'md', className }: StatusBadgeProps) {
  const s = sizes[size];
  return (
    <span
      className={cx(
        'inline-flex items-center rounded-md font-medium whitespace-nowrap',
        statusSoft[status],
        statusText[status],
        s.box,
        className,
      )}
    >
      <StatusShape status={status} className={s.shape} />
      <span>{label ?? statusWords[status]}</span>
      {detail ? <span className="font-normal text-ink-muted">{detail}</span> : null}
    </span>
  );
}
