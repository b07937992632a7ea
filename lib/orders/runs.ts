import 'server-only';
import { type Kysely, type Transaction, sql } from 'kysely';
import { z } from 'zod';
import { db as defaultDb } from '@/db';
import type { Database } from '@/db/types';
import { AppError } from '@/lib/errors';
import { PlatingInputError, toStorage, unitsOf, type UnitOf } from '@/lib/plating';
import { assertCan, type Actor } from '@/lib/quotes/access';
import { familyOfTemplate, familyParams, getFamily } from '@/lib/families';
import { loadFamilyData } from '@/lib/families/shop-data';
import type { FamilyRunPrediction } from '@/lib/families/types';
import { runAmpHours, runMinutes, type RunCharge } from './run-math';
import { changeWorkOrderState } from './states';

type Db = Kysely<Database>;

/**
 * The tank's analytes whose latest current analysis before `at` was outside a specification
 * limit (severity 3), as "Zinc metal 41.09 g/L": a run made then needs a supervisor's disposition.
 */
export async function bathOutsideSpecification(trx: Transaction<Database> | Db, tankId: string, at: Date): Promise<string[]> {
  const r = await sql<{ name: string; value: number; unit: string }>`
    select ta.name, a.value, a.unit
    from tank_analytes ta
    join lateral (
      select x.value, x.unit, x.severity from analyses x
      where x.analyte_id = ta.id and x.taken_at <= ${at}
        and not exists (select 1 from analyses c where c.supersedes_id = x.id)
      order by x.taken_at desc limit 1
    ) a on true
    where ta.tank_id = ${tankId} and ta.is_active and a.severity >= 3
    order by ta.sort_order, ta.name`.execute(trx);
  return r.rows.map((row) => `${row.name} ${Number(Number(row.value).toPrecision(4))} ${row.unit}`);
}

const decimal = (label: string) =>
  z.preprocess((v) => (v === '' || v === undefined ? undefined : typeof v === 'string' ? v.replace(',', '.') : v), z.coerce.number({ error: `Enter ${label}.` }).finite(`Enter ${label}.`).optional());
const whole = (label: string) => z.coerce.number({ error: `Enter ${label}.` }).int(`Enter a whole number of ${label}.`).min(1, 'Enter at least 1.');

export const runSchema = z
  .object({
    workOrderId: z.uuid(),
    tankId: z.uuid({ error: 'Choose the tank.' }),
    // 'time': a run without current (electroless nickel, passivation), recorded by time and bath conditions.
    mode: z.enum(['amps', 'meter', 'time'], { error: 'Choose how the current was measured.' }),
    currentA: decimal('the rectifier current'),
    meterStartAh: decimal('the meter reading at the start'),
    meterStopAh: decimal('the meter reading at the end'),
    minutesPerLoad: decimal('the minutes per load'),
    temperature: decimal('the bath temperature'),
    temperatureUnit: z.enum(unitsOf('temperature') as [UnitOf<'temperature'>, ...UnitOf<'temperature'>[]]).optional(),
    concentration: decimal('the acid concentration'),
    loads: whole('loads').max(1000),
    partsPerLoad: whole('parts per load').max(1_000_000),
    idempotencyKey: z.string().regex(/^[A-Za-z0-9-]{16,64}$/, 'The form is out of date; reload the page.'),
    confirmBelowMinimum: z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean()),
  })
  .superRefine((v, ctx) => {
    if (v.minutesPerLoad === undefined) ctx.addIssue({ code: 'custom', path: ['minutesPerLoad'], message: 'Enter the minutes per load.' });
    if (v.mode === 'amps' && v.currentA === undefined) ctx.addIssue({ code: 'custom', path: ['currentA'], message: 'Enter the rectifier current.' });
    if (v.mode === 'meter' && v.meterStartAh === undefined) ctx.addIssue({ code: 'custom', path: ['meterStartAh'], message: 'Enter the meter reading at the start.' });
    if (v.mode === 'meter' && v.meterStopAh === undefined) ctx.addIssue({ code: 'custom', path: ['meterStopAh'], message: 'Enter the meter reading at the end.' });
  });
export type RunInput = z.infer<typeof runSchema>;

