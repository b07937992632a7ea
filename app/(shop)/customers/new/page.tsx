import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { createCustomerAction } from '../actions';
import { CustomerForm } from '../customer-form';

export const metadata: Metadata = { title: 'New customer' };

export default async function NewCustomerPage() {
  await requirePageUser('customers.write', '/customers/new');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={<Link href="/customers">← Customers</Link>} title="New customer" />
      <Card>
        <CustomerForm
          action={createCustomerAction}
          submitLabel="Add customer"
          defaults={{ code: '', name: '', billingAddress: '', shippingAddress: '', billingEmail: '', phone: '', paymentTermsDays: '30', taxRatePercent: '0' }}
        />
      </Card>
    </div>
  );
}
