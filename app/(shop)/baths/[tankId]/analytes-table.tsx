import Link from 'next/link';
import { formatBathValue } from '@/components/bath/bath-value';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { Badge } from '@/components/ui/badge';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import type { AnalyteStatus } from '@/lib/bath/queries';
import { formatWhen } from '@/lib/bath/display';
import type { UnitSystem } from '@/lib/plating/units';
import { LimitsForm } from './limits-form';


type Props = { tankId: string; analytes: AnalyteStatus[]; system: UnitSystem; canEditLimits: boolean };

/** Each analyte: latest value and verdict, limits, schedule, its chart, and (supervisors) its limits form. */
export function AnalytesTable({ tankId, analytes, system, canEditLimits }: Props) {
  const fmt = (v: number | null, unit: string) => (v === null ? '—' : formatBathValue(v, unit, system));
  return (
    <div className="flex flex-col gap-3">
      <Table caption="Analytes" captionHidden>
        <THead>
          <tr>
            <Th>Analyte</Th>
            <Th numeric>Latest</Th>
            <Th>Status</Th>
            <Th numeric>Target</Th>
            <Th>Control limits</Th>
            <Th>Specification</Th>
            <Th>Every</Th>
            <Th>Last analysed</Th>
            <Th>
              <span className="sr-only">Chart</span>
            </Th>
          </tr>
        </THead>
        <TBody>
          {analytes.map((a) => (
            <Tr key={a.id}>
              <Td className="font-medium">
                {a.name}
                <span className="block text-xs font-normal text-ink-muted">key: {a.key}</span>
              </Td>
              <Td numeric>{fmt(a.last_value, a.unit)}</Td>
              <Td>
                <VerdictBadge verdict={a.last_verdict} size="sm" />
              </Td>
              <Td numeric>{fmt(a.target, a.unit)}</Td>
              <Td className="whitespace-nowrap">
                {fmt(a.lower_control, a.unit)} – {fmt(a.upper_control, a.unit)}
              </Td>
              <Td className="whitespace-nowrap">{a.lower_spec === null && a.upper_spec === null ? 'none' : `${fmt(a.lower_spec, a.unit)} – ${fmt(a.upper_spec, a.unit)}`}</Td>
              <Td className="whitespace-nowrap">{a.frequency_hours} h</Td>
              <Td className="whitespace-nowrap">
                {a.last_taken_at ? formatWhen(new Date(a.last_taken_at)) : 'never'} {a.is_overdue ? <Badge tone="copper">due</Badge> : null}
              </Td>
              <Td>
                <Link href={`/baths/${tankId}/analytes/${a.id}`} className="text-action underline">
                  Chart
                </Link>
              </Td>
            </Tr>
          ))}
        </TBody>
      </Table>
      <p className="text-xs text-ink-muted">Template values are typical; the supplier&apos;s data sheet governs.</p>
      {canEditLimits ? (
        <div className="flex flex-col gap-2">
          {analytes.map((a) => (
            <details key={a.id} className="rounded-md border border-surface-line bg-surface-muted px-3 py-2">
              <summary className="cursor-pointer text-sm font-medium text-action">Change limits: {a.name}</summary>
              <div className="pt-3">
                <LimitsForm
                  tankId={tankId}
                  analyte={{
                    id: a.id, name: a.name, unit: a.unit, target: a.target, lowerControl: a.lower_control, upperControl: a.upper_control,
                    lowerSpec: a.lower_spec, upperSpec: a.upper_spec, frequencyHours: a.frequency_hours,
                  }}
                />
              </div>
            </details>
          ))}
        </div>
      ) : null}
    </div>
  );
}
