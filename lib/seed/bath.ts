// Demo bath control: analytes for the demo tanks from their templates, about four months of
// invented daily history (alkaline zinc's zinc drifting out of control), meter readings, additive
// additions, two limit changes, one corrected entry and a few alerts. Analytes are upserted every
// run; the history is written only when no seeded history exists yet.
import type { Insertable, Kysely } from 'kysely';
import type { AnalysesTable, Database } from '@/db/types';
import { raiseAlert } from '@/lib/bath/alerts';
import { limitsOf, setupTankAnalytes, supplyOf } from '@/lib/bath/analytes';
import { evaluateValue } from '@/lib/bath/evaluate';
import { rulesAtLast } from '@/lib/bath/run-rules';
import { DEMO_TANKS } from './core-records';
import { EN_TEMPLATES } from '@/lib/families/electroless-nickel/bath';
import { analyteHistory, DRIFT, EXCURSION, hashSeed, HISTORY_DAYS, meterHistory, MISTYPED, readingOffsetMinutes } from './bath-history';

const EN_TEMPLATE_IDS = new Set(EN_TEMPLATES.map((t) => t.id));
import { seedBathExtras } from './bath-extras';

const DAY_MS = 86_400_000;

type Db = Kysely<Database>;
type AnalysisRow = Insertable<AnalysesTable>;

export async function seedBath(db: Db): Promise<void> {
  const codes = DEMO_TANKS.map((t) => t.code);
  const tanks = await db.selectFrom('tanks').selectAll().where('code', 'in', codes).execute();
  for (const t of tanks) await setupTankAnalytes(t.id, db);
  const seeded = await db.selectFrom('analyses').select('id').where('source', '=', 'seed').limit(1).executeTakeFirst();
  if (seeded) return;

  const users = await db.selectFrom('users').select(['id', 'role']).where('role', 'in', ['plater', 'supervisor']).where('is_active', '=', true).execute();
  const plater = users.find((u) => u.role === 'plater')?.id;
  const supervisor = users.find((u) => u.role === 'supervisor')?.id;
  if (!plater || !supervisor) return;
  // The last day's readings were taken an hour ago; day d is (HISTORY_DAYS − 1 − d) days before.
  const last = Math.floor((Date.now() - 3600_000) / 60_000) * 60_000;
  const at = (day: number, minutes = 0) => new Date(last - (HISTORY_DAYS - 1 - day) * DAY_MS + minutes * 60_000);

  // Specification limits added by the supervisor early on (kept in the limit history).
  await addSpecLimits(db, tanks, supervisor, at(10));

  const analytes = await db.selectFrom('tank_analytes').selectAll().where('tank_id', 'in', tanks.map((t) => t.id)).execute();
  const rows: AnalysisRow[] = [];
  const lastIds = new Map<string, { key: string; rules: string[]; verdict: string }>();
  for (const a of analytes) {
    const tank = tanks.find((t) => t.id === a.tank_id)!;
    const history = analyteHistory(tank.code, {
      key: a.key, unit: a.unit, methodId: a.method_id, target: a.target,
      lowerControl: a.lower_control, upperControl: a.upper_control, frequencyHours: a.frequency_hours,
    });
    const values: number[] = [];
    history.forEach((p, i) => {
      const subject = { key: a.key, name: a.name, unit: a.unit, methodId: a.method_id, limits: { ...limitsOf(a), target: a.target }, supply: supplyOf(a) };
      const judged = evaluateValue(subject, tank.volume_l, p.value);
      if (!judged.ok) return;
      values.push(p.value);
      const rules = rulesAtLast(values);
      const key = `seed:${tank.code}:${a.key}:${p.day}`;
      rows.push({
        tank_id: tank.id, analyte_id: a.id, method_id: a.method_id, inputs: JSON.stringify(p.inputs), value: p.value, unit: a.unit,
        verdict: judged.verdict.status, severity: judged.verdict.severity, rules,
        recommendation: judged.recommendation.kind === 'none' ? null : JSON.stringify(judged.recommendation),
        source: 'seed', taken_at: at(p.day, -readingOffsetMinutes(tank.code, a.key, p.day)), logged_by: plater, idempotency_key: key,
      });
      if (i === history.length - 1) lastIds.set(a.id, { key, rules, verdict: judged.verdict.status });
    });
  }
  for (let i = 0; i < rows.length; i += 500) await db.insertInto('analyses').values(rows.slice(i, i + 500)).execute();

  await seedMeterAndAdditives(db, tanks, analytes, plater, at);
  await seedNickelReplenishment(db, tanks, analytes, plater, at);
  await seedBathExtras(db, { tanks, analytes, plater, supervisor, at, mistyped: MISTYPED, excursion: EXCURSION });

  // The drifting analyte's last reading raises its alerts, as logging it would have.
  const zincTank = tanks.find((t) => t.code === DRIFT.tankCode);
  const zinc = analytes.find((a) => a.tank_id === zincTank?.id && a.key === DRIFT.key);
  const lastZinc = zinc && lastIds.get(zinc.id);
  if (zincTank && zinc && lastZinc) {
    const analysis = await db.selectFrom('analyses').select(['id', 'value']).where('idempotency_key', '=', lastZinc.key).executeTakeFirstOrThrow();
    const where = `${zincTank.code} ${zincTank.name}, ${zinc.name}`;
    if (lastZinc.verdict === 'out_of_range') {
      await raiseAlert(db, {
        tankId: zincTank.id, analyteId: zinc.id, analysisId: analysis.id, kind: 'out_of_limits', dedupeKey: `out_of_limits:${zinc.id}`,
        message: `${where}: ${Number(Number(analysis.value).toPrecision(4))} ${zinc.unit} is above the upper control limit (${zinc.upper_control} ${zinc.unit}).`,
      });
    }
    await raiseAlert(db, {
      tankId: zincTank.id, analyteId: zinc.id, analysisId: analysis.id, kind: 'run_rule', dedupeKey: `run_rule:${zinc.id}`,
      message: `${where}: a run of readings above the centre line and rising over the last 30 analyses.`,
      detail: { rules: lastZinc.rules },
    });
  }
}

