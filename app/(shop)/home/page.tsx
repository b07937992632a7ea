import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import type { Role } from '@/db/types';
import { requirePageUser } from '@/lib/auth/current-user';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { isDemoMode } from '@/lib/email/mailbox';
import { navFor, STAFF_NAV } from '@/lib/nav';

export const metadata: Metadata = { title: 'Home' };

const FOCUS: Record<Exclude<Role, 'customer'>, string> = {
  owner: 'Users, rates and settings, receivables and how each job paid off.',
  estimator: 'Price requests from part area, thickness and bath efficiency, and send quotes.',
  plater: 'Log bath analyses, additions, rectifier amp-hours and plating runs at the tank.',
  supervisor: 'Watch out-of-range baths and control charts, inspect lots and sign certificates.',
};

export default async function HomePage() {
  const user = await requirePageUser('staff.area', '/home');
  const links = navFor(user.role, STAFF_NAV, { demoMode: isDemoMode() }).filter((l) => l.href !== '/home');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader eyebrow={ROLE_LABELS[user.role]} title={`Good to see you, ${user.name.split(' ')[0]}`} description={FOCUS[user.role as Exclude<Role, 'customer'>]} />
      {links.length ? (
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {links.map((l) => (
            <Link key={l.href} href={l.href} className="no-underline">
              <Card title={l.label} className="h-full hover:border-action">
                <span className="text-sm text-action">Open {l.label.toLowerCase()} →</span>
              </Card>
            </Link>
          ))}
        </div>
      ) : null}
    </div>
  );
}
