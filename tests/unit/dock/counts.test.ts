// Property tests over a work order's counts: whatever the dock does, in any order, every part
// received stays accounted for and nothing ships that was not received.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { applyCount, EMPTY_COUNTS, inShop, isBalanced, type CountAction } from '@/lib/dock/counts';

const action = fc.record({
  kind: fc.constantFrom('receive', 'ship', 'scrap', 'hold', 'release', 'scrap_held'),
  quantity: fc.oneof(fc.integer({ min: 1, max: 500 }), fc.integer({ min: -5, max: 0 }), fc.double({ min: 0.1, max: 9.9, noInteger: true })),
}) as fc.Arbitrary<CountAction>;

describe('counts through the dock', () => {
  it('no sequence of actions leaves parts unaccounted or ships more than was received', () => {
    fc.assert(
      fc.property(fc.array(action, { maxLength: 40 }), (actions) => {
        let c = EMPTY_COUNTS;
        let received = 0;
        let shipped = 0;
        for (const a of actions) {
          const r = applyCount(c, a);
          if (!r.ok) {
            expect(r.reason.length).toBeGreaterThan(10);
            continue;
          }
          if (a.kind === 'receive') received += a.quantity;
          if (a.kind === 'ship') shipped += a.quantity;
          c = r.counts;
          expect(inShop(c)).toBeGreaterThanOrEqual(0);
          expect(c.held).toBeGreaterThanOrEqual(0);
          expect(c.received).toBe(received);
          expect(c.shipped).toBe(shipped);
          expect(c.shipped + c.scrapped + c.held + inShop(c)).toBe(c.received);
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('refuses fractions, zero and negatives whatever the action', () => {
    for (const kind of ['receive', 'ship', 'scrap', 'hold', 'release', 'scrap_held'] as const) {
      for (const quantity of [0, -1, 1.5, Number.NaN]) expect(applyCount({ received: 10, shipped: 0, scrapped: 0, held: 5 }, { kind, quantity }).ok).toBe(false);
    }
  });

  it('is balanced exactly when every received part is shipped, scrapped or held', () => {
    expect(isBalanced(EMPTY_COUNTS)).toBe(false);
    expect(isBalanced({ received: 10, shipped: 4, scrapped: 1, held: 5 })).toBe(true);
    expect(isBalanced({ received: 10, shipped: 4, scrapped: 1, held: 4 })).toBe(false);
  });
});