export function chargeOf(input: RunInput): RunCharge {
  return input.mode === 'meter'
    ? { mode: 'meter', meterStartAh: input.meterStartAh ?? Number.NaN, meterStopAh: input.meterStopAh ?? Number.NaN, minutesPerLoad: input.minutesPerLoad ?? Number.NaN, loads: input.loads }
    : { mode: 'amps', currentA: input.currentA ?? Number.NaN, minutesPerLoad: input.minutesPerLoad ?? Number.NaN, loads: input.loads };
}

export const BELOW_MINIMUM_MESSAGE = 'The predicted thickness is below the specification minimum. Check the current and time, or tick "Save anyway" to record the run as it was.';

/** `bathOutside`: the analytes outside specification when the run was made (a nonconformance is then open). */
export type LoggedRun = { id: string; duplicate: boolean; prediction: FamilyRunPrediction | null; nonconformanceId: string | null; bathOutside: string[] };

/** The bath conditions the run's family records, in storage units. */
function conditionsOf(input: RunInput, wanted: readonly ('temperatureC' | 'concentration')[]): { temperatureC?: number; concentration?: number } {
  const out: { temperatureC?: number; concentration?: number } = {};
  if (wanted.includes('temperatureC') && input.temperature !== undefined) out.temperatureC = toStorage(input.temperature, input.temperatureUnit ?? 'degC');
  if (wanted.includes('concentration') && input.concentration !== undefined) out.concentration = input.concentration;
  return out;
}

/**
 * Records a run. A retried submission with the same idempotency key stores nothing new and answers
 * with the first run. The first run of a received order moves it to "in process". The finish's
 * family says what a run is: charge (plating, anodizing) or time and bath conditions (electroless,
 * passivation); a passivation run outside its window is recorded as it was and opens a
 * nonconformance, so the lot cannot be certified until quality disposes of it.
 */
