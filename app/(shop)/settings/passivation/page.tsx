import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { windowsOf } from '@/lib/families/passivation/windows';
import { getFamilyData } from '@/lib/families/shop-data-queries';
import { displayUnit, fromStorage, UNITS } from '@/lib/plating';
import { WindowForm } from './window-form';

export const metadata: Metadata = { title: 'Passivation windows' };

const text = (n: number) => String(Number(n.toPrecision(4)));

export default async function PassivationWindowsPage() {
  const user = await requirePageUser('bath.read', '/settings/passivation');
  const windows = windowsOf(await getFamilyData('passivation'));
  const tempUnit = displayUnit('temperature', user.unitSystem);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Passivation windows"
        description="The time, temperature and acid concentration each treatment allows. Quotes, the plater's run screen and each lot's check use these figures; a run outside its window opens a nonconformance."
      />
      <Caution kind={['nitric-acid', 'acid']} compact />
      {windows.map((w) => (
        <Card key={w.id} title={`${w.standard} ${w.treatment}`} description={`Source: ${w.source}`}>
          <WindowForm
            readOnly={!can(user, 'bath.limits')}
            w={{
              id: w.id,
              name: `${w.standard} ${w.treatment}`,
              unit: w.concentration.unit,
              tempUnit: UNITS[tempUnit].symbol,
              concentrationMin: text(w.concentration.min),
              concentrationMax: text(w.concentration.max),
              bands: w.bands.map((b) => ({ minC: text(fromStorage(b.minC, tempUnit)), maxC: text(fromStorage(b.maxC, tempUnit)), minMinutes: text(b.minMinutes) })),
              source: w.source,
            }}
          />
        </Card>
      ))}
    </div>
  );
}
