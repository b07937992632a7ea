import 'server-only';
// CSV import of customers: every row is checked, duplicates within the file and against existing
// customers are errors, and nothing is written unless all rows pass (one transaction).
import { type Kysely } from 'kysely';
import { z } from 'zod';
import { db, type Database } from '@/db';
import type { SessionUser } from '@/lib/auth/current-user';
import { customerFields } from '@/lib/customers/schemas';
import { assertCan, writeAudit } from '@/lib/records/audit';
import { inTransaction } from '@/lib/records/transaction';
import { duplicateKeys, type ImportColumn, type ImportOutcome, parseImportCsv, sortProblems, validateRows } from './csv-rows';
import { conflictOnUnique } from './unique';

export const CUSTOMER_IMPORT_COLUMNS: readonly ImportColumn[] = [
  { column: 'code', field: 'code', required: true, example: 'ACME', hint: '2–16 capital letters, digits or dashes; unique' },
  { column: 'name', field: 'name', required: true, example: 'Acme Hinge Works', hint: 'Company name' },
  { column: 'billing_address', field: 'billingAddress', required: false, example: '12 Mill Lane, Springfield, OH 45501', hint: '' },
  { column: 'shipping_address', field: 'shippingAddress', required: false, example: 'Dock 2, 12 Mill Lane, Springfield, OH 45501', hint: '' },
  { column: 'billing_email', field: 'billingEmail', required: false, example: 'ap@acme-hinge.test', hint: '' },
  { column: 'phone', field: 'phone', required: false, example: '+1 555 0100', hint: '' },
  { column: 'payment_terms_days', field: 'paymentTermsDays', required: true, example: '30', hint: '0–365' },
  { column: 'tax_rate_percent', field: 'taxRatePercent', required: true, example: '7.25', hint: 'percent, up to two decimals' },
];

const rowSchema = z.object(customerFields);

export async function importCustomers(actor: SessionUser, text: string, q: Kysely<Database> = db): Promise<ImportOutcome> {
  assertCan(actor, 'customers.write');
  const { rows, problems } = parseImportCsv(text, CUSTOMER_IMPORT_COLUMNS);
  if (problems.some((p) => p.row === 1)) return { ok: false, problems: sortProblems(problems) };
  const { valid, problems: invalid } = validateRows(rows, CUSTOMER_IMPORT_COLUMNS, rowSchema);
  problems.push(...invalid, ...duplicateKeys(valid, (d) => d.code, 'code', (d) => `Code ${d.code}`));
  const codes = valid.map((v) => v.data.code);
  const existing = codes.length ? await q.selectFrom('customers').select('code').where('code', 'in', codes).execute() : [];
  const taken = new Set(existing.map((e) => e.code));
  for (const v of valid) if (taken.has(v.data.code)) problems.push({ row: v.row, column: 'code', message: `A customer with code ${v.data.code} already exists.` });
  if (problems.length) return { ok: false, problems: sortProblems(problems) };

  return conflictOnUnique(() =>
    inTransaction(q, async (trx) => {
      await trx
        .insertInto('customers')
        .values(
          valid.map(({ data: d }) => ({
            code: d.code,
            name: d.name,
            billing_address: d.billingAddress,
            shipping_address: d.shippingAddress,
            billing_email: d.billingEmail,
            phone: d.phone,
            payment_terms_days: d.paymentTermsDays,
            tax_rate_bp: d.taxRatePercent,
          })),
        )
        .execute();
      await writeAudit(trx, actor, 'customer.import', 'customer', null, { count: valid.length, codes });
      return { ok: true as const, written: valid.length };
    }),
  );
}
