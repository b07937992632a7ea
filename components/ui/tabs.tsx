'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useId, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { cx } from './cx';

const tabBase =
  'inline-flex min-h-10 items-center gap-1.5 border-b-2 px-3 text-sm font-medium whitespace-nowrap transition-colors';
const tabIdle = 'border-transparent text-ink-muted hover:border-surface-line hover:text-ink';
const tabActive = 'border-action text-action';

export type LinkTab = {
  href: string;
  label: ReactNode;
  /** A count shown after the label, e.g. open alerts. */
  count?: number;
  /** `prefix` keeps the tab lit on sub-pages (/tanks/4/analyses/12). Default `exact`. */
  match?: 'exact' | 'prefix';
};

export type LinkTabsProps = {
  items: readonly LinkTab[];
  /** Names the navigation for screen readers, e.g. "Tank sections". */
  label: string;
  /** Defaults to the current route. */
  currentPath?: string;
  className?: string;
};

function isCurrent(tab: LinkTab, path: string): boolean {
  if (path === tab.href) return true;
  return tab.match === 'prefix' && path.startsWith(tab.href.endsWith('/') ? tab.href : `${tab.href}/`);
}

/** Sections of one record as links: each tab is its own URL, so it can be shared and reloaded. */
export function LinkTabs({ items, label, currentPath, className }: LinkTabsProps) {
  const pathname = usePathname();
  const path = currentPath ?? pathname ?? '';
  return (
    <nav aria-label={label} className={cx('overflow-x-auto border-b border-surface-line', className)}>
      <ul className="flex gap-1">
        {items.map((tab) => {
          const current = isCurrent(tab, path);
          return (
            <li key={tab.href}>
              <Link href={tab.href} aria-current={current ? 'page' : undefined} className={cx(tabBase, current ? tabActive : tabIdle)}>
                {tab.label}
                {tab.count !== undefined ? <TabCount value={tab.count} /> : null}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}

export type PanelTab = { id: string; label: ReactNode; count?: number; content: ReactNode };

export type TabsProps = {
  tabs: readonly PanelTab[];
  /** Names the tab list for screen readers. */
  label: string;
  defaultTab?: string;
  className?: string;
};

/** In-page tabs (ARIA tab pattern): arrow keys, Home and End move between tabs; Tab moves into the panel. */
export function Tabs({ tabs, label, defaultTab, className }: TabsProps) {
  const baseId = useId();
  const [selected, setSelected] = useState(defaultTab ?? tabs[0]?.id);
  const refs = useRef<Array<HTMLButtonElement | null>>([]);

  function onKeyDown(event: KeyboardEvent<HTMLDivElement>) {
    const index = tabs.findIndex((t) => t.id === selected);
    const last = tabs.length - 1;
    const next =
      event.key === 'ArrowRight' ? (index >= last ? 0 : index + 1)
      : event.key === 'ArrowLeft' ? (index <= 0 ? last : index - 1)
      : event.key === 'Home' ? 0
      : event.key === 'End' ? last
      : null;
    if (next === null) return;
    event.preventDefault();
    const tab = tabs[next];
    if (!tab) return;
    setSelected(tab.id);
    refs.current[next]?.focus();
  }

  return (
    <div className={className}>
      <div role="tablist" aria-label={label} onKeyDown={onKeyDown} className="flex gap-1 overflow-x-auto border-b border-surface-line">
        {tabs.map((tab, i) => {
          const isSelected = tab.id === selected;
          return (
            <button
              key={tab.id}
              ref={(el) => {
                refs.current[i] = el;
              }}
              type="button"
              role="tab"
              id={`${baseId}-tab-${tab.id}`}
              aria-selected={isSelected}
              aria-controls={`${baseId}-panel-${tab.id}`}
              tabIndex={isSelected ? 0 : -1}
              onClick={() => setSelected(tab.id)}
              className={cx(tabBase, isSelected ? tabActive : tabIdle)}
            >
              {tab.label}
              {tab.count !== undefined ? <TabCount value={tab.count} /> : null}
            </button>
          );
        })}
      </div>
      {tabs.map((tab) => (
        <div
          key={tab.id}
          role="tabpanel"
          id={`${baseId}-panel-${tab.id}`}
          aria-labelledby={`${baseId}-tab-${tab.id}`}
          hidden={tab.id !== selected}
          tabIndex={0}
          className="pt-4"
        >
          {tab.content}
        </div>
      ))}
    </div>
  );
}

function TabCount({ value }: { value: number }) {
  return <span className="tabular rounded-full bg-surface-sunken px-1.5 text-xs text-ink-muted">{value}</span>;
}
