import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb } from '@/db';
import type { Database, PricingBasis, RateSet } from '@/db/types';
import { AppError } from '@/lib/errors';
import { PlatingInputError } from '@/lib/plating';
import { priceFinishLine } from '@/lib/families';
import { loadFamilyData } from '@/lib/families/shop-data';
import type { LinePrice, PricingInput, PricingRates } from './pricing';
import { processForFinish, type TankFacts } from './process';

// Loads what pricing needs from the records and prices one line; the engine's input errors become
// form messages.

type Db = Kysely<Database>;

export function ratesFromRow(r: RateSet): PricingRates {
  return {
    labourPerHourCents: r.labour_per_hour_cents,
    tankHourRackCents: r.tank_hour_rack_cents,
    tankHourBarrelCents: r.tank_hour_barrel_cents,
    metalPerKgCents: r.metal_per_kg_cents,
    additivesPerKahCents: r.additives_per_kah_cents,
    powerPerKwhCents: r.power_per_kwh_cents,
    bakePerLoadCents: r.bake_per_load_cents,
    lotChargeCents: r.lot_charge_cents,
    minimumChargeCents: r.minimum_charge_cents,
    rushMultiplierPct: r.rush_multiplier_pct,
    marginPct: r.margin_pct,
  };
}

/** The rate set in force on a day: the latest one that took effect on or before it. */
export async function rateSetInForce(conn: Db = defaultDb, on: Date = new Date()): Promise<RateSet> {
  const day = on.toISOString().slice(0, 10);
  const row = await conn.selectFrom('rate_sets').selectAll().where('effective_from', '<=', sql<Date>`${day}::date`).orderBy('effective_from', 'desc').limit(1).executeTakeFirst();
  if (!row) throw new AppError('CONFLICT', 'No rates are in force yet. The owner sets them under Rates.');
  return row;
}

export type ActiveTank = TankFacts & { name: string; hasAhMeter: boolean };

export async function activeTankFacts(conn: Db = defaultDb): Promise<ActiveTank[]> {
  const rows = await conn
    .selectFrom('tanks')
    .select(['id', 'code', 'name', 'has_ah_meter', 'line_id', 'template_id', 'element', 'ion_charge', 'efficiency', 'rectifier_max_a', 'anode_type', 'is_active', 'volume_l', 'family_settings'])
    .where('is_active', '=', true)
    .execute();
  return rows.map((t) => ({
    id: t.id,
    code: t.code,
    name: t.name,
    hasAhMeter: t.has_ah_meter,
    lineId: t.line_id,
    templateId: t.template_id,
    element: t.element,
    ionCharge: t.ion_charge,
    efficiency: t.efficiency,
    rectifierMaxA: t.rectifier_max_a,
    anodeType: t.anode_type,
    isActive: t.is_active,
    volumeL: t.volume_l,
    familySettings: t.family_settings,
  }));
}

export type LineRequest = { customerId: string; partId: string; finishId: string; quantity: number; basis: PricingBasis; isRush: boolean; rateSetId: string };

export type PricedLine = { input: PricingInput; price: LinePrice; tankCode: string };

export function asFormError(err: unknown): never {
  if (err instanceof PlatingInputError) {
    const field = err.field === 'basis' || err.field === 'quantity' ? err.field : 'finishId';
    throw new AppError('BAD_INPUT', err.message, { [field]: [err.message] });
  }
  throw err;
}

export async function priceRequest(conn: Db, req: LineRequest): Promise<PricedLine> {
  const [part, finish, rateSet, tanks] = await Promise.all([
    conn.selectFrom('parts').selectAll().where('id', '=', req.partId).where('customer_id', '=', req.customerId).executeTakeFirst(),
    conn.selectFrom('finishes').selectAll().where('id', '=', req.finishId).executeTakeFirst(),
    conn.selectFrom('rate_sets').selectAll().where('id', '=', req.rateSetId).executeTakeFirst(),
    activeTankFacts(conn),
  ]);
  if (!part) throw new AppError('BAD_INPUT', 'That part is not one of this customer’s parts.', { partId: ['Choose one of this customer’s parts.'] });
  if (!finish || !finish.is_active) throw new AppError('BAD_INPUT', 'That finish is not available.', { finishId: ['Choose an active finish.'] });
  if (!rateSet) throw new AppError('CONFLICT', 'The rate set of this quote no longer exists.');
  try {
    const resolved = processForFinish(
      { family: finish.family, familyParams: finish.family_params, element: finish.element, ionCharge: finish.ion_charge, method: finish.method, lineId: finish.line_id },
      tanks,
    );
    const input: PricingInput = {
      familyData: await loadFamilyData(conn, finish.family),
      part: {
        areaDm2: part.area_dm2, weightG: part.weight_g, hardnessHrc: part.hardness_hrc, tensileMpa: part.tensile_mpa,
        corrosivityCategory: part.corrosivity_category, designLifeYears: part.design_life_years, sizeToleranceUm: part.size_tolerance_um,
      },
      finish: {
        family: finish.family,
        familyParams: finish.family_params,
        element: finish.element,
        ionCharge: finish.ion_charge,
        minThicknessUm: finish.min_thickness_um,
        method: finish.method,
        currentDensityAdm2: finish.current_density_adm2 ?? 0,
        efficiency: finish.efficiency ?? 1,
        distributionRatio: finish.distribution_ratio,
        tankVolts: finish.tank_volts,
        partsPerLoad: finish.parts_per_load,
        handlingMinutesPerLoad: finish.handling_minutes_per_load,
        maskingPerPieceCents: finish.masking_per_piece_cents,
        bakeRequired: finish.bake_required,
        bakeThresholdHrc: finish.bake_threshold_hrc,
      },
      process: resolved.process,
      rates: ratesFromRow(rateSet),
      quantity: req.quantity,
      isRush: req.isRush,
      basis: req.basis,
    };
    return { input, price: priceFinishLine(input), tankCode: resolved.tankCode };
  } catch (err) {
    return asFormError(err);
  }
}
