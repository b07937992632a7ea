// The test mail fake (port 2526) receives what this file sends; set before the mailer first connects.
process.env.SMTP_PORT = process.env.SMTP_PORT ?? '2526';

import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { notifyAlert } from '@/lib/bath/alert-mail';
import { acknowledgeAlert } from '@/lib/bath/alerts';
import { logAnalysis } from '@/lib/bath/log-analysis';
import { recordAddition } from '@/lib/bath/record';
import { checkMissingAdditions, checkOverdueAnalyses, escalateUnacknowledged } from '@/lib/bath/scheduled-checks';
import { BATH_SETTINGS_DEFAULTS, BATH_SETTINGS_KEY, getBathSettings, updateBathSettings } from '@/lib/bath/settings';
import { messagesTo } from '../../helpers/mailbox';
import { actor, codeOf, key, makeTank, removeTank, type TestTank } from './fixtures';

let tank: TestTank;
let plater: Awaited<ReturnType<typeof actor>>;
let supervisor: Awaited<ReturnType<typeof actor>>;

beforeAll(async () => {
  tank = await makeTank('watts-nickel', 2000);
  [plater, supervisor] = await Promise.all([actor('plater'), actor('supervisor')]);
});
afterAll(async () => {
  await removeTank(tank);
  await db.destroy();
});

const HOUR = 3600_000;
const mine = (kind: string) =>
  db.selectFrom('bath_alerts').selectAll().where('tank_id', '=', tank.id).where('kind', '=', kind as never).orderBy('raised_at').execute();
const emailsFor = (alertId: string) => db.selectFrom('bath_alert_emails').selectAll().where('alert_id', '=', alertId).execute();

async function lowNickel(hoursAgo = 0) {
  return logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.nickel!.id, inputs: { buretteMl: 15 }, takenAt: new Date(Date.now() - hoursAgo * HOUR), source: 'floor' });
}

