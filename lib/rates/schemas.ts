// Form input for a rate set. Money is typed in dollars and kept in whole cents, parsed exactly
// from the text (no floating point); more than two decimals is refused, never rounded.
import { z } from 'zod';
import { isIsoDate } from '@/lib/billing/dates';
import { dollarsSchema } from '@/lib/quotes/schemas';
import { PLATING_METALS } from '@/lib/plating';
import { numberField } from '@/lib/records/fields';

/** Elements a metal price can be kept for (each once, in the engine's order). */
export const PRICED_METALS = [...new Map(PLATING_METALS.map((m) => [m.element, m.name.replace(/ \(.*$/, '').replace(/ from .*$/, '')])).entries()].map(
  ([element, name]) => ({ element, name }),
);

export const MONEY_FIELDS = [
  { key: 'labourPerHour', column: 'labour_per_hour_cents', label: 'Labour', per: 'per hour' },
  { key: 'tankHourRack', column: 'tank_hour_rack_cents', label: 'Tank time, rack lines', per: 'per tank-hour' },
  { key: 'tankHourBarrel', column: 'tank_hour_barrel_cents', label: 'Tank time, barrel lines', per: 'per tank-hour' },
  { key: 'additivesPerKah', column: 'additives_per_kah_cents', label: 'Salts and additives', per: 'per kA·h' },
  { key: 'powerPerKwh', column: 'power_per_kwh_cents', label: 'Power', per: 'per kWh' },
  { key: 'bakePerLoad', column: 'bake_per_load_cents', label: 'Relief bake', per: 'per oven load' },
  { key: 'lotCharge', column: 'lot_charge_cents', label: 'Lot charge', per: 'per line' },
  { key: 'minimumCharge', column: 'minimum_charge_cents', label: 'Minimum charge', per: 'per line' },
] as const;

const isoDay = z
  .string({ error: 'Enter the date the rates take effect.' })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'Enter the date as YYYY-MM-DD.', abort: true })
  .refine(isIsoDate, 'That is not a real date.');

const money = (label: string) =>
  z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), z.string({ error: `Enter the ${label.toLowerCase()} rate.` }).pipe(dollarsSchema));
const optionalMoney = z.preprocess((v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? null : v), dollarsSchema.nullable());

const moneyShape = Object.fromEntries(MONEY_FIELDS.map((f) => [f.key, money(f.label)])) as Record<(typeof MONEY_FIELDS)[number]['key'], ReturnType<typeof money>>;
const metalShape = Object.fromEntries(PRICED_METALS.map((m) => [`metal_${m.element}`, optionalMoney]));

export const rateSetSchema = z
  .object({
    rateSetId: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.uuid().nullable()),
    effectiveFrom: isoDay,
    ...moneyShape,
    ...metalShape,
    rushMultiplierPct: numberField('the rush multiplier', { integer: true, min: 100, max: 500 }),
    marginPct: numberField('the margin', { integer: true, min: 0, max: 500 }),
    quoteValidDays: numberField('the days a quote is valid', { integer: true, min: 1, max: 365 }),
  })
  .transform((v) => {
    const r = v as Record<string, unknown>;
    const metals: Record<string, number> = {};
    for (const m of PRICED_METALS) {
      const cents = r[`metal_${m.element}`];
      if (typeof cents === 'number') metals[m.element] = cents;
    }
    const columns = Object.fromEntries(MONEY_FIELDS.map((f) => [f.column, r[f.key] as number])) as Record<(typeof MONEY_FIELDS)[number]['column'], number>;
    return {
      rateSetId: v.rateSetId,
      effective_from: v.effectiveFrom,
      ...columns,
      metal_per_kg_cents: metals,
      rush_multiplier_pct: v.rushMultiplierPct,
      margin_pct: v.marginPct,
      quote_valid_days: v.quoteValidDays,
    };
  });

export type RateSetInput = z.infer<typeof rateSetSchema>;
