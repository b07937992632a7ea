import 'server-only';
// CSV import of parts: every row checked (customer code known, area and weight in a stated unit),
// duplicates of customer + part number + revision are errors, nothing written unless all pass.
import type { Kysely } from 'kysely';
import { z } from 'zod';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { customerCodeSchema } from '@/lib/customers/schemas';
import { AREA_UNITS, partFields } from '@/lib/parts/schemas';
import { SUBSTRATES, toStorage, type UnitOf } from '@/lib/plating';
import { numberField } from '@/lib/records/fields';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import { duplicateKeys, type ImportColumn, type ImportOutcome, parseImportCsv, sortProblems, validateRows } from './csv-rows';
import { conflictOnUnique } from './unique';

export const PART_IMPORT_COLUMNS: readonly ImportColumn[] = [
  { column: 'customer_code', field: 'customerCode', required: true, example: 'NGF', hint: 'an existing customer code' },
  { column: 'part_number', field: 'partNumber', required: true, example: 'NGF-WS-0610', hint: '' },
  { column: 'revision', field: 'revision', required: false, example: 'A', hint: '' },
  { column: 'description', field: 'description', required: false, example: 'Washer, 6 × 10 mm', hint: '' },
  { column: 'substrate', field: 'substrate', required: true, example: 'carbon-steel', hint: Object.keys(SUBSTRATES).join(', ') },
  { column: 'tensile_mpa', field: 'tensileMpa', required: false, example: '', hint: 'MPa' },
  { column: 'hardness_hrc', field: 'hardnessHrc', required: false, example: '', hint: 'HRC' },
  { column: 'area', field: 'area', required: true, example: '0.0105', hint: 'area per part' },
  { column: 'area_unit', field: 'areaUnit', required: true, example: 'dm2', hint: AREA_UNITS.join(', ') },
  { column: 'weight', field: 'weight', required: false, example: '1.2', hint: 'weight per part' },
  { column: 'weight_unit', field: 'weightUnit', required: false, example: 'g', hint: 'g, kg or lb' },
];

const substrateIds = Object.keys(SUBSTRATES);
const rowSchema = z.object({
  customerCode: customerCodeSchema,
  ...partFields,
  substrate: z.string().refine((s) => substrateIds.includes(s), `Use one of: ${substrateIds.join(', ')}.`),
  weightUnit: z.preprocess((v) => (v === '' ? 'g' : v), partFields.weightUnit),
  area: numberField('the area per part', { positive: true }),
  areaUnit: z.enum(AREA_UNITS as [UnitOf<'area'>, ...UnitOf<'area'>[]], { error: `Use one of: ${AREA_UNITS.join(', ')}.` }),
});
type PartRow = z.infer<typeof rowSchema>;

const keyOf = (d: Pick<PartRow, 'customerCode' | 'partNumber' | 'revision'>) => `${d.customerCode}\u0000${d.partNumber}\u0000${d.revision}`;
const describe = (d: PartRow) => `Part ${d.partNumber}${d.revision ? ` rev ${d.revision}` : ''} for ${d.customerCode}`;

export async function importParts(actor: SessionUser, text: string, q: Kysely<Database> = db): Promise<ImportOutcome> {
  assertCan(actor, 'customers.write');
  const { rows, problems } = parseImportCsv(text, PART_IMPORT_COLUMNS);
  if (problems.some((p) => p.row === 1)) return { ok: false, problems: sortProblems(problems) };
  const { valid, problems: invalid } = validateRows(rows, PART_IMPORT_COLUMNS, rowSchema);
  problems.push(...invalid, ...duplicateKeys(valid, keyOf, 'part_number', describe));

  const codes = [...new Set(valid.map((v) => v.data.customerCode))];
  const customers = codes.length ? await q.selectFrom('customers').select(['id', 'code']).where('code', 'in', codes).execute() : [];
  const idOf = new Map(customers.map((c) => [c.code, c.id]));
  const existing = customers.length
    ? await q.selectFrom('parts as p').innerJoin('customers as c', 'c.id', 'p.customer_id').select(['c.code as customerCode', 'p.part_number as partNumber', 'p.revision']).where('p.customer_id', 'in', customers.map((c) => c.id)).execute()
    : [];
  const taken = new Set(existing.map(keyOf));
  const ready = valid.map((v) => ({ ...v, areaDm2: toStorage(v.data.area, v.data.areaUnit), weightG: v.data.weight === null ? null : toStorage(v.data.weight, v.data.weightUnit) }));
  for (const v of ready) {
    if (!idOf.has(v.data.customerCode)) problems.push({ row: v.row, column: 'customer_code', message: `No customer has the code ${v.data.customerCode}.` });
    else if (taken.has(keyOf(v.data))) problems.push({ row: v.row, column: 'part_number', message: `${describe(v.data)} already exists.` });
    if (v.areaDm2 >= 100_000) problems.push({ row: v.row, column: 'area', message: 'That area is too large for one part.' });
  }
  if (problems.length) return { ok: false, problems: sortProblems(problems) };

  return conflictOnUnique(() =>
    inTransaction(q, async (trx) => {
      await trx
        .insertInto('parts')
        .values(
          ready.map(({ data: d, areaDm2, weightG }) => ({
            customer_id: idOf.get(d.customerCode)!,
            part_number: d.partNumber,
            revision: d.revision,
            description: d.description,
            substrate: d.substrate,
            tensile_mpa: d.tensileMpa,
            hardness_hrc: d.hardnessHrc,
            area_dm2: areaDm2,
            weight_g: weightG,
          })),
        )
        .execute();
      await writeAudit(trx, actor, 'part.import', 'part', null, { count: ready.length });
      return { ok: true as const, written: ready.length };
    }),
  );
}
