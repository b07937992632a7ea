import type { Metadata } from 'next';
import { AccountPage } from '@/components/account/account-page';
import { requirePageUser } from '@/lib/auth/current-user';

export const metadata: Metadata = { title: 'Your account' };

export default async function CustomerAccountPage() {
  const user = await requirePageUser('portal.use', '/portal/account');
  return <AccountPage user={user} />;
}
