import type { Metadata } from 'next';
import { AccountPage } from '@/components/account/account-page';
import { requirePageUser } from '@/lib/auth/current-user';

export const metadata: Metadata = { title: 'Your account' };

export default async function StaffAccountPage() {
  const user = await requirePageUser('staff.area', '/account');
  return <AccountPage user={user} />;
}
