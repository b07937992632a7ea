import type { ReactNode } from 'react';
import { cx } from './cx';

export type PageHeaderProps = {
  title: ReactNode;
  description?: ReactNode;
  /** Primary and secondary actions for the page, e.g. a LinkButton "New quote". */
  actions?: ReactNode;
  /** A small line above the title: a back link or the parent record ("Tank 4 · Nickel"). */
  eyebrow?: ReactNode;
  /** Badges after the title, e.g. the record's state. */
  meta?: ReactNode;
  className?: string;
};

export function PageHeader({ title, description, actions, eyebrow, meta, className }: PageHeaderProps) {
  return (
    <header className={cx('flex flex-wrap items-end justify-between gap-x-6 gap-y-3 pb-4', className)}>
      <div className="min-w-0">
        {eyebrow ? <div className="mb-1 text-sm text-ink-muted">{eyebrow}</div> : null}
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <h1 className="text-2xl font-semibold tracking-tight text-ink">{title}</h1>
          {meta}
        </div>
        {description ? <p className="mt-1 max-w-prose text-sm text-ink-muted">{description}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
    </header>
  );
}
