import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { Z14_LEVEL_II } from '@/lib/quality/sampling';
import { findSamplingPlanHistory, getActivePlan } from '@/lib/quality/sampling-plans';
import { formatShopTime, shopTimeZone } from '@/lib/quality/shop-time';
import { SamplingForm } from './sampling-form';

export const metadata: Metadata = { title: 'Sampling plan' };

export default async function SamplingPage() {
  const user = await requirePageUser('quality.read', '/quality/sampling');
  const [plan, history] = await Promise.all([getActivePlan(), findSamplingPlanHistory()]);
  const tz = shopTimeZone();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader title="Sampling plan" description="How many parts of a lot to measure for thickness. Every work order's quality page shows the number from this table." />
      <Card title={plan.name} description={`Source: ${plan.source || '—'}`} padding="none">
        <Table dense caption="Active sampling table" captionHidden>
          <THead>
            <tr>
              <Th>Lot size</Th>
              <Th>Code letter</Th>
              <Th numeric>Parts to measure</Th>
            </tr>
          </THead>
          <TBody>
            {plan.rows.map((r) => (
              <Tr key={r.minLot}>
                <Td className="tabular">{r.maxLot === null ? `${r.minLot.toLocaleString('en-US')} and over` : `${r.minLot.toLocaleString('en-US')} to ${r.maxLot.toLocaleString('en-US')}`}</Td>
                <Td>{r.codeLetter}</Td>
                <Td numeric>{r.sampleSize}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
        <p className="px-4 py-3 text-xs text-ink-muted">When the sample is as large as the lot, every part is measured. A lot smaller than the first row is measured whole.</p>
      </Card>
      {can(user, 'quality.disposition') ? (
        <Card title="Change the table" description="Rows must follow on without gaps, sample sizes must not fall, and the last row is open-ended.">
          <SamplingForm rows={plan.rows} name={plan.name} source={plan.source} published={[...Z14_LEVEL_II]} />
        </Card>
      ) : null}
      {history.length > 1 ? (
        <Card title="Earlier plans">
          <ul className="text-sm">
            {history.map((h) => (
              <li key={h.id}>
                {h.name} · {formatShopTime(h.created_at, tz)} {h.created_by_name ? `by ${h.created_by_name}` : '(seeded)'} {h.is_active ? '· in force' : ''}
              </li>
            ))}
          </ul>
        </Card>
      ) : null}
    </div>
  );
}
