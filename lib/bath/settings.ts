import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';

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
