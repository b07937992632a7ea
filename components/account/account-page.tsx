import type { SessionUser } from '@/lib/auth/current-user';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { ChangePasswordForm } from './change-password-form';
import { UnitSystemForm } from './unit-system-form';
import { SecondFactorPanel } from './second-factor-panel';
import { secondFactorStatus } from '@/lib/auth/second-factor';

export async function AccountPage({ user }: { user: SessionUser }) {
  const factor = await secondFactorStatus(user.id);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Your account" description={`${user.name} · ${user.email} · ${ROLE_LABELS[user.role]}`} />
      <Card title="Units">
        <UnitSystemForm current={user.unitSystem} />
      </Card>
      <Card title="Password">
        <ChangePasswordForm email={user.email} />
      </Card>
      <Card title="Second factor">
        <SecondFactorPanel {...factor} />
      </Card>
    </div>
  );
}
