import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Badge } from '@/components/ui/badge';
import { LinkButton } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { formatMoney } from '@/components/money';
import { findInvoices } from '@/lib/billing/queries';
import { findContacts, getCustomer } from '@/lib/customers/queries';
import { InvoiceTable } from '../../invoices/_components/invoice-table';
import { basisPointsToPercentText } from '@/lib/records/fields';
import { PartGrid } from '../../parts/part-grid';
import { updateCustomerAction } from '../actions';
import { CustomerForm } from '../customer-form';
import { AddContactForm, ContactActions } from './contact-forms';

export const metadata: Metadata = { title: 'Customer' };

/** The customer's account with the shop: every invoice, what is owed and the credit on account. */
async function Statement({ customerId }: { customerId: string }) {
  const invoices = await findInvoices('staff', { customerId });
  const owed = invoices.reduce((t, i) => t + Math.max(0, i.openCents), 0);
  const credit = invoices.reduce((t, i) => t + i.excessCents, 0);
  return (
    <Card title="Statement" description={`Owed: ${formatMoney(owed)} · Credit on account: ${formatMoney(credit)}`} padding="none">
      {invoices.length ? <InvoiceTable invoices={invoices} basePath="/invoices" audience="customer" /> : <p className="p-4 text-sm text-ink-muted">No invoices yet.</p>}
    </Card>
  );
}

export default async function CustomerPage({ params }: { params: Promise<{ customerId: string }> }) {
  const { customerId } = await params;
  const user = await requirePageUser('customers.read', `/customers/${customerId}`);
  const customer = await getCustomer(customerId);
  if (!customer) notFound();
  const contacts = await findContacts(customer.id);
  const mayWrite = can(user, 'customers.write');
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href="/customers">← Customers</Link>}
        title={customer.name}
        meta={<Badge tone="outline">{customer.code}</Badge>}
        actions={mayWrite ? <LinkButton href={`/parts/new?customerId=${customer.id}`}>New part</LinkButton> : null}
      />
      <Card title="Details">
        <CustomerForm
          action={updateCustomerAction}
          submitLabel="Save customer"
          readOnly={!mayWrite}
          defaults={{
            customerId: customer.id,
            code: customer.code,
            name: customer.name,
            billingAddress: customer.billing_address,
            shippingAddress: customer.shipping_address,
            billingEmail: customer.billing_email ?? '',
            phone: customer.phone,
            paymentTermsDays: String(customer.payment_terms_days),
            taxRatePercent: basisPointsToPercentText(customer.tax_rate_bp),
          }}
        />
      </Card>
      <Card title="Contacts" description="People at this company. A contact who may sign in sees this customer’s quotes, orders and files in the customer area — and nothing else." padding="none">
        {contacts.length === 0 ? (
          <EmptyState title="No contacts yet" description="Add the buyer, the quality contact or accounts payable below." />
        ) : (
          <Table caption="Contacts" captionHidden>
            <THead>
              <Tr>
                <Th>Name</Th>
                <Th>E-mail</Th>
                <Th>Phone</Th>
                <Th>Sign-in</Th>
                {mayWrite ? <Th className="text-right">Actions</Th> : null}
              </Tr>
            </THead>
            <TBody>
              {contacts.map((c) => (
                <Tr key={c.id}>
                  <Td>
                    {c.name}
                    {c.is_billing ? (
                      <Badge tone="copper" className="ml-2">
                        billing
                      </Badge>
                    ) : null}
                  </Td>
                  <Td>{c.email ?? '—'}</Td>
                  <Td>{c.phone || '—'}</Td>
                  <Td>{c.user_id ? (c.has_signed_in ? 'Has an account' : 'Invited') : 'No'}</Td>
                  {mayWrite ? (
                    <Td className="text-right">
                      <ContactActions customerId={customer.id} contactId={c.id} canInvite={!c.user_id && !!c.email} />
                    </Td>
                  ) : null}
                </Tr>
              ))}
            </TBody>
          </Table>
        )}
        {mayWrite ? (
          <div className="border-t border-surface-line p-4">
            <h3 className="mb-3 text-base font-semibold">Add a contact</h3>
            <AddContactForm customerId={customer.id} />
          </div>
        ) : null}
      </Card>
      <Card title="Parts">
        <PartGrid customerId={customer.id} unitSystem={user.unitSystem} height={360} />
      </Card>
      {can(user, 'invoices.read') ? <Statement customerId={customer.id} /> : null}
    </div>
  );
}
