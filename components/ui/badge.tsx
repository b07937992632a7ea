import type { ReactNode } from 'react';
import { cx } from './cx';

export type BadgeTone = 'neutral' | 'action' | 'copper' | 'outline';

const tones: Record<BadgeTone, string> = {
  neutral: 'bg-surface-sunken text-ink-muted',
  action: 'bg-action-soft text-action',
  copper: 'bg-copper-soft text-copper-deep',
  outline: 'border border-surface-line text-ink-muted',
};

export type BadgeProps = { tone?: BadgeTone; children: ReactNode; className?: string; title?: string };

/**
 * A small label for states and kinds ("Draft", "Barrel", "Rev B"). For in/near/out of range use
 * StatusBadge, which carries a shape as well as a colour.
 */
export function Badge({ tone = 'neutral', children, className, title }: BadgeProps) {
  return (
    <span
      title={title}
      className={cx('inline-flex items-center gap-1 rounded px-1.5 py-0.5 text-xs font-medium whitespace-nowrap', tones[tone], className)}
    >
      {children}
    </span>
  );
}
