import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { Money } from '@/components/money';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { requirePageUser } from '@/lib/auth/current-user';
import { rateFormDefaults } from '@/lib/rates/form-defaults';
import { databaseToday, findRateSets } from '@/lib/rates/queries';
import { RateForm } from './rate-form';

export const metadata: Metadata = { title: 'Rates' };

const TONE = { 'in force': 'action', scheduled: 'copper', past: 'outline' } as const;

export default async function RatesPage() {
  await requirePageUser('rates.manage', '/settings/rates');
  const today = await databaseToday();
  const sets = await findRateSets(today);
  const inForce = sets.find((s) => s.status === 'in force') ?? null;
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Rates"
        description={inForce ? `The set in force today (${today}) took effect on ${inForce.effective_day}. Sets that have taken effect are kept unchanged.` : 'No rate set is in force today: quotes cannot be priced until one is.'}
      />
      <Card title="Rate sets" padding="none">
        <Table caption="Rate sets" captionHidden>
          <THead>
            <Tr>
              <Th>Takes effect</Th>
              <Th>Status</Th>
              <Th numeric>Labour / h</Th>
              <Th numeric>Minimum charge</Th>
              <Th numeric>Margin</Th>
            </Tr>
          </THead>
          <TBody>
            {sets.map((s) => (
              <Tr key={s.id}>
                <Td>
                  <Link href={`/settings/rates/${s.id}`}>{s.effective_day}</Link>
                </Td>
                <Td>
                  <Badge tone={TONE[s.status]}>{s.status}</Badge>
                </Td>
                <Td numeric>
                  <Money cents={s.labour_per_hour_cents} />
                </Td>
                <Td numeric>
                  <Money cents={s.minimum_charge_cents} />
                </Td>
                <Td numeric>{s.margin_pct} %</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      </Card>
      <Card title="Add a rate set" description="Starts from the set in force today. It takes effect on the date you choose (today or later).">
        <RateForm defaults={rateFormDefaults(inForce, { asNewOn: today })} readOnly={false} submitLabel="Add rate set" />
      </Card>
    </div>
  );
}
