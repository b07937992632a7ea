import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import { isUuid } from '@/lib/files/store';

export async function getPart(partId: string) {
  if (!isUuid(partId)) return null;
  const row = await db
    .selectFrom('parts as p')
    .innerJoin('customers as c', 'c.id', 'p.customer_id')
    .leftJoin('calculations as calc', 'calc.id', 'p.calculation_id')
    .leftJoin('files as d', 'd.id', 'p.drawing_file_id')
    .leftJoin('files as s', 's.id', 'p.stl_file_id')
    .select([
      'p.id',
      'p.customer_id',
      'c.code as customer_code',
      'c.name as customer_name',
      'p.part_number',
      'p.revision',
      'p.description',
      'p.substrate',
      'p.tensile_mpa',
      'p.hardness_hrc',
      'p.corrosivity_category',
      'p.design_life_years',
      'p.size_tolerance_um',
      'p.area_dm2',
      'p.weight_g',
      'p.drawing_file_id',
      'd.name as drawing_name',
      'p.stl_file_id',
      's.name as stl_name',
      'calc.input as calculation_input',
      'calc.result as calculation_result',
      sql<Date>`p.updated_at`.as('updated_at'),
    ])
    .where('p.id', '=', partId)
    .executeTakeFirst();
  return row ?? null;
}

export type PartDetail = NonNullable<Awaited<ReturnType<typeof getPart>>>;
