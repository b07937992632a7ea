import 'server-only';
import type { NavBadge } from '@/lib/nav';
import { countOpenAlerts } from './alerts';

// Turns the navigation's badge keys into counts for this request. A count that cannot be read
// (database hiccup) shows no badge rather than breaking every page.
const BADGES: Record<NavBadge, { count: () => Promise<number>; label: string }> = {
  openBathAlerts: { count: () => countOpenAlerts(), label: 'open bath alerts' },
};

export async function resolveNavBadges<T extends { badge?: NavBadge }>(items: T[]): Promise<(Omit<T, 'badge'> & { badge?: number; badgeLabel?: string })[]> {
  return Promise.all(
    items.map(async ({ badge, ...rest }) => {
      if (!badge) return rest;
      try {
        return { ...rest, badge: await BADGES[badge].count(), badgeLabel: BADGES[badge].label };
      } catch {
        return rest;
      }
    }),
  );
}
