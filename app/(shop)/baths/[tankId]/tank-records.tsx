import Link from 'next/link';
import { formatBathValue } from '@/components/bath/bath-value';
import { VerdictBadge } from '@/components/bath/verdict-badge';
import { Badge } from '@/components/ui/badge';
import { EmptyState } from '@/components/ui/empty-state';
import { SimpleTable } from '@/components/ui/simple-table';
import type { findRecentAdditions, findRecentAnalyses } from '@/lib/bath/history';
import { describeRules, isRuleId } from '@/lib/bath/run-rules';
import { formatWhen } from '@/lib/bath/display';
import type { UnitSystem } from '@/lib/plating/units';

const SOURCE: Record<string, string> = { floor: 'floor', office: 'office', lab: 'outside lab', seed: 'history' };

type Analyses = Awaited<ReturnType<typeof findRecentAnalyses>>;
type Additions = Awaited<ReturnType<typeof findRecentAdditions>>;

/** Analyses as entered: a corrected one stays, struck through, next to the entry that replaced it. */
export function AnalysesTable({ rows, tankCode, system, canCorrect }: { rows: Analyses; tankCode: string; system: UnitSystem; canCorrect: boolean }) {
  const struck = (r: Analyses[number]) => (r.superseded_by_id ? 'line-through' : undefined);
  return (
    <SimpleTable
      dense
      caption="Recent analyses"
      rows={rows}
      rowKey={(r) => r.id}
      empty={<EmptyState title="No analyses yet" description="Log one from the Floor screen, or upload an outside lab's results." />}
      rowAttributes={(r) => (r.superseded_by_id ? { className: 'text-ink-faint', 'data-superseded': true } : {})}
      columns={[
        { header: 'Taken', className: struck, cell: (r) => formatWhen(r.taken_at) },
        { header: 'Analyte', className: struck, cell: (r) => r.analyte_name },
        { header: 'Value', numeric: true, className: struck, cell: (r) => formatBathValue(r.value, r.unit, system) },
        {
          header: 'Status',
          cell: (r) => (
            <>
              {r.superseded_by_id ? <Badge tone="outline">Corrected</Badge> : <VerdictBadge verdict={r.verdict} size="sm" />}
              {r.supersedes_id ? <Badge tone="action" className="ml-1">Correction</Badge> : null}
            </>
          ),
        },
        { header: 'Rules fired', className: 'max-w-64 text-xs', cell: (r) => (r.rules.filter(isRuleId).length ? describeRules(r.rules.filter(isRuleId)) : '—') },
        { header: 'By', className: 'text-xs', cell: (r) => `${r.logged_by_name} · ${SOURCE[r.source] ?? r.source}` },
        {
          header: <span className="sr-only">Correct</span>,
          cell: (r) =>
            canCorrect && !r.superseded_by_id ? (
              <Link href={`/floor/tanks/${tankCode}/analytes/${r.analyte_key}?correct=${r.id}`} className="text-action underline">
                Correct
              </Link>
            ) : null,
        },
      ]}
    />
  );
}

export function AdditionsTable({ rows, system }: { rows: Additions; system: UnitSystem }) {
  return (
    <SimpleTable
      dense
      caption="Recent additions"
      rows={rows}
      rowKey={(r) => r.id}
      empty={<EmptyState title="No additions yet" description="Additions recorded at the tank appear here." />}
      rowAttributes={(r) => ({ className: r.superseded_by_id ? 'text-ink-faint line-through' : undefined })}
      columns={[
        { header: 'Made', cell: (r) => formatWhen(r.made_at) },
        { header: 'Material', cell: (r) => r.material },
        { header: 'Amount', numeric: true, cell: (r) => formatBathValue(r.amount, r.unit, system) },
        {
          header: 'Recommended',
          numeric: true,
          cell: (r) => (r.recommended_amount !== null && r.recommended_unit ? formatBathValue(r.recommended_amount, r.recommended_unit, system) : '—'),
        },
        { header: 'For', className: 'text-xs', cell: (r) => `${r.analyte_name ?? 'whole bath'}${r.reason ? ` · ${r.reason}` : ''}` },
        { header: 'By', className: 'text-xs', cell: (r) => r.made_by_name },
      ]}
    />
  );
}
