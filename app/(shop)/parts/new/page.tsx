import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findCustomerOptions } from '@/lib/customers/queries';
import { partFormDefaults } from '@/lib/parts/form-defaults';
import { PartForm } from '../part-form';

export const metadata: Metadata = { title: 'New part' };

export default async function NewPartPage({ searchParams }: { searchParams: Promise<{ customerId?: string }> }) {
  const user = await requirePageUser('customers.write', '/parts/new');
  const { customerId } = await searchParams;
  const customers = await findCustomerOptions();
  const known = customers.some((c) => c.id === customerId) ? customerId : '';
  return (
    <div className="flex flex-col gap-4">
      <PageHeader eyebrow={<Link href="/parts">← Parts</Link>} title="New part" />
      <Card>
        <PartForm defaults={partFormDefaults(null, user.unitSystem, known)} customers={customers} unitSystem={user.unitSystem} />
      </Card>
    </div>
  );
}
