'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { cx } from '../ui/cx';

export type NavItem = {
  href: string;
  label: string;
  icon?: ReactNode;
  /** Light up only on this exact path, not on pages below it (for an area's overview item). */
  exact?: boolean;
  /** A small count after the label (e.g. open alerts); hidden when zero or absent. */
  badge?: number;
  /** What the count is, for screen readers (e.g. "open alerts"). */
  badgeLabel?: string;
};

export type AppNavProps = {
  items: readonly NavItem[];
  /** Defaults to the current route. */
  currentPath?: string;
  /** Names the landmark; two navs on one page need different names. */
  label?: string;
  /** Product name or logo at the start of the bar. */
  brand?: ReactNode;
  /** Signed-in user, sign-out and the like, after the items. */
  footer?: ReactNode;
  /** A column beside the page (staff) or a bar above it (customer area). Both fold into a menu on phones. */
  variant?: 'side' | 'top';
  className?: string;
};

/** The item for the current page: the longest href that is the path or a parent of it. */
export function findCurrentHref(items: readonly NavItem[], path: string): string | null {
  let best: string | null = null;
  for (const { href, exact } of items) {
    const matches = href === '/' || exact ? path === href : path === href || path.startsWith(`${href.replace(/\/$/, '')}/`);
    if (matches && (best === null || href.length > best.length)) best = href;
  }
  return best;
}

export function AppNav({ items, currentPath, label = 'Main', brand, footer, variant = 'side', className }: AppNavProps) {
  const pathname = usePathname();
  const path = currentPath ?? pathname ?? '/';
  const current = findCurrentHref(items, path);
  const [open, setOpen] = useState(false);
  const listId = useId();
  const toggleRef = useRef<HTMLButtonElement>(null);
  const isSide = variant === 'side';

  // Navigating closes the phone menu (also covers back/forward, which skip onClick).
  const [lastPath, setLastPath] = useState(path);
  if (lastPath !== path) {
    setLastPath(path);
    setOpen(false);
  }

  useEffect(() => {
    if (!open) return;
    function onKey(event: KeyboardEvent) {
      if (event.key !== 'Escape') return;
      setOpen(false);
      toggleRef.current?.focus();
    }
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [open]);

  return (
    <nav
      aria-label={label}
      className={cx(
        'bg-surface',
        // The side column's width, height and edge are the caller's (the staff layout's column).
        isSide ? 'border-b border-surface-line md:flex md:flex-col md:border-b-0' : 'border-b border-surface-line md:flex md:items-center md:gap-4 md:px-4',
        className,
      )}
    >
      <div className={cx('flex min-h-14 items-center justify-between gap-3 px-3', !isSide && 'md:px-0')}>
        <div className="min-w-0 font-semibold text-ink">{brand}</div>
        <button
          ref={toggleRef}
          type="button"
          aria-expanded={open}
          aria-controls={listId}
          onClick={() => setOpen((o) => !o)}
          className="inline-flex min-h-target min-w-target items-center justify-center gap-2 rounded-md px-3 text-sm font-medium text-ink hover:bg-surface-muted md:hidden"
        >
          <MenuIcon open={open} />
          <span>{open ? 'Close' : 'Menu'}</span>
        </button>
      </div>
      <div
        id={listId}
        className={cx(
          open ? 'flex' : 'hidden',
          'flex-col gap-2 border-t border-surface-line px-2 pb-3 pt-2 md:flex md:border-t-0',
          isSide ? 'md:flex-1 md:justify-between md:pt-0' : 'md:flex-1 md:flex-row md:items-center md:justify-between md:p-0',
        )}
      >
        <ul className={cx('flex flex-col gap-0.5', !isSide && 'md:flex-row md:gap-1')}>
          {items.map((item) => {
            const isCurrent = item.href === current;
            return (
              <li key={item.href}>
                <Link
                  href={item.href}
                  aria-current={isCurrent ? 'page' : undefined}
                  onClick={() => setOpen(false)}
                  className={cx(
                    'flex min-h-target items-center gap-2.5 rounded-md px-3 text-sm font-medium md:min-h-10',
                    isCurrent
                      ? cx('bg-action-soft text-action', isSide ? 'md:shadow-[inset_3px_0_0_var(--color-copper,#b8642e)]' : 'md:shadow-[inset_0_-3px_0_var(--color-copper,#b8642e)]')
                      : 'text-ink-muted hover:bg-surface-muted hover:text-ink',
                  )}
                >
                  {item.icon ? (
                    <span aria-hidden="true" className="inline-flex size-5 shrink-0 items-center justify-center">
                      {item.icon}
                    </span>
                  ) : null}
                  <span className="truncate">{item.label}</span>
                  {item.badge ? (
                    <span className="ml-auto inline-flex min-w-5 items-center justify-center rounded-full bg-out px-1.5 text-xs font-semibold text-white tabular">
                      {item.badge}
                      {item.badgeLabel ? <span className="sr-only"> {item.badgeLabel}</span> : null}
                    </span>
                  ) : null}
                </Link>
              </li>
            );
          })}
        </ul>
        {footer ? <div className={cx('pt-2', !isSide && 'md:pt-0')}>{footer}</div> : null}
      </div>
    </nav>
  );
}

function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg viewBox="0 0 20 20" className="size-5" aria-hidden="true" focusable="false">
      {open ? (
        <path d="M5 5l10 10M15 5 5 15" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      ) : (
        <path d="M3 6h14M3 10h14M3 14h14" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
      )}
    </svg>
  );
}
