import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { LinkButton } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { cautionTexts } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SimpleTable } from '@/components/ui/simple-table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { getFamily } from '@/lib/families';
import { finishHazards } from '@/lib/finishes/hazards';
import { findFinishes } from '@/lib/finishes/queries';
import { findMetal, formatStoredQuantity } from '@/lib/plating';

export const metadata: Metadata = { title: 'Finishes' };

export default async function FinishesPage() {
  const user = await requirePageUser('quotes.read', '/finishes');
  const finishes = await findFinishes();
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Finishes"
        description="What customers order and how the shop runs it: route, metal, thickness and the figures quotes are priced from."
        actions={can(user, 'quotes.write') ? <LinkButton href="/finishes/new">New finish</LinkButton> : null}
      />
      <Card padding="none">
        <SimpleTable
          caption="Finishes"
          rows={finishes}
          rowKey={(f) => f.id}
          empty={<EmptyState title="No finishes yet" />}
          rowAttributes={(f) => ({ className: f.is_active ? undefined : 'text-ink-muted' })}
          columns={[
            {
              header: 'Code',
              cell: (f) => (
                <>
                  <Link href={`/finishes/${f.id}`}>{f.code}</Link>
                  {f.is_active ? null : (
                    <Badge tone="outline" className="ml-2">
                      retired
                    </Badge>
                  )}
                </>
              ),
            },
            {
              header: 'Name and specification',
              cell: (f) => (
                <>
                  {f.name}
                  {f.spec_text ? <div className="text-xs text-ink-muted">{f.spec_text}</div> : null}
                </>
              ),
            },
            { header: 'Process', cell: (f) => { const fam = getFamily(f.family); return fam.metal ? fam.label : `${fam.label}: ${findMetal(f.element, f.ion_charge)?.ion ?? f.element}`; } },
            { header: 'Minimum', numeric: true, cell: (f) => formatStoredQuantity(f.min_thickness_um, 'thickness', user.unitSystem) },
            { header: 'Method', cell: (f) => f.method },
            {
              header: 'Cautions',
              cell: (f) =>
                finishHazards({ family: f.family, familyParams: f.family_params, element: f.element, ionCharge: f.ion_charge, route: f.process_route, bakeRequired: f.bake_required, words: `${f.name} ${f.spec_text}` }).map((k) => (
                  <Badge key={k} tone="copper" className="mr-1">
                    {cautionTexts[k].title}
                  </Badge>
                )),
            },
          ]}
        />
      </Card>
    </div>
  );
}