describe('alerts', () => {
  it('e-mails the supervisor once per raised alert, however often it is asked to', async () => {
    const r = await lowNickel();
    const id = r.newAlertIds[0]!;
    const first = await notifyAlert(id, 'raised');
    const second = await notifyAlert(id, 'raised');
    expect(second).toBe(0);
    const rows = (await emailsFor(id)).filter((e) => e.recipient === supervisor.email);
    expect(rows).toEqual([expect.objectContaining({ kind: 'raised', status: 'sent' })]);
    expect(first).toBe((await emailsFor(id)).filter((e) => e.status === 'sent').length);
    // The test mail fake received it exactly once.
    const inbox = await messagesTo(supervisor.email);
    expect(inbox.filter((m) => m.subject.includes(tank.code))).toHaveLength(1);
  });

  it('a supervisor acknowledges with the corrective action; a plater may not; twice is refused', async () => {
    const [alert] = await mine('out_of_limits');
    expect(await codeOf(acknowledgeAlert(plater, { alertId: alert!.id, correctiveAction: 'Added salt' }))).toMatch(/^FORBIDDEN/);
    expect(await codeOf(acknowledgeAlert(supervisor, { alertId: alert!.id, correctiveAction: '  ' }))).toMatch(/^BAD_INPUT/);
    await acknowledgeAlert(supervisor, { alertId: alert!.id, correctiveAction: 'Added 280 kg nickel sulfate; re-analysed in range.' });
    const after = await db.selectFrom('bath_alerts').selectAll().where('id', '=', alert!.id).executeTakeFirstOrThrow();
    expect(after).toMatchObject({ state: 'acknowledged', acknowledged_by: supervisor.id, corrective_action: 'Added 280 kg nickel sulfate; re-analysed in range.' });
    expect(await codeOf(acknowledgeAlert(supervisor, { alertId: alert!.id, correctiveAction: 'Again' }))).toMatch(/^CONFLICT/);
    // The same condition after acknowledgement is a new alert.
    const again = await lowNickel();
    expect(again.newAlertIds).toHaveLength(1);
    expect(await mine('out_of_limits')).toHaveLength(2);
  });

  it('an alert left unacknowledged past the set time escalates to the owner, once', async () => {
    const open = (await mine('out_of_limits')).find((a) => a.state === 'open')!;
    await db.updateTable('bath_alerts').set({ raised_at: new Date(Date.now() - 5 * HOUR) }).where('id', '=', open.id).execute();
    const first = await escalateUnacknowledged(new Date());
    expect(first.escalated).toBeGreaterThanOrEqual(1);
    const row = await db.selectFrom('bath_alerts').select(['state', 'escalated_at']).where('id', '=', open.id).executeTakeFirstOrThrow();
    expect(row.state).toBe('escalated');
    const owner = await actor('owner');
    await escalateUnacknowledged(new Date());
    const ownerMails = (await emailsFor(open.id)).filter((e) => e.kind === 'escalated' && e.recipient === owner.email);
    expect(ownerMails).toHaveLength(1);
    // Not yet due: an alert raised an hour ago stays open.
    const fresh = await db.selectFrom('bath_alerts').select('id').where('tank_id', '=', tank.id).where('state', '=', 'open').execute();
    for (const f of fresh) await db.updateTable('bath_alerts').set({ raised_at: new Date(Date.now() - HOUR) }).where('id', '=', f.id).execute();
    await escalateUnacknowledged(new Date());
    expect((await db.selectFrom('bath_alerts').select('state').where('id', 'in', fresh.length ? fresh.map((f) => f.id) : ['00000000-0000-4000-8000-000000000000']).execute()).every((a) => a.state === 'open')).toBe(true);
  });

  it('an analysis past its frequency is overdue: raised once per lapse, not again after acknowledgement', async () => {
    const ph = tank.analytes.ph!.id; // every 8 h
    await db.updateTable('tank_analytes').set({ created_at: new Date(Date.now() - 30 * HOUR) }).where('tank_id', '=', tank.id).execute();
    await checkOverdueAnalyses(new Date());
    const overdue = await mine('overdue');
    expect(overdue.map((a) => a.analyte_id)).toContain(ph);
    // Nickel was analysed just now: not overdue.
    expect(overdue.map((a) => a.analyte_id)).not.toContain(tank.analytes.nickel!.id);
    await checkOverdueAnalyses(new Date());
    expect(await mine('overdue')).toHaveLength(overdue.length);
    const phAlert = overdue.find((a) => a.analyte_id === ph)!;
    await acknowledgeAlert(supervisor, { alertId: phAlert.id, correctiveAction: 'pH meter was out for calibration; analysed now.' });
    await checkOverdueAnalyses(new Date());
    expect((await mine('overdue')).filter((a) => a.analyte_id === ph)).toHaveLength(1);
  });

  it('a recommended correction not recorded in time raises an alert; one recorded does not', async () => {
    // Nickel low 3 h ago with no addition since; boric acid low 3 h ago with its addition recorded.
    await db.updateTable('analyses').set({ taken_at: sql<Date>`taken_at - interval '3 hours'` }).where('tank_id', '=', tank.id).where('analyte_id', '=', tank.analytes.nickel!.id).execute();
    const boric = await logAnalysis(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.boricAcid!.id, inputs: { buretteMl: 20 }, takenAt: new Date(Date.now() - 3 * HOUR), source: 'floor' });
    expect(boric.recommendation).toMatchObject({ kind: 'add', material: 'Boric acid' });
    await recordAddition(plater, { key: key(), tankId: tank.id, analyteId: tank.analytes.boricAcid!.id, analysisId: boric.analysis.id, kind: 'correction', material: 'Boric acid', amount: 40, unit: 'kg', madeAt: new Date(Date.now() - 2.5 * HOUR) });
    await checkMissingAdditions(new Date());
    const missing = await mine('addition_missing');
    expect(missing.map((a) => a.analyte_id)).toEqual([tank.analytes.nickel!.id]);
    await checkMissingAdditions(new Date());
    expect(await mine('addition_missing')).toHaveLength(1);
  });

  it('the owner sets the escalation time; a supervisor may not; a bad value is refused', async () => {
    const owner = await actor('owner');
    const before = await getBathSettings();
    const stored = await db.selectFrom('settings').select('value').where('key', '=', BATH_SETTINGS_KEY).executeTakeFirst();
    try {
      expect(await codeOf(updateBathSettings(supervisor, { ...before, escalateAfterHours: 1 }))).toMatch(/^FORBIDDEN/);
      expect(await codeOf(updateBathSettings(owner, { ...before, escalateAfterHours: 0 }))).toMatch(/^BAD_INPUT/);
      await updateBathSettings(owner, { ...before, escalateAfterHours: 6 });
      expect((await getBathSettings()).escalateAfterHours).toBe(6);
    } finally {
      // Put back what was there (nothing, in a fresh test database).
      await db.deleteFrom('settings').where('key', '=', BATH_SETTINGS_KEY).execute();
      if (stored) await db.insertInto('settings').values({ key: BATH_SETTINGS_KEY, value: JSON.stringify(stored.value) }).execute();
    }
    if (!stored) expect(await getBathSettings()).toEqual(BATH_SETTINGS_DEFAULTS);
  });
});
