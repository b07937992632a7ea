import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { SimpleTable } from '@/components/ui/simple-table';
import { displayUnit, fromStorage, type UnitSystem } from '@/lib/plating';
import { formatValue } from '@/lib/estimating/format';
import type { CalculationSummary } from '@/lib/estimating/queries';
import { formatDateTime } from '@/lib/quotes/format';


export function RecentCalculations({ rows, system }: { rows: CalculationSummary[]; system: UnitSystem }) {
  const area = displayUnit('area', system);
  return (
    <SimpleTable
      caption="Recent calculations"
      rows={rows}
      rowKey={(r) => r.id}
      empty={<EmptyState title="No saved calculations yet" description="Save one from the workbench above; quotes and parts can then use it." />}
      columns={[
        {
          header: 'Title',
          cell: (r) => (
            <Link href={`/estimating/workbench?calc=${r.id}`} className="font-medium text-action underline-offset-2 hover:underline">
              {r.title}
            </Link>
          ),
        },
        { header: 'Metal', cell: (r) => r.metalName ?? '—' },
        { header: 'Quantity', numeric: true, cell: (r) => r.quantity ?? '—' },
        { header: 'Area per part', numeric: true, cell: (r) => formatValue(fromStorage(r.areaDm2, area), area) },
        { header: 'Saved', cell: (r) => `${formatDateTime(r.createdAt)}${r.createdBy ? ` · ${r.createdBy}` : ''}` },
      ]}
    />
  );
}
