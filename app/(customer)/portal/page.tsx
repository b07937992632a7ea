import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { getOwnCustomer } from '@/lib/customers/queries';

export const metadata: Metadata = { title: 'Customer area' };

export default async function PortalHome() {
  const user = await requirePageUser('portal.use', '/portal');
  const customer = await getOwnCustomer(user);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title={customer?.name ?? 'Your company'} description={`Signed in as ${user.name}. Everything here belongs to your company only.`} />
      <div className="grid gap-4 sm:grid-cols-2">
        <Card title="Quotes">Quotes sent to you appear here, ready to accept with your purchase-order number or to decline.</Card>
        <Card title="Orders">Your parts in our shop and where they stand: received, plating, baking, inspection, shipped.</Card>
        <Card title="Certificates">Certificates of conformance for every lot we ship, to download.</Card>
        <Card title="Invoices">Invoices with their status, and a button to pay online.</Card>
      </div>
      {customer ? (
        <Card title="Account details">
          <dl className="grid gap-2 text-sm sm:grid-cols-[10rem_1fr]">
            <dt className="text-ink-muted">Billing address</dt>
            <dd>{customer.billing_address}</dd>
            <dt className="text-ink-muted">Ship to</dt>
            <dd>{customer.shipping_address}</dd>
            <dt className="text-ink-muted">Payment terms</dt>
            <dd>Net {customer.payment_terms_days} days</dd>
          </dl>
        </Card>
      ) : null}
    </div>
  );
}
