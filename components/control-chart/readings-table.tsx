import { Table, TBody, Td, Th, THead, Tr } from '../ui/table';
import { formatUnitValue } from '../unit-value';
import type { PreparedPoint } from './chart-model';
import { formatTime, kindWords, MarkSwatch } from './chart-parts';

type ReadingsTableProps = { points: readonly PreparedPoint[]; unit: string; label: string; digits?: number; timeZone?: string };

/** The chart's data as text, for screen readers, printing and checking a single value. */
export function ReadingsTable({ points, unit, label, digits, timeZone }: ReadingsTableProps) {
  return (
    <div className="mt-2 max-h-80 overflow-y-auto rounded-md border border-surface-line">
      <Table caption={`${label} readings`} captionHidden dense>
        <THead>
          <tr>
            <Th>Date</Th>
            <Th numeric>
              {label} ({unit})
            </Th>
            <Th>Status</Th>
            <Th>Rules fired</Th>
          </tr>
        </THead>
        <TBody>
          {points.map((p) => (
            <Tr key={`${p.index}-${p.t}`}>
              <Td>
                <time dateTime={p.t}>{formatTime(p.t, 'full', timeZone)}</time>
              </Td>
              <Td numeric>{formatUnitValue(p.value, unit, { digits })}</Td>
              <Td>
                <span className="inline-flex items-center gap-1.5">
                  <MarkSwatch kind={p.kind} />
                  {kindWords[p.kind]}
                </span>
              </Td>
              <Td>{p.rules.length > 0 ? p.rules.join('; ') : '—'}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
