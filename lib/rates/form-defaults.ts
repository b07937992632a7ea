// A rate set as the form's text: dollars with two decimals. Pure.
import { centsToDollarText } from '@/lib/records/fields';
import { MONEY_FIELDS, PRICED_METALS } from './schemas';

type Saved = Record<(typeof MONEY_FIELDS)[number]['column'], number> & {
  id: string;
  effective_day: string;
  metal_per_kg_cents: Record<string, number>;
  rush_multiplier_pct: number;
  margin_pct: number;
  quote_valid_days: number;
};

/** Values for the form: a saved set, or a new set starting from `base` (the set in force) on `day`. */
export function rateFormDefaults(saved: Saved | null, opts: { asNewOn?: string } = {}): Record<string, string> {
  const out: Record<string, string> = {
    rateSetId: opts.asNewOn || !saved ? '' : saved.id,
    effectiveFrom: opts.asNewOn ?? saved?.effective_day ?? '',
    rushMultiplierPct: String(saved?.rush_multiplier_pct ?? 150),
    marginPct: String(saved?.margin_pct ?? 30),
    quoteValidDays: String(saved?.quote_valid_days ?? 30),
  };
  for (const f of MONEY_FIELDS) out[f.key] = saved ? centsToDollarText(saved[f.column]) : '';
  for (const m of PRICED_METALS) {
    const cents = saved?.metal_per_kg_cents[m.element];
    out[`metal_${m.element}`] = cents === undefined ? '' : centsToDollarText(cents);
  }
  return out;
}
