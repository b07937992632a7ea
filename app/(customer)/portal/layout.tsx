import type { ReactNode } from 'react';
import { forbidden } from 'next/navigation';
import { AppNav } from '@/components/nav/app-nav';
import { Brand } from '@/components/shell/brand';
import { DatabaseUnavailable } from '@/components/shell/database-unavailable';
import { loadLayoutUser } from '@/components/shell/load-user';
import { UserMenu } from '@/components/shell/user-menu';
import { CUSTOMER_NAV, navFor } from '@/lib/nav';

export default async function PortalLayout({ children }: { children: ReactNode }) {
  const user = await loadLayoutUser();
  if (user === 'unavailable') return <DatabaseUnavailable />;
  if (user.role !== 'customer') forbidden();
  return (
    <div className="min-h-screen">
      <AppNav
        variant="top"
        label="Customer area"
        items={navFor(user.role, CUSTOMER_NAV, { demoMode: false }).map(({ href, label }) => ({ href, label }))}
        brand={<Brand href="/portal" subtitle="Customer area" />}
        footer={<UserMenu user={user} accountHref="/portal/account" inline />}
        className="border-b border-surface-line bg-surface"
      />
      <main className="mx-auto max-w-5xl px-4 py-6">{children}</main>
    </div>
  );
}
