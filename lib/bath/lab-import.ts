import 'server-only';
import { createHash } from 'node:crypto';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { assertBathPermission, type BathActor } from './access';
import { checkLabCsv, type LabContext, type LabRowError } from './lab-csv';
import { logAnalysis } from './log-analysis';

// Imports an outside laboratory's CSV: every row checked first; then all rows in one transaction,
// each judged and alerted like any analysis. Keys derive from the file's content and row number,
// so uploading the same file again stores nothing twice.

export type LabImportResult =
  | { ok: true; imported: number; alreadyImported: number; newAlertIds: string[] }
  | { ok: false; errors: LabRowError[] };

async function labContext(executor: Kysely<Database>): Promise<LabContext> {
  const rows = await executor
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .select(['t.id as tank_id', 't.code', 'a.id', 'a.key', 'a.unit', 'a.name'])
    .where('a.is_active', '=', true)
    .execute();
  const tanks = new Map<string, { id: string; analytes: Map<string, { id: string; unit: string; name: string }> }>();
  for (const r of rows) {
    const t = tanks.get(r.code) ?? { id: r.tank_id, analytes: new Map() };
    t.analytes.set(r.key, { id: r.id, unit: r.unit, name: r.name });
    tanks.set(r.code, t);
  }
  return { tanks, now: new Date() };
}

export async function importLabCsv(actor: BathActor, text: string, executor: Kysely<Database> = defaultDb): Promise<LabImportResult> {
  assertBathPermission(actor, 'bath.log');
  const check = checkLabCsv(text, await labContext(executor));
  if (!check.ok) return check;
  const fileHash = createHash('sha256').update(text).digest('hex').slice(0, 32);
  return executor.transaction().execute(async (trx) => {
    let imported = 0;
    let alreadyImported = 0;
    const newAlertIds: string[] = [];
    for (const r of check.rows) {
      const logged = await logAnalysis(
        actor,
        { key: `lab:${fileHash}:${r.row}`, tankId: r.tankId, analyteId: r.analyteId, inputs: {}, reportedValue: r.value, takenAt: r.takenAt, source: 'lab', note: 'Outside laboratory' },
        trx,
      );
      if (logged.duplicate) alreadyImported++;
      else imported++;
      newAlertIds.push(...logged.newAlertIds);
    }
    return { ok: true as const, imported, alreadyImported, newAlertIds };
  });
}