async function addSpecLimits(db: Db, tanks: { id: string; code: string }[], supervisor: string, when: Date): Promise<void> {
  const specs = [
    { code: 'Z-ZN1', key: 'zinc', lower: 5, upper: 10.5, reason: "Specification limits from the zinc supplier's data sheet." },
    { code: 'N-NI1', key: 'nickel', lower: 45, upper: 110, reason: "Specification limits from the nickel supplier's data sheet." },
  ];
  for (const s of specs) {
    const tank = tanks.find((t) => t.code === s.code);
    if (!tank) continue;
    const a = await db.selectFrom('tank_analytes').selectAll().where('tank_id', '=', tank.id).where('key', '=', s.key).executeTakeFirst();
    if (!a) continue;
    const snap = (lower: number | null, upper: number | null) =>
      JSON.stringify({ target: a.target, lower_control: a.lower_control, upper_control: a.upper_control, lower_spec: lower, upper_spec: upper, frequency_hours: a.frequency_hours });
    await db.updateTable('tank_analytes').set({ lower_spec: s.lower, upper_spec: s.upper, updated_at: when }).where('id', '=', a.id).execute();
    await db
      .insertInto('analyte_limit_changes')
      .values({ analyte_id: a.id, changed_by: supervisor, reason: s.reason, before: snap(a.lower_spec, a.upper_spec), after: snap(s.lower, s.upper), created_at: when })
      .execute();
  }
}

type SeedTank = { id: string; code: string; rectifier_max_a: number | null; has_ah_meter: boolean };
type SeedAnalyteRow = { id: string; tank_id: string; additive_rate_ml_per_kah: number | null; supply: unknown; name: string };

async function seedMeterAndAdditives(db: Db, tanks: SeedTank[], analytes: SeedAnalyteRow[], plater: string, at: (day: number, minutes?: number) => Date): Promise<void> {
  for (const t of tanks) {
    if (!t.has_ah_meter || !t.rectifier_max_a) continue;
    const meter = meterHistory(t.code, t.rectifier_max_a);
    await db
      .insertInto('meter_readings')
      .values(meter.map((m) => ({ tank_id: t.id, amp_hours: m.ampHours, read_at: at(m.day, -30), read_by: plater, idempotency_key: `seed:${t.code}:meter:${m.day}` })))
      .execute();
    const additives = analytes.filter((a) => a.tank_id === t.id && a.additive_rate_ml_per_kah);
    for (const a of additives) {
      const supply = supplyOf({ supply: a.supply });
      const material = supply && 'name' in supply ? supply.name : a.name;
      const rows = [];
      // Dosed every second day from the amp-hours since the last dose; the last dose two days ago.
      for (let day = 2; day < HISTORY_DAYS - 2; day += 2) {
        const kAh = ((meter[day]?.ampHours ?? 0) - (meter[day - 2]?.ampHours ?? 0)) / 1000;
        const litres = Number(((kAh * (a.additive_rate_ml_per_kah as number)) / 1000).toFixed(2));
        if (litres <= 0) continue;
        rows.push({
          tank_id: t.id, analyte_id: a.id, kind: 'amp_hours' as const, material, amount: litres, unit: 'L' as const,
          recommended_amount: litres, recommended_unit: 'L' as const, reason: 'Amp-hour replenishment',
          made_at: at(day, -20), made_by: plater, idempotency_key: `seed:${t.code}:${a.id.slice(0, 8)}:add:${day}`,
        });
      }
      if (rows.length) await db.insertInto('additions').values(rows).execute();
    }
  }
}

/**
 * The electroless bath's nickel put back since its make-up: nickel sulfate on each working day, so
 * its age reads a few metal turnovers (the amounts are invented; about 1.2 kg a day).
 */
async function seedNickelReplenishment(
  db: Db,
  tanks: { id: string; code: string; template_id: string; made_up_at: Date | null }[],
  analytes: { id: string; tank_id: string; key: string }[],
  plater: string,
  at: (day: number, minutes?: number) => Date,
): Promise<void> {
  for (const t of tanks) {
    const nickel = analytes.find((a) => a.tank_id === t.id && a.key === 'nickel');
    if (!t.made_up_at || !nickel || !EN_TEMPLATE_IDS.has(t.template_id)) continue;
    const sinceDays = Math.floor((Date.now() - t.made_up_at.getTime()) / DAY_MS);
    const rows = [];
    for (let back = sinceDays - 1; back >= 1; back--) {
      const day = HISTORY_DAYS - 1 - back;
      if (day % 7 === 5 || day % 7 === 6) continue; // no additions at the weekend
      const kg = Number((1.1 + (hashSeed(`${t.code}:ni:${day}`) % 30) / 100).toFixed(2));
      rows.push({
        tank_id: t.id, analyte_id: nickel.id, kind: 'correction' as const, material: 'Nickel sulfate hexahydrate', amount: kg, unit: 'kg' as const,
        recommended_amount: kg, recommended_unit: 'kg' as const, reason: 'Nickel replenishment after the shift analysis',
        made_at: at(day, -readingOffsetMinutes(t.code, 'nickel', day) + 20), made_by: plater, idempotency_key: `seed:${t.code}:ni-add:${day}`,
      });
    }
    if (rows.length) await db.insertInto('additions').values(rows).execute();
  }
}
