'use client';

import type { ColDef } from 'ag-grid-community';
import { useMemo } from 'react';
import { DataGrid } from '@/components/data-grid/data-grid';
import { formatMoney } from '@/components/money';
import type { WorkOrderState } from '@/db/types';
import { formatDay } from '@/lib/quotes/format';

export type WorkOrderRow = {
  id: string;
  number: string;
  customer: string;
  part: string;
  finish: string;
  po_number: string;
  state: WorkOrderState;
  due_date: string | null;
  quantity_ordered: number;
  quantity_received: number;
  total_cents: number;
  is_rush: boolean;
};

const text = 'agTextColumnFilter';
const number = 'agNumberColumnFilter';

// Sorting is offered on indexed columns only (number, state, due date): the list must stay fast
// with a hundred thousand orders.
function columns(stateLabels: Record<WorkOrderState, string>): ColDef<WorkOrderRow>[] {
  return [
    { field: 'number', headerName: 'Work order', filter: text, maxWidth: 150, cellClass: 'font-mono' },
    { field: 'customer', headerName: 'Customer', filter: text, sortable: false, minWidth: 180 },
    { field: 'part', headerName: 'Part', filter: text, sortable: false },
    { field: 'finish', headerName: 'Finish', filter: text, sortable: false },
    { field: 'po_number', headerName: 'PO', filter: text, sortable: false, maxWidth: 140 },
    { field: 'state', headerName: 'State', filter: text, maxWidth: 150, valueFormatter: (p) => (p.value ? stateLabels[p.value as WorkOrderState] : '') },
    { field: 'due_date', headerName: 'Due', filter: 'agDateColumnFilter', maxWidth: 140, valueFormatter: (p) => (p.value ? formatDay(p.value) : '') },
    { field: 'quantity_ordered', headerName: 'Ordered', filter: number, sortable: false, maxWidth: 120, type: 'rightAligned' },
    { field: 'quantity_received', headerName: 'Received', filter: number, sortable: false, maxWidth: 120, type: 'rightAligned' },
    { field: 'total_cents', headerName: 'Total', filter: number, sortable: false, maxWidth: 140, type: 'rightAligned', valueFormatter: (p) => (p.value == null ? '' : formatMoney(Number(p.value))) },
  ];
}

/** The state words come from the server (the state machine's labels) so they are written once. */
export function WorkOrdersGrid({ stateLabels }: { stateLabels: Record<WorkOrderState, string> }) {
  const cols = useMemo(() => columns(stateLabels), [stateLabels]);
  return (
    <DataGrid<WorkOrderRow>
      url="/api/work-orders"
      columns={cols}
      label="Work orders"
      searchPlaceholder="Order no., PO, customer or part"
      getRowHref={(row) => `/work-orders/${row.id}`}
    />
  );
}
