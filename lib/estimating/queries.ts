import 'server-only';
import { sql, type Kysely } from 'kysely';
import { db as defaultDb, type Database } from '@/db';
import { isUuid } from '@/lib/files/store';
import { activeTankFacts } from '@/lib/quotes/pricing-context';
import { calculationInputSchema, type CalculationInput } from './calculation-schema';
import { libraryProcessFrom, type LibraryProcess } from './process-library';

type Db = Kysely<Database>;

/**
 * Every active electroplated finish as a workbench process, completed from the tank that would run
 * it. The other families' finishes have their own calculators (lib/families) beside it.
 */
export async function findProcessLibrary(conn: Db = defaultDb): Promise<LibraryProcess[]> {
  const [finishes, tanks] = await Promise.all([
    conn
      .selectFrom('finishes')
      .select([
        'id', 'code', 'name', 'spec_text', 'element', 'ion_charge', 'min_thickness_um', 'method', 'current_density_adm2',
        'efficiency', 'distribution_ratio', 'tank_volts', 'parts_per_load', 'line_id',
      ])
      .where('is_active', '=', true)
      .where('family', '=', 'electroplating')
      .orderBy('code')
      .execute(),
    activeTankFacts(conn),
  ]);
  return finishes.map((f) =>
    libraryProcessFrom(
      {
        id: f.id,
        code: f.code,
        name: f.name,
        specText: f.spec_text,
        element: f.element,
        ionCharge: f.ion_charge,
        minThicknessUm: f.min_thickness_um,
        method: f.method,
        // Electroplated finishes always carry both (finishes_family_current / _efficiency checks).
        currentDensityAdm2: f.current_density_adm2 ?? 0,
        efficiency: f.efficiency ?? 0,
        distributionRatio: f.distribution_ratio,
        tankVolts: f.tank_volts,
        partsPerLoad: f.parts_per_load,
        lineId: f.line_id,
      },
      tanks,
    ),
  );
}

export type CalculationSummary = {
  id: string;
  title: string;
  areaDm2: number;
  metalName: string | null;
  quantity: number | null;
  createdAt: Date;
  createdBy: string | null;
};

/** The latest saved calculations, newest first, for the list beside the workbench. */
export async function findRecentCalculations(limit = 10, conn: Db = defaultDb): Promise<CalculationSummary[]> {
  const rows = await conn
    .selectFrom('calculations as c')
    .leftJoin('users as u', 'u.id', 'c.created_by')
    .select([
      'c.id',
      'c.title',
      'c.area_dm2',
      'c.created_at',
      'u.name as creator',
      sql<string | null>`c.result #>> '{estimate,metal,name}'`.as('metal_name'),
      sql<string | null>`c.input ->> 'quantity'`.as('quantity'),
    ])
    .orderBy('c.created_at', 'desc')
    .orderBy('c.id')
    .limit(limit)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    areaDm2: r.area_dm2,
    metalName: r.metal_name,
    quantity: r.quantity === null || !Number.isFinite(Number(r.quantity)) ? null : Number(r.quantity),
    createdAt: r.created_at as unknown as Date, // Generated<Timestamp> selects as Date
    createdBy: r.creator,
  }));
}

export type SavedCalculation = { id: string; title: string; input: CalculationInput | null; createdAt: Date };

/** One saved calculation; `input` is null when it was stored in a form this version cannot read. */
export async function getCalculation(id: string, conn: Db = defaultDb): Promise<SavedCalculation | null> {
  if (!isUuid(id)) return null;
  const row = await conn.selectFrom('calculations').select(['id', 'title', 'input', 'created_at']).where('id', '=', id).executeTakeFirst();
  if (!row) return null;
  const parsed = calculationInputSchema.safeParse(row.input);
  return { id: row.id, title: row.title, input: parsed.success ? parsed.data : null, createdAt: row.created_at as unknown as Date };
}
