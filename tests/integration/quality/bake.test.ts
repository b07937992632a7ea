import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { changeWorkOrderState } from '@/lib/orders/states';
import { alertClosingBakeWindows } from '@/lib/quality/bake/alerts';
import { dispositionBake, recordBake, type BakeInput } from '@/lib/quality/bake/records';
import { actorFor, createLot, errorOf, PLATER, SUPERVISOR } from './fixtures';

afterAll(() => db.destroy());

const toBaked = (workOrderId: string, actorId: string) =>
  db.transaction().execute((trx) => changeWorkOrderState(trx, { workOrderId, to: 'baked', actorId }));

// The bake lot is the hardened set screw (1220 MPa, 39 HRC) on the zinc finish that asks for a
// 12 h bake started within 4 h (finish record); B850 range 190–220 °C.
const good = { oven: 'Oven 2', tempMinC: 196, tempMaxC: 204, durationH: 12.5 };

async function bakeLot(platingEndIso: string) {
  return createLot(db, { bake: true, quantity: 20, platingEnd: new Date(platingEndIso) });
}

const input = (workOrderId: string, platingEnded: string, bakeStarted: string, timeZone = 'America/New_York', extra: Partial<BakeInput> = {}): BakeInput => ({
  workOrderId,
  platingEnded,
  bakeStarted,
  timeZone,
  ...good,
  ...extra,
});

const LATER = new Date('2027-01-01T00:00:00Z');

describe('bake window arithmetic through recordBake', () => {
  it('a window across midnight counts real hours: 23:30 → 02:45 is 3 h 15 min, on time', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-06-11T03:30:00Z'); // 23:30 EDT on 10 June
    const r = await recordBake(plater, input(lot.id, '2026-06-10T23:30', '2026-06-11T02:45'), LATER);
    expect(r.verdict).toBe('pass');
    // 23:30 EDT (UTC−4) + 4 h = 03:30 EDT = 07:30 UTC.
    expect(r.deadline.toISOString()).toBe('2026-06-11T07:30:00.000Z');
    expect(await errorOf(toBaked(lot.id, plater.id))).toBe('none');
  });

  it('late across midnight: the app refuses "baked" until a supervisor records a disposition', async () => {
    const plater = await actorFor(db, PLATER);
    const supervisor = await actorFor(db, SUPERVISOR);
    const lot = await bakeLot('2026-06-11T02:00:00Z');
    const r = await recordBake(plater, input(lot.id, '2026-06-10T22:00', '2026-06-11T02:20'), LATER);
    expect(r).toMatchObject({ verdict: 'fail', messages: ['Bake started 20 min after the 4 h window closed.'] });
    expect(await errorOf(toBaked(lot.id, plater.id))).toBe(
      "CONFLICT: The bake record fails: Bake started 20 min after the 4 h window closed. A supervisor's disposition is needed before the order can be marked baked.",
    );
    expect(await errorOf(dispositionBake(plater, { bakeId: r.id, reason: 'ok' }))).toBe(
      'FORBIDDEN: Only a supervisor may record a disposition for a bake that failed.',
    );
    expect(await errorOf(dispositionBake(supervisor, { bakeId: r.id, reason: '' }))).toBe('BAD_INPUT: Give the reason for the disposition.');
    await dispositionBake(supervisor, { bakeId: r.id, reason: 'Customer concession NGF-C-0412 accepts a 20 min late start.' });
    expect(await errorOf(toBaked(lot.id, plater.id))).toBe('none');
  });

  // Source: US daylight saving time ends the first Sunday of November at 02:00 local time and
  // begins the second Sunday of March at 02:00 (Energy Policy Act of 2005, §110); 1 Nov and
  // 8 Mar 2026 are those Sundays.
  it('clocks going back: 00:30 EDT → 04:00 EST is 4 h 30 min by the clock of the world, so late by 30 min', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-11-01T04:30:00Z');
    const r = await recordBake(plater, input(lot.id, '2026-11-01T00:30', '2026-11-01T04:00'), LATER);
    // A wall-clock subtraction (3 h 30 min) would have passed this bake.
    expect(r).toMatchObject({ verdict: 'fail', messages: ['Bake started 30 min after the 4 h window closed.'] });
    expect(r.deadline.toISOString()).toBe('2026-11-01T08:30:00.000Z');
  });

  it('clocks going forward: 00:30 EST → 04:15 EDT is 2 h 45 min, on time', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-03-08T05:30:00Z');
    const r = await recordBake(plater, input(lot.id, '2026-03-08T00:30', '2026-03-08T04:15'), LATER);
    expect(r.verdict).toBe('pass');
    const row = await db.selectFrom('bake_records').select(['plating_ended_at', 'bake_started_at']).where('id', '=', r.id).executeTakeFirstOrThrow();
    expect(row.bake_started_at.getTime() - row.plating_ended_at.getTime()).toBe(2.75 * 3_600_000);
  });

  // Source: EU summer time ends the last Sunday of October at 01:00 UTC (Directive 2000/84/EC, Art. 3).
  it('in another zone (Europe/London, 25 Oct 2026): 23:00 BST → 02:30 GMT is 4 h 30 min, late', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-10-24T22:00:00Z');
    const r = await recordBake(plater, input(lot.id, '2026-10-24T23:00', '2026-10-25T02:30', 'Europe/London'), LATER);
    expect(r.messages).toEqual(['Bake started 30 min after the 4 h window closed.']);
  });

  it('refuses a local time that never happened, and names it', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-03-08T05:30:00Z');
    expect(await errorOf(recordBake(plater, input(lot.id, '2026-03-08T00:30', '2026-03-08T02:30'), LATER))).toBe(
      'BAD_INPUT: Bake start 2026-03-08T02:30 does not exist in America/New_York: the clocks went forward then. Enter the time as the clock showed it.',
    );
  });

  it('a cool or short bake fails with each reason, and the order stays unbaked', async () => {
    const plater = await actorFor(db, PLATER);
    const lot = await bakeLot('2026-06-10T14:00:00Z');
    const r = await recordBake(plater, input(lot.id, '2026-06-10T10:00', '2026-06-10T11:00', 'America/New_York', { tempMinC: 180, tempMaxC: 200, durationH: 10 }), LATER);
    expect(r.messages).toEqual(['Temperature fell 10 °C below 190 °C.', 'Bake was 2 h short of 12 h.']);
    expect(await errorOf(toBaked(lot.id, plater.id))).toMatch(/^CONFLICT: The bake record fails: Temperature fell 10 °C below 190 °C\. Bake was 2 h short of 12 h\./);
  });

  it('refuses a bake for an order that needs none, and "baked" without any record', async () => {
    const plater = await actorFor(db, PLATER);
    const plain = await createLot(db, { bake: false });
    expect(await errorOf(recordBake(plater, input(plain.id, '2026-06-10T10:00', '2026-06-10T11:00'), LATER))).toBe(
      'CONFLICT: This order does not require an embrittlement-relief bake.',
    );
    const lot = await bakeLot('2026-06-10T14:00:00Z');
    expect(await errorOf(toBaked(lot.id, plater.id))).toBe('CONFLICT: The embrittlement-relief bake has not been recorded.');
  });
});

