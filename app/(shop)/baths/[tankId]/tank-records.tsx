import Link from 'next/link';
import { formatBathValue } from '@/components/bath/bath-value';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import type { findRecentAdditions, findRecentAnalyses } from '@/lib/bath/history';
import { describeRules, isRuleId } from '@/lib/bath/run-rules';
import { formatWhen } from '@/lib/bath/display';
import type { UnitSystem } from '@/lib/plating/units';

const SOURCE: Record<string, string> = { floor: 'floor', office: 'office', lab: 'outside lab', seed: 'history' };

type Analyses = Awaited<ReturnType<typeof findRecentAnalyses>>;
type Additions = Awaited<ReturnType<typeof findRecentAdditions>>;

/** Analyses as entered: a corrected one stays, struck through, next to the entry that replaced it. */
export function AnalysesTable({ rows, tankCode, system, canCorrect }: { rows: Analyses; tankCode: string; system: UnitSystem; canCorrect: boolean }) {
  if (rows.length === 0) return <EmptyState title="No analyses yet" description="Log one from the Floor screen, or upload an outside lab's results." />;
  return (
    <Table caption="Recent analyses" captionHidden dense>
      <THead>
        <tr>
          <Th>Taken</Th>
          <Th>Analyte</Th>
          <Th numeric>Value</Th>
          <Th>Status</Th>
          <Th>Rules fired</Th>
          <Th>By</Th>
          <Th>
            <span className="sr-only">Correct</span>
          </Th>
        </tr>
      </THead>
      <TBody>
        {rows.map((r) => {
          const superseded = !!r.superseded_by_id;
          return (
            <Tr key={r.id} className={superseded ? 'text-ink-faint' : undefined} data-superseded={superseded || undefined}>
              <Td className={superseded ? 'line-through' : undefined}>{formatWhen(r.taken_at)}</Td>
              <Td className={superseded ? 'line-through' : undefined}>{r.analyte_name}</Td>
              <Td numeric className={superseded ? 'line-through' : undefined}>
                {formatBathValue(r.value, r.unit, system)}
              </Td>
              <Td>
                {superseded ? <Badge tone="outline">Corrected</Badge> : <VerdictBadge verdict={r.verdict} size="sm" />}
                {r.supersedes_id ? <Badge tone="action" className="ml-1">Correction</Badge> : null}
              </Td>
              <Td className="max-w-64 text-xs">{r.rules.filter(isRuleId).length ? describeRules(r.rules.filter(isRuleId)) : '—'}</Td>
              <Td className="text-xs">
                {r.logged_by_name} · {SOURCE[r.source] ?? r.source}
              </Td>
              <Td>
                {canCorrect && !superseded ? (
                  <Link href={`/floor/tanks/${tankCode}/analytes/${r.analyte_key}?correct=${r.id}`} className="text-action underline">
                    Correct
                  </Link>
                ) : null}
              </Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}

export function AdditionsTable({ rows, system }: { rows: Additions; system: UnitSystem }) {
  if (rows.length === 0) return <EmptyState title="No additions yet" description="Additions recorded at the tank appear here." />;
  return (
    <Table caption="Recent additions" captionHidden dense>
      <THead>
        <tr>
          <Th>Made</Th>
          <Th>Material</Th>
          <Th numeric>Amount</Th>
          <Th numeric>Recommended</Th>
          <Th>For</Th>
          <Th>By</Th>
        </tr>
      </THead>
      <TBody>
        {rows.map((r) => {
          const superseded = !!r.superseded_by_id;
          return (
            <Tr key={r.id} className={superseded ? 'text-ink-faint line-through' : undefined}>
              <Td>{formatWhen(r.made_at)}</Td>
              <Td>{r.material}</Td>
              <Td numeric>{formatBathValue(r.amount, r.unit, system)}</Td>
              <Td numeric>{r.recommended_amount !== null && r.recommended_unit ? formatBathValue(r.recommended_amount, r.recommended_unit, system) : '—'}</Td>
              <Td className="text-xs">{r.analyte_name ?? 'whole bath'}{r.reason ? ` · ${r.reason}` : ''}</Td>
              <Td className="text-xs">{r.made_by_name}</Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}
