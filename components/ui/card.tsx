import type { ReactNode } from 'react';
import { cx } from './cx';

export type CardProps = {
  title?: ReactNode;
  description?: ReactNode;
  /** Buttons or links at the top right. */
  actions?: ReactNode;
  footer?: ReactNode;
  /** Heading level of the title; pages use h1 in PageHeader, so cards default to h2. */
  headingLevel?: 2 | 3 | 4;
  /** `none` lets a table run edge to edge. */
  padding?: 'none' | 'sm' | 'md';
  className?: string;
  children?: ReactNode;
};

const paddings = { none: '', sm: 'p-3', md: 'p-4 sm:p-5' } as const;

export function Card({ title, description, actions, footer, headingLevel = 2, padding = 'md', className, children }: CardProps) {
  const Heading = `h${headingLevel}` as const;
  const hasHeader = title || description || actions;
  return (
    <section className={cx('rounded-lg border border-surface-line bg-surface shadow-xs', className)}>
      {hasHeader ? (
        <header className="flex flex-wrap items-start justify-between gap-3 border-b border-surface-line px-4 py-3 sm:px-5">
          <div className="min-w-0">
            {title ? <Heading className="text-base font-semibold text-ink">{title}</Heading> : null}
            {description ? <p className="mt-0.5 text-sm text-ink-muted">{description}</p> : null}
          </div>
          {actions ? <div className="flex shrink-0 flex-wrap items-center gap-2">{actions}</div> : null}
        </header>
      ) : null}
      {children !== undefined ? <div className={paddings[padding]}>{children}</div> : null}
      {footer ? (
        <footer className="flex flex-wrap items-center justify-end gap-2 rounded-b-lg border-t border-surface-line bg-surface-muted px-4 py-3 sm:px-5">
          {footer}
        </footer>
      ) : null}
    </section>
  );
}
