import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import type { UnitSystem } from '@/db/types';
import type { GridColumns } from '@/lib/grid/server';
import { displayUnit, toStorage } from '@/lib/plating';

// The part list. Area and weight are shown and filtered in the user's units: the SQL divides by
// the storage value of one display unit (from lib/plating/units.ts), so a filter typed in ft²
// compares with ft².
function perDisplayUnit(system: UnitSystem) {
  return {
    area: toStorage(1, displayUnit('area', system)),
    mass: toStorage(1, displayUnit('mass', system)),
  };
}

export function partGridColumns(system: UnitSystem): GridColumns {
  const per = perDisplayUnit(system);
  return {
    customerCode: { expr: 'c.code', type: 'text', searchable: true, header: 'Customer' },
    partNumber: { expr: 'p.part_number', type: 'text', searchable: true, header: 'Part number' },
    revision: { expr: 'p.revision', type: 'text', header: 'Revision' },
    description: { expr: 'p.description', type: 'text', searchable: true, sortable: false, header: 'Description' },
    substrate: { expr: 'p.substrate', type: 'text', header: 'Substrate' },
    hardnessHrc: { expr: 'p.hardness_hrc', type: 'number', header: 'Hardness (HRC)' },
    tensileMpa: { expr: 'p.tensile_mpa', type: 'number', header: 'Tensile (MPa)' },
    area: { expr: sql`p.area_dm2 / ${per.area}`, type: 'number', header: `Area per part (${displayUnit('area', system)})` },
    weight: { expr: sql`p.weight_g / ${per.mass}`, type: 'number', header: `Weight (${displayUnit('mass', system)})` },
    updatedAt: { expr: 'p.updated_at', type: 'date', header: 'Updated' },
  };
}

/** The part rows, optionally for one customer (the customer page's list). */
export function partGridQuery(system: UnitSystem, customerId: string | null) {
  const per = perDisplayUnit(system);
  return db
    .selectFrom('parts as p')
    .innerJoin('customers as c', 'c.id', 'p.customer_id')
    .select([
      'p.id',
      'c.code as customerCode',
      'p.part_number as partNumber',
      'p.revision',
      'p.description',
      'p.substrate',
      'p.hardness_hrc as hardnessHrc',
      'p.tensile_mpa as tensileMpa',
      sql<number>`p.area_dm2 / ${per.area}`.as('area'),
      sql<number | null>`p.weight_g / ${per.mass}`.as('weight'),
      sql<Date>`p.updated_at`.as('updatedAt'),
    ])
    .$if(customerId !== null, (b) => b.where('p.customer_id', '=', customerId!));
}
