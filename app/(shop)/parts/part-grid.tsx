'use client';

import { useMemo } from 'react';
import type { ColDef } from 'ag-grid-community';
import { DataGrid } from '@/components/data-grid/data-grid';
import { displayUnit, formatNumber, SUBSTRATES, UNITS, type UnitSystem } from '@/lib/plating';

export type PartRow = {
  id: string;
  customerCode: string;
  partNumber: string;
  revision: string;
  description: string;
  substrate: string;
  hardnessHrc: number | null;
  tensileMpa: number | null;
  area: number;
  weight: number | null;
};

const text = 'agTextColumnFilter';
const number = 'agNumberColumnFilter';
const sig = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? formatNumber(v, 3) : '');

export function PartGrid({ customerId, unitSystem, height }: { customerId?: string; unitSystem: UnitSystem; height?: number }) {
  const columns = useMemo<ColDef<PartRow>[]>(() => {
    const area = UNITS[displayUnit('area', unitSystem)].symbol;
    const mass = UNITS[displayUnit('mass', unitSystem)].symbol;
    return [
      ...(customerId ? [] : [{ field: 'customerCode', headerName: 'Customer', filter: text, maxWidth: 130 } as ColDef<PartRow>]),
      { field: 'partNumber', headerName: 'Part number', filter: text, minWidth: 160 },
      { field: 'revision', headerName: 'Rev', filter: text, maxWidth: 90 },
      { field: 'description', headerName: 'Description', filter: text, sortable: false, minWidth: 220 },
      { field: 'substrate', headerName: 'Substrate', filter: text, valueFormatter: (p) => SUBSTRATES[p.value as keyof typeof SUBSTRATES]?.name ?? String(p.value ?? '') },
      { field: 'hardnessHrc', headerName: 'HRC', filter: number, maxWidth: 100 },
      { field: 'tensileMpa', headerName: 'Tensile (MPa)', filter: number, maxWidth: 140 },
      { field: 'area', headerName: `Area (${area})`, filter: number, valueFormatter: (p) => sig(p.value) },
      { field: 'weight', headerName: `Weight (${mass})`, filter: number, valueFormatter: (p) => sig(p.value) },
    ];
  }, [customerId, unitSystem]);
  const url = customerId ? `/api/parts?customerId=${customerId}` : '/api/parts';
  return (
    <DataGrid<PartRow>
      url={url}
      columns={columns}
      label="Parts"
      height={height}
      searchPlaceholder="Part number, description or customer"
      getRowHref={(row) => `/parts/${row.id}`}
    />
  );
}
