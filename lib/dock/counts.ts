// A work order's parts, counted through: every part received is, at any moment, still in the shop,
// shipped, scrapped or held. Pure functions, shared by the mutations, the screens and the tests;
// the database's own check (work_orders_counts_balance) refuses what these would refuse.
import type { CountMoveKind } from '@/db/types';

export type Counts = { received: number; shipped: number; scrapped: number; held: number };

export type CountAction =
  | { kind: 'receive'; quantity: number }
  | { kind: 'ship'; quantity: number }
  | { kind: CountMoveKind; quantity: number };

export const EMPTY_COUNTS: Counts = { received: 0, shipped: 0, scrapped: 0, held: 0 };

/** Parts in the shop that are neither shipped, scrapped nor held. */
export function inShop(c: Counts): number {
  return c.received - c.shipped - c.scrapped - c.held;
}

/** received = shipped + scrapped + held: nothing is left unaccounted on the shop floor. */
export function isBalanced(c: Counts): boolean {
  return c.received > 0 && inShop(c) === 0;
}

const n = (v: number) => v.toLocaleString('en-US');

/** The counts after `a`, or the reason it cannot be taken. */
export function applyCount(c: Counts, a: CountAction): { ok: true; counts: Counts } | { ok: false; reason: string } {
  if (!Number.isInteger(a.quantity) || a.quantity <= 0) return { ok: false, reason: 'Enter a whole number of parts, at least 1.' };
  const free = inShop(c);
  switch (a.kind) {
    case 'receive':
      return { ok: true, counts: { ...c, received: c.received + a.quantity } };
    case 'ship':
      if (a.quantity > free) return { ok: false, reason: `Cannot ship ${n(a.quantity)} parts: ${n(free)} are in the shop to ship (received ${n(c.received)}, shipped ${n(c.shipped)}, scrapped ${n(c.scrapped)}, held ${n(c.held)}).` };
      return { ok: true, counts: { ...c, shipped: c.shipped + a.quantity } };
    case 'scrap':
      if (a.quantity > free) return { ok: false, reason: `Cannot scrap ${n(a.quantity)} parts: ${n(free)} are in the shop.` };
      return { ok: true, counts: { ...c, scrapped: c.scrapped + a.quantity } };
    case 'hold':
      if (a.quantity > free) return { ok: false, reason: `Cannot hold ${n(a.quantity)} parts: ${n(free)} are in the shop.` };
      return { ok: true, counts: { ...c, held: c.held + a.quantity } };
    case 'release':
      if (a.quantity > c.held) return { ok: false, reason: `Cannot release ${n(a.quantity)} parts: ${n(c.held)} are on hold.` };
      return { ok: true, counts: { ...c, held: c.held - a.quantity } };
    case 'scrap_held':
      if (a.quantity > c.held) return { ok: false, reason: `Cannot scrap ${n(a.quantity)} held parts: ${n(c.held)} are on hold.` };
      return { ok: true, counts: { ...c, held: c.held - a.quantity, scrapped: c.scrapped + a.quantity } };
  }
}

export const MOVE_LABELS: Record<CountMoveKind, string> = {
  scrap: 'Scrapped',
  hold: 'Put on hold',
  release: 'Released from hold',
  scrap_held: 'Scrapped from hold',
};

export function countsOf(row: { quantity_received: number; quantity_shipped: number; quantity_scrapped: number; quantity_held: number }): Counts {
  return { received: row.quantity_received, shipped: row.quantity_shipped, scrapped: row.quantity_scrapped, held: row.quantity_held };
}
