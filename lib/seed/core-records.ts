// Demo lines, tanks, finishes, rates and parts of the invented shop. Idempotent (upserts by code).
import { type Kysely, sql } from 'kysely';
import type { Database } from '@/db/types';

export const DEMO_LINES = [
  { name: 'Rack nickel line', method: 'rack', description: 'Acid copper and Watts nickel on racks' },
  { name: 'Barrel zinc line', method: 'barrel', description: 'Alkaline zinc in barrels, then passivate' },
  { name: 'Precious metals line', method: 'mixed', description: 'Cyanide silver, acid gold and acid tin for electrical contacts' },
  { name: 'Electroless nickel line', method: 'rack', description: 'Mid-phosphorus electroless nickel on racks and in baskets' },
  { name: 'Anodizing line', method: 'rack', description: 'Sulfuric and hard anodizing of aluminium, then the seal' },
  { name: 'Passivation line', method: 'mixed', description: 'Nitric acid passivation of stainless steel in baskets' },
] as const;

type DemoTank = {
  line: (typeof DEMO_LINES)[number]['name'];
  code: string;
  name: string;
  template_id: string;
  volume_l: number;
  element: string | null;
  ion_charge: number | null;
  efficiency: number | null;
  rectifier_max_a: number | null;
  has_ah_meter: boolean;
  anode_type: 'soluble' | 'insoluble' | 'none';
  temp_min_c: number | null;
  temp_max_c: number | null;
  /** What the tank's process family keeps (lib/families): make-up nickel, end of life, a measured constant. */
  family_settings?: Record<string, number>;
  /** Days before the seed run that the bath was made up. */
  made_up_days_ago?: number;
};

// Efficiencies are typical values (reference §2); the demo shop's own numbers are invented.
export const DEMO_TANKS: DemoTank[] = [
  { line: 'Rack nickel line', code: 'N-CU1', name: 'Acid copper', template_id: 'acid-copper', volume_l: 1500, element: 'Cu', ion_charge: 2, efficiency: 0.98, rectifier_max_a: 1000, has_ah_meter: true, anode_type: 'soluble', temp_min_c: 20, temp_max_c: 30 },
  { line: 'Rack nickel line', code: 'N-NI1', name: 'Watts nickel', template_id: 'watts-nickel', volume_l: 2000, element: 'Ni', ion_charge: 2, efficiency: 0.95, rectifier_max_a: 1500, has_ah_meter: true, anode_type: 'soluble', temp_min_c: 50, temp_max_c: 60 },
  { line: 'Barrel zinc line', code: 'Z-CL1', name: 'Alkaline electrocleaner', template_id: 'alkaline-electrocleaner', volume_l: 1200, element: null, ion_charge: null, efficiency: null, rectifier_max_a: 500, has_ah_meter: false, anode_type: 'none', temp_min_c: 55, temp_max_c: 75 },
  { line: 'Barrel zinc line', code: 'Z-AC1', name: 'Hydrochloric acid dip', template_id: 'hydrochloric-acid-dip', volume_l: 800, element: null, ion_charge: null, efficiency: null, rectifier_max_a: null, has_ah_meter: false, anode_type: 'none', temp_min_c: null, temp_max_c: null },
  { line: 'Barrel zinc line', code: 'Z-ZN1', name: 'Alkaline zinc', template_id: 'alkaline-zinc', volume_l: 3000, element: 'Zn', ion_charge: 2, efficiency: 0.72, rectifier_max_a: 2000, has_ah_meter: true, anode_type: 'soluble', temp_min_c: 20, temp_max_c: 30 },
  { line: 'Precious metals line', code: 'P-AG1', name: 'Cyanide silver', template_id: 'cyanide-silver', volume_l: 200, element: 'Ag', ion_charge: 1, efficiency: 0.98, rectifier_max_a: 100, has_ah_meter: true, anode_type: 'soluble', temp_min_c: 20, temp_max_c: 30 },
  { line: 'Precious metals line', code: 'P-AU1', name: 'Acid gold', template_id: 'acid-gold', volume_l: 60, element: 'Au', ion_charge: 1, efficiency: 0.45, rectifier_max_a: 20, has_ah_meter: true, anode_type: 'insoluble', temp_min_c: 30, temp_max_c: 50 },
  { line: 'Precious metals line', code: 'P-SN1', name: 'Acid tin', template_id: 'acid-tin', volume_l: 400, element: 'Sn', ion_charge: 2, efficiency: 0.95, rectifier_max_a: 300, has_ah_meter: true, anode_type: 'soluble', temp_min_c: 15, temp_max_c: 30 },
  // The other families' tanks; their settings and costs are the invented shop's own.
  { line: 'Barrel zinc line', code: 'Z-TP1', name: 'Trivalent passivate', template_id: 'trivalent-passivate', volume_l: 600, element: null, ion_charge: null, efficiency: null, rectifier_max_a: null, has_ah_meter: false, anode_type: 'none', temp_min_c: 20, temp_max_c: 30 },
  {
    line: 'Electroless nickel line', code: 'E-EN1', name: 'Electroless nickel', template_id: 'electroless-nickel-mid-phos', volume_l: 400, element: null, ion_charge: null, efficiency: null,
    rectifier_max_a: null, has_ah_meter: false, anode_type: 'none', temp_min_c: 85, temp_max_c: 90,
    family_settings: { nickelMakeUpGPerL: 6, endOfLifeMto: 8, makeUpCostCents: 184000, disposalCostCents: 96000 }, made_up_days_ago: 40,
  },
  { line: 'Anodizing line', code: 'A-AN1', name: 'Sulfuric anodize', template_id: 'sulfuric-anodize', volume_l: 2500, element: null, ion_charge: null, efficiency: null, rectifier_max_a: 1500, has_ah_meter: true, anode_type: 'none', temp_min_c: 18, temp_max_c: 22 },
  {
    line: 'Anodizing line', code: 'A-HC1', name: 'Hard anodize', template_id: 'hard-anodize', volume_l: 1200, element: null, ion_charge: null, efficiency: null, rectifier_max_a: 1000,
    has_ah_meter: true, anode_type: 'none', temp_min_c: 0, temp_max_c: 5, family_settings: { constantAminPerDm2PerUm: 3.35 },
  },
  { line: 'Anodizing line', code: 'A-SL1', name: 'Hot water seal', template_id: 'hot-water-seal', volume_l: 1500, element: null, ion_charge: null, efficiency: null, rectifier_max_a: null, has_ah_meter: false, anode_type: 'none', temp_min_c: 96, temp_max_c: 100 },
  { line: 'Passivation line', code: 'P-NT1', name: 'Nitric passivation', template_id: 'nitric-passivation', volume_l: 800, element: null, ion_charge: null, efficiency: null, rectifier_max_a: null, has_ah_meter: false, anode_type: 'none', temp_min_c: 21, temp_max_c: 32 },
];

