import 'server-only';
import { sql } from 'kysely';
import { db } from '@/db';
import type { GridColumns } from '@/lib/grid/server';

const PART_COUNT = sql<number>`(select count(*) from parts p where p.customer_id = c.id)::int`;
const TAX_PERCENT = sql<number>`c.tax_rate_bp / 100.0`;

// The customer list: what the grid may sort, filter and search, and the query it reads.
export const CUSTOMER_GRID_COLUMNS: GridColumns = {
  code: { expr: 'c.code', type: 'text', searchable: true, header: 'Code' },
  name: { expr: 'c.name', type: 'text', searchable: true, header: 'Company' },
  billingEmail: { expr: 'c.billing_email', type: 'text', searchable: true, header: 'Billing e-mail' },
  phone: { expr: 'c.phone', type: 'text', searchable: true, header: 'Phone' },
  paymentTermsDays: { expr: 'c.payment_terms_days', type: 'number', header: 'Payment terms (days)' },
  taxRatePercent: { expr: TAX_PERCENT, type: 'number', header: 'Tax rate (%)' },
  partCount: { expr: PART_COUNT, type: 'number', sortable: false, header: 'Parts' },
  createdAt: { expr: 'c.created_at', type: 'date', header: 'Added' },
};

export function customerGridQuery() {
  return db
    .selectFrom('customers as c')
    .select([
      'c.id',
      'c.code',
      'c.name',
      'c.billing_email as billingEmail',
      'c.phone',
      'c.payment_terms_days as paymentTermsDays',
      TAX_PERCENT.as('taxRatePercent'),
      PART_COUNT.as('partCount'),
      sql<Date>`c.created_at`.as('createdAt'),
    ]);
}
