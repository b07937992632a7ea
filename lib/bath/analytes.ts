import 'server-only';
import type { Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, TankAnalyte } from '@/db/types';
import { AppError } from '@/lib/errors';
import { getTemplate } from './templates';
import type { Limits } from './verdict';
import { readSupply, supplyFor, type AnalyteSupply } from './templates/supplies';

// A tank's analytes: copied from its bath template when the tank is set up (or seeded), then the
// tank's own record, with limits a supervisor may change.

/** Adds the template's analytes the tank does not have yet; returns how many were added. */
export async function setupTankAnalytes(tankId: string, executor: Kysely<Database> = defaultDb): Promise<number> {
  const tank = await executor.selectFrom('tanks').select(['id', 'template_id']).where('id', '=', tankId).executeTakeFirst();
  if (!tank) throw new AppError('NOT_FOUND', 'That tank does not exist.');
  const template = getTemplate(tank.template_id);
  if (!template) throw new AppError('BAD_INPUT', `The tank's bath template "${tank.template_id}" is not known.`);
  const rows = template.analytes.map((a, i) => {
    const supply = supplyFor(template.id, a.key);
    return {
      tank_id: tank.id,
      key: a.key,
      name: a.name,
      unit: a.unit,
      method_id: a.methodId,
      target: a.target,
      lower_control: a.lowerControl ?? null,
      upper_control: a.upperControl ?? null,
      lower_spec: a.lowerSpec ?? null,
      upper_spec: a.upperSpec ?? null,
      frequency_hours: a.frequencyHours,
      additive_rate_ml_per_kah: a.additiveRateMlPerKAh ?? null,
      supply: supply ? JSON.stringify(supply) : null,
      basis: `${a.basis}. ${template.note}`.slice(0, 500),
      sort_order: i,
    };
  });
  if (rows.length === 0) return 0;
  const added = await executor
    .insertInto('tank_analytes')
    .values(rows)
    .onConflict((oc) => oc.columns(['tank_id', 'key']).doNothing())
    .returning('id')
    .execute();
  return added.length;
}

export type AnalyteWithTank = TankAnalyte & {
  tank_code: string;
  tank_name: string;
  template_id: string;
  volume_l: number;
  has_ah_meter: boolean;
};

export async function getAnalyteWithTank(
  tankId: string,
  analyteId: string,
  executor: Kysely<Database> = defaultDb,
): Promise<AnalyteWithTank | null> {
  const row = await executor
    .selectFrom('tank_analytes as a')
    .innerJoin('tanks as t', 't.id', 'a.tank_id')
    .selectAll('a')
    .select(['t.code as tank_code', 't.name as tank_name', 't.template_id', 't.volume_l', 't.has_ah_meter'])
    .where('a.id', '=', analyteId)
    .where('a.tank_id', '=', tankId)
    .executeTakeFirst();
  return row ?? null;
}

export function limitsOf(a: Pick<TankAnalyte, 'target' | 'lower_control' | 'upper_control' | 'lower_spec' | 'upper_spec'>): Limits {
  return {
    target: a.target,
    lowerControl: a.lower_control ?? undefined,
    upperControl: a.upper_control ?? undefined,
    lowerSpec: a.lower_spec ?? undefined,
    upperSpec: a.upper_spec ?? undefined,
  };
}

export function supplyOf(a: Pick<TankAnalyte, 'supply'>): AnalyteSupply | null {
  return readSupply(a.supply);
}