export const DEMO_FINISHES = [
  {
    code: 'ZN-B633-SC2', name: 'Zinc, clear trivalent passivate (barrel)', spec_text: 'ASTM B633 Fe/Zn 8 (SC2) Type III',
    element: 'Zn', ion_charge: 2, min_thickness_um: 8, method: 'barrel', current_density_adm2: 0.8, efficiency: 0.72, distribution_ratio: 0.5,
    tank_volts: 9, parts_per_load: 2000, handling_minutes_per_load: 20, bake_required: false, bake_threshold_hrc: 31, bake_window_hours: 4, bake_temp_c: 200, bake_hours: 8,
    process_route: [{ step: 'Alkaline electroclean' }, { step: 'Hydrochloric acid dip' }, { step: 'Alkaline zinc plate' }, { step: 'Trivalent clear passivate', note: 'chromate-free of hexavalent chromium' }],
  },
  {
    code: 'ZN-B633-SC2-HS', name: 'Zinc on hardened steel with relief bake (barrel)', spec_text: 'ASTM B633 Fe/Zn 8 (SC2) Type III, bake per ASTM B850',
    element: 'Zn', ion_charge: 2, min_thickness_um: 8, method: 'barrel', current_density_adm2: 0.8, efficiency: 0.72, distribution_ratio: 0.5,
    tank_volts: 9, parts_per_load: 1500, handling_minutes_per_load: 20, bake_required: true, bake_threshold_hrc: 31, bake_window_hours: 4, bake_temp_c: 200, bake_hours: 12,
    process_route: [{ step: 'Abrasive clean' }, { step: 'Alkaline zinc plate' }, { step: 'Hydrogen-embrittlement relief bake', note: 'within 4 h of plating' }, { step: 'Trivalent clear passivate' }],
  },
  {
    code: 'NI-B689-25', name: 'Engineering nickel 25 µm (rack)', spec_text: 'ASTM B689 Type 1, 25 µm min',
    element: 'Ni', ion_charge: 2, min_thickness_um: 25, method: 'rack', current_density_adm2: 4, efficiency: 0.95, distribution_ratio: 0.625,
    tank_volts: 6, parts_per_load: 40, handling_minutes_per_load: 15, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Alkaline electroclean' }, { step: 'Acid activate' }, { step: 'Watts nickel plate' }],
  },
  {
    code: 'SN-B545-C', name: 'Matte tin 8 µm (rack)', spec_text: 'ASTM B545 Class C, matte',
    element: 'Sn', ion_charge: 2, min_thickness_um: 8, method: 'rack', current_density_adm2: 2, efficiency: 0.95, distribution_ratio: 0.7,
    tank_volts: 3, parts_per_load: 200, handling_minutes_per_load: 12, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Electroclean' }, { step: 'Acid activate' }, { step: 'Acid tin plate' }],
  },
  {
    code: 'AG-B700-5', name: 'Silver 5 µm over copper strike (rack)', spec_text: 'ASTM B700 Type 1 Grade A Class N, 5 µm min',
    element: 'Ag', ion_charge: 1, min_thickness_um: 5, method: 'rack', current_density_adm2: 1, efficiency: 0.98, distribution_ratio: 0.7,
    tank_volts: 2, parts_per_load: 150, handling_minutes_per_load: 15, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Electroclean' }, { step: 'Cyanide copper strike' }, { step: 'Cyanide silver plate' }],
  },
] as const;

