import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { assertBathPermission, type BathActor } from './access';

// Shop settings for bath alerts, kept in the settings table under one key. The defaults are our
// choice (common practice): escalate after 4 h unacknowledged, expect a recommended addition
// within 2 h, and call an analysis overdue 1 h after its interval has run out.
export const BATH_SETTINGS_KEY = 'bath.alerts';

export type BathSettings = { escalateAfterHours: number; additionGraceHours: number; overdueGraceHours: number };

export const BATH_SETTINGS_DEFAULTS: BathSettings = { escalateAfterHours: 4, additionGraceHours: 2, overdueGraceHours: 1 };

function hours(v: unknown, fallback: number): number {
  return typeof v === 'number' && Number.isFinite(v) && v > 0 && v <= 24 * 30 ? v : fallback;
}

export async function getBathSettings(executor: Kysely<Database> = defaultDb): Promise<BathSettings> {
  const row = await executor.selectFrom('settings').select('value').where('key', '=', BATH_SETTINGS_KEY).executeTakeFirst();
  const v = (row?.value ?? {}) as Partial<Record<keyof BathSettings, unknown>>;
  return {
    escalateAfterHours: hours(v.escalateAfterHours, BATH_SETTINGS_DEFAULTS.escalateAfterHours),
    additionGraceHours: hours(v.additionGraceHours, BATH_SETTINGS_DEFAULTS.additionGraceHours),
    overdueGraceHours: hours(v.overdueGraceHours, BATH_SETTINGS_DEFAULTS.overdueGraceHours),
  };
}

export async function updateBathSettings(actor: BathActor, next: BathSettings, executor: Kysely<Database> = defaultDb): Promise<void> {
  assertBathPermission(actor, 'settings.manage');
  const checked: BathSettings = {
    escalateAfterHours: hours(next.escalateAfterHours, Number.NaN),
    additionGraceHours: hours(next.additionGraceHours, Number.NaN),
    overdueGraceHours: hours(next.overdueGraceHours, Number.NaN),
  };
  const bad = (Object.keys(checked) as (keyof BathSettings)[]).filter((k) => Number.isNaN(checked[k]));
  if (bad.length) throw new AppError('BAD_INPUT', 'Check the highlighted fields.', Object.fromEntries(bad.map((k) => [k, ['Give hours, more than 0 and at most 720.']])));
  await executor
    .insertInto('settings')
    .values({ key: BATH_SETTINGS_KEY, value: JSON.stringify(checked) })
    .onConflict((oc) => oc.column('key').doUpdateSet({ value: JSON.stringify(checked), updated_at: sql`now()` }))
    .execute();
  await executor.insertInto('audit_log').values({ actor_id: actor.id, action: 'bath_settings.update', entity: 'settings', entity_id: BATH_SETTINGS_KEY, detail: JSON.stringify(checked) }).execute();
}
