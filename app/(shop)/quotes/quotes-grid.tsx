'use client';

import type { ColDef } from 'ag-grid-community';
import { DataGrid } from '@/components/data-grid/data-grid';
import { formatMoney } from '@/components/money';
import type { QuoteStatus } from '@/db/types';
import { formatDay } from '@/lib/quotes/format';
import { QUOTE_STATUS_LABELS } from '@/lib/quotes/status';

export type QuoteRow = {
  id: string;
  number: string;
  revision: string;
  customer: string;
  status: QuoteStatus;
  total_cents: number;
  created_at: string;
  expires_at: string | null;
  estimator: string | null;
};

const text = 'agTextColumnFilter';

const COLUMNS: ColDef<QuoteRow>[] = [
  { field: 'number', headerName: 'Quote', filter: text, maxWidth: 150, cellClass: 'font-mono' },
  { field: 'revision', headerName: 'Rev', filter: text, maxWidth: 80, sortable: false },
  { field: 'customer', headerName: 'Customer', filter: text, minWidth: 220, flex: 2 },
  { field: 'status', headerName: 'Status', filter: text, maxWidth: 140, valueFormatter: (p) => (p.value ? QUOTE_STATUS_LABELS[p.value as QuoteStatus] : '') },
  { field: 'total_cents', headerName: 'Total', filter: 'agNumberColumnFilter', // Figures right-aligned, the header as the others (label first, filter after it).
    cellClass: 'ag-right-aligned-cell tabular', maxWidth: 150, valueFormatter: (p) => (p.value == null ? '' : formatMoney(Number(p.value))) },
  { field: 'created_at', headerName: 'Created', filter: 'agDateColumnFilter', maxWidth: 150, valueFormatter: (p) => (p.value ? formatDay(p.value) : '') },
  { field: 'expires_at', headerName: 'Valid until', filter: 'agDateColumnFilter', maxWidth: 150, valueFormatter: (p) => (p.value ? formatDay(p.value) : '') },
  { field: 'estimator', headerName: 'Estimator', filter: text, maxWidth: 200 },
];

export function QuotesGrid() {
  return (
    <DataGrid<QuoteRow>
      url="/api/quotes"
      columns={COLUMNS}
      label="Quotes"
      searchPlaceholder="Quote no., customer, status or estimator"
      getRowHref={(row) => `/quotes/${row.id}`}
    />
  );
}
