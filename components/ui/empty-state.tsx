import type { ReactNode } from 'react';
import { cx } from './cx';

export type EmptyStateProps = {
  /** What is missing, e.g. "No analyses yet". */
  title: ReactNode;
  /** What to do next, in one or two sentences. */
  description?: ReactNode;
  /** The next step as a button or link. */
  action?: ReactNode;
  icon?: ReactNode;
  className?: string;
};

export function EmptyState({ title, description, action, icon, className }: EmptyStateProps) {
  return (
    <div
      className={cx(
        'flex flex-col items-center gap-2 rounded-lg border border-dashed border-surface-line bg-surface-muted px-6 py-10 text-center',
        className,
      )}
    >
      <span aria-hidden="true" className="mb-1 text-copper">
        {icon ?? <DefaultIcon />}
      </span>
      <p className="text-base font-semibold text-ink">{title}</p>
      {description ? <p className="max-w-md text-sm text-ink-muted">{description}</p> : null}
      {action ? <div className="mt-2 flex flex-wrap justify-center gap-2">{action}</div> : null}
    </div>
  );
}

// An empty tray with a dashed outline: calm, not an error.
function DefaultIcon() {
  return (
    <svg viewBox="0 0 32 32" className="size-8" focusable="false">
      <path d="M4 18h7l2 3h6l2-3h7" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
      <path d="M4 18l4-10h16l4 10v7H4z" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" strokeDasharray="3 2.4" />
    </svg>
  );
}
