import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import type { Role } from '@/db/types';
import { formatMoney } from '@/components/money';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { countOpenExceptions } from '@/lib/billing/exceptions';
import { creditsOnAccount } from '@/lib/billing/queries';
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

/** The owner's money to look at: payment exceptions and customers' credit on account. */
async function MoneyToCheck() {
  const [exceptions, receivables] = await Promise.all([countOpenExceptions(), creditsOnAccount()]);
  if (exceptions.count === 0 && receivables.creditCents === 0) return null;
  return (
    <div className="grid gap-4 sm:grid-cols-2" role="region" aria-label="Money to check">
      {exceptions.count > 0 ? (
        <Link href="/invoices/exceptions" className="no-underline">
          <Card title={`${exceptions.count} payment exception${exceptions.count === 1 ? '' : 's'} to review`} className="h-full border-copper hover:border-action">
            <span className="text-sm">
              {exceptions.offBooksCents > 0 ? `${formatMoney(exceptions.offBooksCents)} received is on no invoice yet. ` : ''}
              <span className="text-action">Open payment exceptions →</span>
            </span>
          </Card>
        </Link>
      ) : null}
      {receivables.creditCents > 0 ? (
        <Link href="/invoices/receivables" className="no-underline">
          <Card title={`Credit on account: ${formatMoney(receivables.creditCents)}`} className="h-full hover:border-action">
            <span className="text-sm">
              Held for {receivables.credits.map((c) => c.customerName).join(', ')}. <span className="text-action">Open receivables →</span>
            </span>
          </Card>
        </Link>
      ) : null}
    </div>
  );
}

export default async function HomePage() {
  const user = await requirePageUser('staff.area', '/home');
  const links = navFor(user.role, STAFF_NAV, { demoMode: isDemoMode() }).filter((l) => l.href !== '/home');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader eyebrow={ROLE_LABELS[user.role]} title={`Good to see you, ${user.name.split(' ')[0]}`} description={FOCUS[user.role as Exclude<Role, 'customer'>]} />
      {can(user, 'invoices.read') ? <MoneyToCheck /> : null}
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
