'use client';

import type { ColDef } from 'ag-grid-community';
import { DataGrid } from '@/components/data-grid/data-grid';

export type CustomerRow = {
  id: string;
  code: string;
  name: string;
  billingEmail: string | null;
  phone: string;
  paymentTermsDays: number;
  taxRatePercent: number;
  partCount: number;
  createdAt: string;
};

const text = 'agTextColumnFilter';
const number = 'agNumberColumnFilter';

const COLUMNS: ColDef<CustomerRow>[] = [
  { field: 'code', headerName: 'Code', filter: text, maxWidth: 130 },
  { field: 'name', headerName: 'Company', filter: text, minWidth: 220 },
  { field: 'billingEmail', headerName: 'Billing e-mail', filter: text },
  { field: 'phone', headerName: 'Phone', filter: text, sortable: true },
  { field: 'paymentTermsDays', headerName: 'Terms (days)', filter: number, maxWidth: 140, type: 'rightAligned' },
  { field: 'taxRatePercent', headerName: 'Tax rate %', filter: number, maxWidth: 130, type: 'rightAligned', valueFormatter: (p) => (p.value == null ? '' : `${Number(p.value).toFixed(2)} %`) },
  { field: 'partCount', headerName: 'Parts', sortable: false, maxWidth: 100, type: 'rightAligned' },
];

export function CustomerGrid() {
  return (
    <DataGrid<CustomerRow>
      url="/api/customers"
      columns={COLUMNS}
      label="Customers"
      searchPlaceholder="Code, company, e-mail or phone"
      getRowHref={(row) => `/customers/${row.id}`}
    />
  );
}
