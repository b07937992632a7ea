import { StatusBadge } from '@/components/ui/status-badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import type { LotReading } from '@/lib/quality/lot-types';
import { formatShopTime } from '@/lib/quality/shop-time';
import { VoidReadingForm } from './small-forms';

type Props = { readings: readonly LotReading[]; q: (um: number) => string; tz: string; workOrderId: string; canVoid: boolean };

export function ReadingsTable({ readings, q, tz, workOrderId, canVoid }: Props) {
  return (
    <Table dense caption="Readings" captionHidden>
      <THead>
        <tr>
          <Th numeric>Part</Th>
          <Th>Location</Th>
          <Th>Method</Th>
          <Th numeric>Thickness</Th>
          <Th>Verdict</Th>
          <Th>Recorded</Th>
          {canVoid ? <Th>Void</Th> : null}
        </tr>
      </THead>
      <TBody>
        {readings.map((r) => (
          <Tr key={r.id}>
            <Td numeric>{r.partNo}</Td>
            <Td>{r.location}</Td>
            <Td>ASTM {r.method}</Td>
            <Td numeric>{q(r.thicknessUm)}</Td>
            <Td>
              {r.status === 'pass' ? (
                <StatusBadge status="ok" label="Conforms" size="sm" />
              ) : (
                <StatusBadge status="out" label={r.status === 'below_minimum' ? 'Below minimum' : 'Above maximum'} size="sm" />
              )}
            </Td>
            <Td className="text-xs text-ink-muted">
              {formatShopTime(r.recordedAt, tz)} · {r.recordedByName ?? '—'} {r.entry === 'csv' ? '· CSV' : ''}
            </Td>
            {canVoid ? (
              <Td>
                <VoidReadingForm workOrderId={workOrderId} readingId={r.id} />
              </Td>
            ) : null}
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
