// Two small stories in the demo history: a mistyped titration corrected by a new entry (the old
// one stays, struck through), and a past low sulfuric acid reading that raised an alert, got its
// addition and was acknowledged with the corrective action.
import type { Kysely } from 'kysely';
import type { Database, TankAnalyte } from '@/db/types';
import { getMethod } from '@/lib/bath/methods';
import { computeAnalysis } from '@/lib/bath/methods/titration';
import type { EXCURSION, MISTYPED } from './bath-history';

type Context = {
  tanks: { id: string; code: string; name: string }[];
  analytes: TankAnalyte[];
  plater: string;
  supervisor: string;
  at: (day: number, minutes?: number) => Date;
  mistyped: typeof MISTYPED;
  excursion: typeof EXCURSION;
};

function find(ctx: Context, code: string, key: string) {
  const tank = ctx.tanks.find((t) => t.code === code);
  const analyte = tank && ctx.analytes.find((a) => a.tank_id === tank.id && a.key === key);
  return tank && analyte ? { tank, analyte } : null;
}

export async function seedBathExtras(db: Kysely<Database>, ctx: Context): Promise<void> {
  const typo = find(ctx, ctx.mistyped.tankCode, ctx.mistyped.key);
  const method = typo && getMethod(typo.analyte.method_id);
  if (typo && method) {
    const wrong = computeAnalysis(method, { buretteMl: ctx.mistyped.buretteMl });
    const right = await db.selectFrom('analyses').select(['id', 'value', 'inputs']).where('idempotency_key', '=', `seed:${typo.tank.code}:${typo.analyte.key}:${ctx.mistyped.day}`).executeTakeFirst();
    if (wrong.ok && right) {
      // The plater's first entry (a digit dropped), then the correction that supersedes it.
      await db.updateTable('analyses').set({ idempotency_key: `seed:${typo.tank.code}:${typo.analyte.key}:${ctx.mistyped.day}:fixed`, note: 'Corrected: burette reading mistyped' }).where('id', '=', right.id).execute();
      const first = await db
        .insertInto('analyses')
        .values({
          tank_id: typo.tank.id, analyte_id: typo.analyte.id, method_id: typo.analyte.method_id, inputs: JSON.stringify({ buretteMl: ctx.mistyped.buretteMl }),
          value: wrong.value, unit: typo.analyte.unit, verdict: 'out_of_range', severity: 2, source: 'seed', taken_at: ctx.at(ctx.mistyped.day, 5),
          logged_by: ctx.plater, idempotency_key: `seed:${typo.tank.code}:${typo.analyte.key}:${ctx.mistyped.day}:typo`,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      await db.updateTable('analyses').set({ supersedes_id: first.id, taken_at: ctx.at(ctx.mistyped.day, 5) }).where('id', '=', right.id).execute();
    }
  }

  const low = find(ctx, ctx.excursion.tankCode, ctx.excursion.key);
  if (!low) return;
  const analysis = await db.selectFrom('analyses').select(['id', 'value', 'taken_at', 'recommendation']).where('idempotency_key', '=', `seed:${low.tank.code}:${low.analyte.key}:${ctx.excursion.day}`).executeTakeFirst();
  if (!analysis) return;
  const rec = analysis.recommendation as { kind?: string; amount?: number; unit?: 'kg' | 'L'; material?: string } | null;
  if (rec?.kind === 'add' && rec.amount && rec.unit && rec.material) {
    await db
      .insertInto('additions')
      .values({
        tank_id: low.tank.id, analyte_id: low.analyte.id, analysis_id: analysis.id, kind: 'correction', material: rec.material,
        amount: Number(rec.amount.toFixed(1)), unit: rec.unit, recommended_amount: rec.amount, recommended_unit: rec.unit,
        reason: 'Sulfuric acid low', made_at: ctx.at(ctx.excursion.day, 45), made_by: ctx.plater,
        idempotency_key: `seed:${low.tank.code}:${low.analyte.key}:${ctx.excursion.day}:add`,
      })
      .execute();
  }
  await db
    .insertInto('bath_alerts')
    .values({
      tank_id: low.tank.id, analyte_id: low.analyte.id, analysis_id: analysis.id, kind: 'out_of_limits', state: 'acknowledged',
      dedupe_key: `out_of_limits:${low.analyte.id}`,
      message: `${low.tank.code} ${low.tank.name}, ${low.analyte.name}: ${analysis.value.toPrecision(4)} ${low.analyte.unit} is below the lower control limit (${low.analyte.lower_control}).`,
      detail: JSON.stringify({ value: analysis.value }), raised_at: analysis.taken_at, last_seen_at: analysis.taken_at,
      acknowledged_at: ctx.at(ctx.excursion.day, 90), acknowledged_by: ctx.supervisor,
      corrective_action: 'Acid added as the calculator recommended; drag-in from the rinse reduced by a longer drip time. Re-analysed in range next day.',
    })
    .execute();
}
