import type { ReactNode } from 'react';
import { forbidden } from 'next/navigation';
import { AppNav } from '@/components/nav/app-nav';
import { Brand } from '@/components/shell/brand';
import { DatabaseUnavailable } from '@/components/shell/database-unavailable';
import { loadLayoutUser } from '@/components/shell/load-user';
import { UserMenu } from '@/components/shell/user-menu';
import { isDemoMode } from '@/lib/email/mailbox';
import { navFor, STAFF_NAV } from '@/lib/nav';
import { resolveNavBadges } from '@/lib/bath/nav-badge';

export default async function ShopLayout({ children }: { children: ReactNode }) {
  const user = await loadLayoutUser();
  if (user === 'unavailable') return <DatabaseUnavailable />;
  if (user.role === 'customer') forbidden();
  const items = await resolveNavBadges(navFor(user.role, STAFF_NAV, { demoMode: isDemoMode() }));
  return (
    <div className="min-h-screen md:flex">
      {/* The column stretches the whole height of the page (its panel never ends part-way down a
          long one); the navigation inside it stays in view as the page scrolls. */}
      <div className="md:w-60 md:shrink-0 md:border-r md:border-surface-line md:bg-surface">
        <AppNav
          variant="side"
          items={items}
          brand={<Brand href="/home" />}
          footer={<UserMenu user={user} accountHref="/account" />}
          className="md:sticky md:top-0 md:h-screen md:w-full md:overflow-y-auto"
        />
      </div>
      <main className="min-w-0 flex-1 px-4 py-6 md:px-8">{children}</main>
    </div>
  );
}
