import Link from 'next/link';
import { EmptyState } from '@/components/ui/empty-state';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { displayUnit, fromStorage, type UnitSystem } from '@/lib/plating';
import { formatValue } from '@/lib/estimating/format';
import type { CalculationSummary } from '@/lib/estimating/queries';

const WHEN = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

export function RecentCalculations({ rows, system }: { rows: CalculationSummary[]; system: UnitSystem }) {
  if (rows.length === 0) {
    return <EmptyState title="No saved calculations yet" description="Save one from the workbench above; quotes and parts can then use it." />;
  }
  const area = displayUnit('area', system);
  return (
    <Table caption="Recent calculations" captionHidden>
      <THead>
        <Tr>
          <Th>Title</Th>
          <Th>Metal</Th>
          <Th numeric>Quantity</Th>
          <Th numeric>Area per part</Th>
          <Th>Saved</Th>
        </Tr>
      </THead>
      <TBody>
        {rows.map((r) => (
          <Tr key={r.id}>
            <Td>
              <Link href={`/estimating/workbench?calc=${r.id}`} className="font-medium text-action underline-offset-2 hover:underline">
                {r.title}
              </Link>
            </Td>
            <Td>{r.metalName ?? '—'}</Td>
            <Td numeric>{r.quantity ?? '—'}</Td>
            <Td numeric>{formatValue(fromStorage(r.areaDm2, area), area)}</Td>
            <Td>
              {WHEN.format(r.createdAt)} UTC{r.createdBy ? ` · ${r.createdBy}` : ''}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
