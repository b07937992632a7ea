import 'server-only';
// Who may fetch a stored file. A file is reachable only through the records it is attached to:
// staff need a read permission for one of those records (or uploaded the file themselves); a
// customer contact only files on records of their own customer. Both checks sit in the query's
// WHERE, so a file id alone never returns someone else's file.
//
// Another area that attaches files adds one entry to FILE_ATTACHMENTS.
import { type Expression, type Kysely, type RawBuilder, type SqlBool, sql } from 'kysely';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { type Permission, roleCan } from '@/lib/auth/roles';
import { FILE_COLUMNS, type FileRecord, isUuid } from './store';

export type FileAttachment = {
  /** Staff holding any of these may fetch the file through this record. */
  staff: readonly Permission[];
  /** Customer contacts may fetch it through this record. */
  customers: boolean;
  /** EXISTS condition: the file is attached to such a record (of `customerId`, when given). */
  exists: (fileId: Expression<unknown>, customerId: string | null) => RawBuilder<SqlBool>;
};

/** An attachment held in file-id columns of a table that has its customer's id in `customerColumn`. */
export function directAttachment(
  table: string,
  fileColumns: readonly string[],
  customerColumn: string,
  staff: readonly Permission[],
  customers = true,
): FileAttachment {
  return {
    staff,
    customers,
    exists: (fileId, customerId) => {
      const t = sql.table(table);
      const any = sql.join(fileColumns.map((c) => sql`${sql.ref(`${table}.${c}`)} = ${fileId}`), sql.raw(' or '));
      const own = customerId === null ? sql`true` : sql`${sql.ref(`${table}.${customerColumn}`)} = ${customerId}`;
      return sql<SqlBool>`exists (select 1 from ${t} where (${any}) and ${own})`;
    },
  };
}

export const FILE_ATTACHMENTS: FileAttachment[] = [
  // Drawings and models of parts: office staff through the part, the floor through its work orders.
  directAttachment('parts', ['drawing_file_id', 'stl_file_id'], 'customer_id', ['customers.read', 'orders.read']),
  // Quality records: certificates (their customer too); oven charts and instrument CSVs (staff only,
  // so the customer column is not consulted).
  directAttachment('certificates', ['pdf_file_id'], 'customer_id', ['quality.read']),
  directAttachment('bake_records', ['chart_file_id'], 'work_order_id', ['quality.read'], false),
  // Hull cell panel photos: staff who may read bath records (no customer access).
  directAttachment('hull_cell_panels', ['file_id'], 'tank_id', ['bath.read'], false),
  directAttachment('thickness_readings', ['source_file_id'], 'work_order_id', ['quality.read'], false),
  // The dock: packing slips and receiving photos, for the floor and office and for their customer.
  directAttachment('shipments', ['slip_file_id'], 'customer_id', ['orders.read']),
  {
    staff: ['orders.read'],
    customers: true,
    exists: (fileId, customerId) =>
      sql<SqlBool>`exists (select 1 from receipt_photos rp join receipts r on r.id = rp.receipt_id
        where rp.file_id = ${fileId} and ${customerId === null ? sql`true` : sql`r.customer_id = ${customerId}`})`,
  },
];

/** The WHERE condition under which `user` may read the file `files.id`. */
export function fileAccessCondition(user: SessionUser): RawBuilder<SqlBool> {
  const fileId = sql.ref('files.id');
  if (user.role === 'customer') {
    // No customer link, no files: `false` rather than a query without the customer condition.
    if (!user.customerId) return sql<SqlBool>`false`;
    const through = FILE_ATTACHMENTS.filter((a) => a.customers).map((a) => a.exists(fileId, user.customerId));
    return through.length ? sql<SqlBool>`(${sql.join(through, sql.raw(' or '))})` : sql<SqlBool>`false`;
  }
  const through = FILE_ATTACHMENTS.filter((a) => a.staff.some((p) => roleCan(user.role, p))).map((a) => a.exists(fileId, null));
  through.push(sql<SqlBool>`${sql.ref('files.uploaded_by')} = ${user.id}`);
  return sql<SqlBool>`(${sql.join(through, sql.raw(' or '))})`;
}

/** The file with its bytes if `user` may read it; null when it does not exist or they may not (the same answer). */
export async function readFileFor(
  user: SessionUser,
  fileId: string,
  trx: Kysely<Database> = db,
): Promise<(FileRecord & { bytes: Buffer }) | null> {
  if (!isUuid(fileId) || !user.isActive) return null;
  const row = await trx
    .selectFrom('files')
    .select([...FILE_COLUMNS, 'files.bytes'])
    .where('files.id', '=', fileId)
    .where(fileAccessCondition(user))
    .executeTakeFirst();
  return row ?? null;
}