/** The other families' finishes; each names its family and carries that family's own figures. */
export const DEMO_FAMILY_FINISHES = [
  {
    code: 'EN-B733-25', name: 'Electroless nickel, mid-phosphorus 25 µm', spec_text: 'ASTM B733 Type IV (5–9 % P), SC3, 25 µm min', family: 'electroless_nickel',
    family_params: { depositionRateUmPerH: 15, phosphorusWtPct: 8 },
    element: 'Ni', ion_charge: 2, min_thickness_um: 25, method: 'rack', current_density_adm2: null, efficiency: null, distribution_ratio: 0.95,
    tank_volts: 6, parts_per_load: 12, handling_minutes_per_load: 25, bake_required: false, bake_threshold_hrc: 31, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Alkaline soak clean' }, { step: 'Acid activate' }, { step: 'Electroless nickel', note: 'about 88 °C' }, { step: 'Rinse and dry' }],
  },
  {
    code: 'AN-8625-II', name: 'Sulfuric anodize Type II, clear, sealed', spec_text: 'MIL-A-8625 Type II Class 1, sealed', family: 'anodizing',
    family_params: { coatingType: 'II', growthFraction: 0.33, seal: 'hot_water', sealMinutes: 30 },
    element: 'Al', ion_charge: 3, min_thickness_um: 10, max_thickness_um: 25, method: 'rack', current_density_adm2: 1.5, efficiency: null, distribution_ratio: 0.85,
    tank_volts: 16, parts_per_load: 60, handling_minutes_per_load: 20, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Non-etch alkaline clean' }, { step: 'Deoxidize' }, { step: 'Sulfuric anodize' }, { step: 'Hot deionised-water seal' }],
  },
  {
    code: 'AN-8625-III', name: 'Hard anodize Type III, 50 µm, unsealed', spec_text: 'MIL-A-8625 Type III Class 1, 0.002 in', family: 'anodizing',
    family_params: { coatingType: 'III', growthFraction: 0.5, seal: 'none', sealMinutes: 0 },
    element: 'Al', ion_charge: 3, min_thickness_um: 50, max_thickness_um: 60, method: 'rack', current_density_adm2: 3, efficiency: null, distribution_ratio: 0.9,
    tank_volts: 40, parts_per_load: 20, handling_minutes_per_load: 25, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Non-etch alkaline clean' }, { step: 'Deoxidize' }, { step: 'Hard anodize', note: 'about 0–5 °C' }],
  },
  {
    code: 'PS-A967-N2', name: 'Passivate stainless, nitric', spec_text: 'ASTM A967 Nitric 2, water immersion test', family: 'passivation',
    family_params: { windowId: 'a967-nitric-2', minutes: 30, temperatureC: 27, concentration: 25, verificationTest: 'water_immersion' },
    element: 'Cr', ion_charge: 3, min_thickness_um: 0, method: 'rack', current_density_adm2: null, efficiency: null, distribution_ratio: 1,
    tank_volts: 6, parts_per_load: 250, handling_minutes_per_load: 15, bake_required: false, bake_threshold_hrc: null, bake_window_hours: 4, bake_temp_c: null, bake_hours: null,
    process_route: [{ step: 'Alkaline clean' }, { step: 'Rinse' }, { step: 'Nitric acid passivate' }, { step: 'Rinse', note: 'deionised water' }, { step: 'Dry' }],
  },
] as const;

