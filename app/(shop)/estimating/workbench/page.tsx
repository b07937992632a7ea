import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findProcessLibrary, findRecentCalculations, getCalculation } from '@/lib/estimating/queries';
import { FamilyCalculators } from './family-calculators';
import { RecentCalculations } from './recent-calculations';
import { getAllFamilyData } from '@/lib/families/shop-data-queries';
import { Workbench } from './workbench';

export const metadata: Metadata = { title: 'Workbench' };

export default async function WorkbenchPage({ searchParams }: { searchParams: Promise<{ calc?: string }> }) {
  const user = await requirePageUser('plating.estimate', '/estimating/workbench');
  const { calc } = await searchParams;
  const [library, recent, saved, familyData] = await Promise.all([
    findProcessLibrary(),
    findRecentCalculations(),
    calc ? getCalculation(calc) : Promise.resolve(null),
    getAllFamilyData(),
  ]);
  if (calc && !saved) notFound();
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Estimator's workbench"
        description="Area, amp-hours, plating time, loads, metal and energy for a plating job. The figures follow every change you type."
        eyebrow={saved ? `Saved calculation · ${saved.title}` : 'Estimating'}
      />
      {saved && !saved.input ? (
        <FormMessage tone="error" message="This calculation was saved in a form the workbench can no longer read; starting from the defaults instead." />
      ) : null}
      <Workbench key={saved?.id ?? 'new'} system={user.unitSystem} library={library} initial={saved?.input ?? null} initialTitle={saved?.title ?? null} />
      <Card title="Other lines" description="Anodizing, electroless nickel, passivation and zinc life: the figures each process needs, in your units. Quotes price them from the finish and the tank.">
        <FamilyCalculators system={user.unitSystem} familyData={familyData} />
      </Card>
      <Card title="Recent calculations" description="Open one to see it again in the workbench, in your units." padding="none">
        <RecentCalculations rows={recent} system={user.unitSystem} />
      </Card>
    </div>
  );
}