export async function logPlatingRun(actor: Actor, input: RunInput, conn: Db = defaultDb, now: Date = new Date()): Promise<LoggedRun> {
  assertCan(actor, 'runs.log');
  const existing = await conn.selectFrom('plating_runs').select(['id', 'work_order_id']).where('idempotency_key', '=', input.idempotencyKey).executeTakeFirst();
  if (existing) {
    if (existing.work_order_id !== input.workOrderId) throw new AppError('CONFLICT', 'This form was already used for another order; reload the page.');
    return { id: existing.id, duplicate: true, prediction: null, nonconformanceId: null, bathOutside: [] };
  }
  return conn.transaction().execute(async (trx) => {
    const wo = await trx
      .selectFrom('work_orders as w')
      .innerJoin('parts as p', 'p.id', 'w.part_id')
      .innerJoin('finishes as f', 'f.id', 'w.finish_id')
      .select(['w.id', 'w.state', 'p.area_dm2', 'f.family', 'f.family_params', 'f.element', 'f.ion_charge', 'f.distribution_ratio', 'f.min_thickness_um'])
      .where('w.id', '=', input.workOrderId)
      .forUpdate('w')
      .executeTakeFirst();
    if (!wo) throw new AppError('NOT_FOUND', 'That work order does not exist.');
    if (wo.state !== 'received' && wo.state !== 'in_process') {
      throw new AppError('CONFLICT', wo.state === 'accepted' ? 'Receive the parts before logging a plating run.' : 'Plating is finished on this order; runs can no longer be added.');
    }
    const family = getFamily(wo.family);
    const params = familyParams(family.id, wo.family_params);
    const tank = await trx
      .selectFrom('tanks')
      .select(['id', 'code', 'template_id', 'element', 'ion_charge', 'efficiency', 'rectifier_max_a', 'is_active', 'family_settings'])
      .where('id', '=', input.tankId)
      .executeTakeFirst();
    const serves =
      tank &&
      tank.is_active &&
      familyOfTemplate(tank.template_id) === family.id &&
      family.tankServes({ templateId: tank.template_id, element: tank.element, ionCharge: tank.ion_charge }, { element: wo.element, ionCharge: wo.ion_charge, params }) &&
      (!family.usesEfficiency || tank.efficiency !== null);
    if (!tank || !serves) {
      throw new AppError('BAD_INPUT', 'Choose an active tank that runs this finish.', { tankId: ['Choose an active tank that runs this finish.'] });
    }
    if ((input.mode === 'time') === family.runsWithCurrent) {
      const message = family.runsWithCurrent ? 'Enter the rectifier current or the amp-hour meter readings.' : `${family.label} runs without current: enter the time and the bath conditions.`;
      throw new AppError('BAD_INPUT', message, { mode: [message] });
    }
    if (input.mode === 'amps' && tank.rectifier_max_a !== null && (input.currentA ?? 0) > tank.rectifier_max_a) {
      throw new AppError('BAD_INPUT', `The rectifier on ${tank.code} gives at most ${tank.rectifier_max_a} A.`, { currentA: [`At most ${tank.rectifier_max_a} A on ${tank.code}.`] });
    }
    let ampHours: number | null;
    let prediction: FamilyRunPrediction;
    const conditions = conditionsOf(input, family.runConditions);
    const familyData = await loadFamilyData(trx, family.id);
    try {
      ampHours = family.runsWithCurrent ? runAmpHours(chargeOf(input)) : null;
      if (ampHours === null) runMinutes(input.minutesPerLoad ?? Number.NaN);
      prediction = family.predictRun(
        {
          ampHours, minutesPerLoad: input.minutesPerLoad ?? Number.NaN, loads: input.loads, partsPerLoad: input.partsPerLoad, areaPerPartDm2: wo.area_dm2,
          finish: { element: wo.element, ionCharge: wo.ion_charge, distributionRatio: wo.distribution_ratio, minThicknessUm: wo.min_thickness_um },
          tank: { efficiency: tank.efficiency, settings: tank.family_settings }, conditions, familyData,
        },
        params,
      );
    } catch (err) {
      if (err instanceof PlatingInputError) throw new AppError('BAD_INPUT', err.message, { [err.field]: [err.message] });
      throw err;
    }
    if (prediction.isBelowMinimum && !input.confirmBelowMinimum) throw new AppError('CONFLICT', BELOW_MINIMUM_MESSAGE, { confirmBelowMinimum: [BELOW_MINIMUM_MESSAGE] });
    const minutes = (input.minutesPerLoad ?? 0) * input.loads;
    const inserted = await trx
      .insertInto('plating_runs')
      .values({
        work_order_id: wo.id,
        tank_id: tank.id,
        started_at: new Date(now.getTime() - minutes * 60_000),
        ended_at: now,
        current_a: input.mode === 'amps' ? (input.currentA ?? null) : null,
        meter_start_ah: input.mode === 'meter' ? (input.meterStartAh ?? null) : null,
        meter_stop_ah: input.mode === 'meter' ? (input.meterStopAh ?? null) : null,
        amp_hours: ampHours,
        conditions: JSON.stringify(conditions),
        loads: input.loads,
        parts_per_load: input.partsPerLoad,
        predicted_thickness_um: prediction.averageThicknessUm,
        is_below_minimum: prediction.isBelowMinimum,
        is_outside_window: prediction.outsideWindow.length > 0,
        logged_by: actor.id,
        idempotency_key: input.idempotencyKey,
      })
      .onConflict((oc) => oc.column('idempotency_key').doNothing())
      .returning('id')
      .executeTakeFirst();
    if (!inserted) {
      // A concurrent retry won the race: answer with its run.
      const first = await trx.selectFrom('plating_runs').select('id').where('idempotency_key', '=', input.idempotencyKey).executeTakeFirstOrThrow();
      return { id: first.id, duplicate: true, prediction, nonconformanceId: null, bathOutside: [] };
    }
    let nonconformanceId: string | null = null;
    if (prediction.outsideWindow.length) {
      const nc = await trx
        .insertInto('nonconformances')
        .values({ work_order_id: wo.id, source: 'other', description: `Run on ${tank.code} outside the process window: ${prediction.outsideWindow.join(' ')}`.slice(0, 2000), opened_by: actor.id })
        .returning('id')
        .executeTakeFirstOrThrow();
      nonconformanceId = nc.id;
    }
    const outside = await bathOutsideSpecification(trx, tank.id, now);
    if (outside.length) {
      const nc = await trx
        .insertInto('nonconformances')
        .values({
          work_order_id: wo.id,
          source: 'bath',
          description: `Run on ${tank.code} while its bath was outside specification limits: ${outside.join(', ')}.`.slice(0, 2000),
          opened_by: actor.id,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      nonconformanceId ??= nc.id;
    }
    if (wo.state === 'received') {
      await changeWorkOrderState(trx, { workOrderId: wo.id, to: 'in_process', actorId: actor.id, note: `First run on ${tank.code}` });
    }
    return { id: inserted.id, duplicate: false, prediction, nonconformanceId, bathOutside: outside };
  });
}