// Invented prices for the demo shop.
export const DEMO_RATES = {
  effective_from: '2026-01-01',
  labour_per_hour_cents: 4200,
  tank_hour_rack_cents: 3500,
  tank_hour_barrel_cents: 2800,
  metal_per_kg_cents: { Ni: 2200, Cu: 1100, Zn: 380, Sn: 3300, Ag: 98000, Au: 9500000 },
  additives_per_kah_cents: 180,
  power_per_kwh_cents: 14,
  bake_per_load_cents: 4500,
  lot_charge_cents: 3500,
  minimum_charge_cents: 12500,
  rush_multiplier_pct: 150,
  margin_pct: 35,
  quote_valid_days: 30,
};

export const DEMO_PARTS = [
  { customer: 'NGF', part_number: 'NGF-HX-0816', revision: 'C', description: 'Hex cap screw M8×16, class 8.8', substrate: 'carbon-steel', tensile_mpa: 830, hardness_hrc: 25, area_dm2: 0.0915, weight_g: 9.6 },
  { customer: 'NGF', part_number: 'NGF-SS-1240', revision: 'A', description: 'Socket set screw M12×40, hardened', substrate: 'carbon-steel', tensile_mpa: 1220, hardness_hrc: 39, area_dm2: 0.172, weight_g: 31.5 },
  { customer: 'HVI', part_number: 'HV-STEM-220', revision: 'B', description: 'Valve stem, 22 mm × 180 mm', substrate: 'carbon-steel', tensile_mpa: 650, hardness_hrc: null, area_dm2: 1.32, weight_g: 540 },
  { customer: 'BRL', part_number: 'BL-BUS-0450', revision: 'D', description: 'Copper bus bar 45 × 6 × 300 mm', substrate: 'copper', tensile_mpa: null, hardness_hrc: null, area_dm2: 3.15, weight_g: 726 },
  { customer: 'BRL', part_number: 'BL-PIN-0102', revision: 'A', description: 'Brass contact pin 2 mm', substrate: 'brass', tensile_mpa: null, hardness_hrc: null, area_dm2: 0.0081, weight_g: 0.4 },
  { customer: 'HVI', part_number: 'HV-BODY-120', revision: 'A', description: 'Valve body, 120 mm, machined steel', substrate: 'carbon-steel', tensile_mpa: 580, hardness_hrc: null, area_dm2: 4.6, weight_g: 2950 },
  { customer: 'HVI', part_number: 'HV-ACT-6061', revision: 'C', description: 'Actuator housing, 6061 aluminium, 60 × 40 × 25 mm', substrate: 'aluminium', tensile_mpa: null, hardness_hrc: null, area_dm2: 1.45, weight_g: 118 },
  { customer: 'HVI', part_number: 'HV-PST-7075', revision: 'A', description: 'Guide piston, 7075 aluminium, Ø 30 × 80 mm', substrate: 'aluminium', tensile_mpa: null, hardness_hrc: null, area_dm2: 0.9, weight_g: 150 },
  { customer: 'NGF', part_number: 'NGF-SS-0612', revision: 'B', description: 'Socket cap screw M6×12, stainless A2', substrate: 'stainless-304', tensile_mpa: null, hardness_hrc: null, area_dm2: 0.036, weight_g: 3.9 },
] as const;

/** What the demo customers say about where parts serve (ISO 9223) and the life they ask. */
export const DEMO_PART_ENVIRONMENTS = [{ part_number: 'NGF-HX-0816', corrosivity_category: 'C3', design_life_years: 10 }] as const;
/** The drawing's tolerance on a finished diameter (±, µm) of the parts that are anodized. */
export const DEMO_PART_TOLERANCES = [
  { part_number: 'HV-PST-7075', size_tolerance_um: 25 },
  { part_number: 'HV-ACT-6061', size_tolerance_um: 50 },
] as const;

/**
 * What each process tank runs in a day (invented for the demo shop): one load's cycle in minutes,
 * the work area a rack or barrel load carries, the manned shifts and their length.
 */