describe('the bake-window alert job', () => {
  it('e-mails the supervisors once when the window is about to close, however often it runs', async () => {
    const now = new Date();
    const closing = await createLot(db, { bake: true, platingEnd: new Date(now.getTime() - 3.5 * 3_600_000) });
    const early = await createLot(db, { bake: true, platingEnd: new Date(now.getTime() - 1 * 3_600_000) });
    const sent: { to: string; subject: string; text: string }[] = [];
    const send = async (m: { to: string; subject: string; text: string }) => {
      sent.push(m);
      return { messageId: 'test', ok: true };
    };
    const first = await alertClosingBakeWindows({ now, send });
    expect(first.alerted).toContain(closing.id);
    expect(first.alerted).not.toContain(early.id);
    const mine = sent.filter((m) => m.subject.endsWith(closing.number));
    // One message, addressed to every active supervisor.
    expect(mine).toHaveLength(1);
    expect(mine[0]!.to.split(', ')).toContain(SUPERVISOR);
    expect(mine[0]!.subject).toBe(`Bake window closes in 30 min: ${closing.number}`);
    expect(mine[0]!.text).toContain('/quality/orders/');
    expect(mine[0]!.text).toContain("customer's specification");
    const again = await alertClosingBakeWindows({ now: new Date(now.getTime() + 10 * 60_000), send });
    expect(again.alerted).not.toContain(closing.id);
    expect(sent.filter((m) => m.subject.endsWith(closing.number))).toHaveLength(mine.length);
  });

  it('leaves an order whose e-mail failed for the next run', async () => {
    const now = new Date();
    const closing = await createLot(db, { bake: true, platingEnd: new Date(now.getTime() - 3.5 * 3_600_000) });
    const failed = await alertClosingBakeWindows({ now, send: async () => ({ messageId: null, ok: false }) });
    expect(failed.alerted).not.toContain(closing.id);
    expect(await db.selectFrom('bake_window_alerts').select('work_order_id').where('work_order_id', '=', closing.id).execute()).toEqual([]);
    const sent: string[] = [];
    const next = await alertClosingBakeWindows({ now, send: async (m) => (sent.push(m.subject), { messageId: 'test', ok: true }) });
    expect(next.alerted).toContain(closing.id);
    expect(sent.filter((s) => s.endsWith(closing.number))).toHaveLength(1);
  });
});