export const DEMO_TANK_CAPACITY: Record<string, { cycle_minutes: number; load_area_dm2: number; shifts_per_day: number; shift_hours: number }> = {
  'N-CU1': { cycle_minutes: 40, load_area_dm2: 60, shifts_per_day: 2, shift_hours: 8 },
  'N-NI1': { cycle_minutes: 75, load_area_dm2: 60, shifts_per_day: 2, shift_hours: 8 },
  'Z-ZN1': { cycle_minutes: 60, load_area_dm2: 120, shifts_per_day: 2, shift_hours: 8 },
  'P-AG1': { cycle_minutes: 30, load_area_dm2: 10, shifts_per_day: 1, shift_hours: 8 },
  'P-AU1': { cycle_minutes: 30, load_area_dm2: 4, shifts_per_day: 1, shift_hours: 8 },
  'P-SN1': { cycle_minutes: 30, load_area_dm2: 15, shifts_per_day: 1, shift_hours: 8 },
  'E-EN1': { cycle_minutes: 120, load_area_dm2: 40, shifts_per_day: 2, shift_hours: 8 },
  'A-AN1': { cycle_minutes: 60, load_area_dm2: 50, shifts_per_day: 2, shift_hours: 8 },
  'A-HC1': { cycle_minutes: 120, load_area_dm2: 30, shifts_per_day: 1, shift_hours: 8 },
  'P-NT1': { cycle_minutes: 45, load_area_dm2: 80, shifts_per_day: 1, shift_hours: 8 },
};

export async function seedCoreRecords(db: Kysely<Database>): Promise<void> {
  for (const l of DEMO_LINES) {
    await db.insertInto('lines').values(l).onConflict((oc) => oc.column('name').doUpdateSet({ method: l.method, description: l.description })).execute();
  }
  const lines = new Map((await db.selectFrom('lines').select(['id', 'name']).execute()).map((l) => [l.name, l.id]));
  for (const { line, family_settings, made_up_days_ago, ...t } of DEMO_TANKS) {
    const values = {
      ...t,
      line_id: lines.get(line)!,
      family_settings: JSON.stringify(family_settings ?? {}),
      made_up_at: made_up_days_ago === undefined ? null : new Date(Date.now() - made_up_days_ago * 86_400_000),
    };
    // A second seed keeps the bath's make-up date (its age counts from there) and its settings.
    await db
      .insertInto('tanks')
      .values(values)
      .onConflict((oc) =>
        oc.column('code').doUpdateSet({ ...values, made_up_at: sql`coalesce(tanks.made_up_at, excluded.made_up_at)`, family_settings: sql`case when tanks.family_settings = '{}'::jsonb then excluded.family_settings else tanks.family_settings end` }),
      )
      .execute();
  }
  for (const [code, capacity] of Object.entries(DEMO_TANK_CAPACITY)) {
    await db.updateTable('tanks').set(capacity).where('code', '=', code).execute();
  }
  for (const f of DEMO_FINISHES) {
    const values = { ...f, process_route: JSON.stringify(f.process_route) };
    await db.insertInto('finishes').values(values).onConflict((oc) => oc.column('code').doUpdateSet(values)).execute();
  }
  for (const f of DEMO_FAMILY_FINISHES) {
    const values = { ...f, process_route: JSON.stringify(f.process_route), family_params: JSON.stringify(f.family_params) };
    await db.insertInto('finishes').values(values).onConflict((oc) => oc.column('code').doUpdateSet(values)).execute();
  }
  const rates = { ...DEMO_RATES, metal_per_kg_cents: JSON.stringify(DEMO_RATES.metal_per_kg_cents) };
  await db.insertInto('rate_sets').values(rates).onConflict((oc) => oc.column('effective_from').doNothing()).execute();

  const customers = new Map((await db.selectFrom('customers').select(['id', 'code']).execute()).map((c) => [c.code, c.id]));
  for (const { customer, ...p } of DEMO_PARTS) {
    const values = { ...p, customer_id: customers.get(customer)! };
    await db
      .insertInto('parts')
      .values(values)
      .onConflict((oc) => oc.columns(['customer_id', 'part_number', 'revision']).doUpdateSet({ ...p, updated_at: sql`now()` }))
      .execute();
  }
  for (const t of DEMO_PART_TOLERANCES) {
    await db.updateTable('parts').set({ size_tolerance_um: t.size_tolerance_um }).where('part_number', '=', t.part_number).execute();
  }
  for (const e of DEMO_PART_ENVIRONMENTS) {
    await db.updateTable('parts').set({ corrosivity_category: e.corrosivity_category, design_life_years: e.design_life_years }).where('part_number', '=', e.part_number).execute();
  }
}
