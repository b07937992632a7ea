import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { SelectField } from '@/components/ui/field';
import { SubmitButton } from '@/components/ui/submit-button';
import { requirePageUser } from '@/lib/auth/current-user';
import { ROUNDING_RULE } from '@/lib/billing/arithmetic';
import { todayIso } from '@/lib/billing/dates';
import { findCustomersToInvoice, invoiceCandidates } from '@/lib/billing/orders';
import { BillingTabs } from '../_components/billing-tabs';
import { RoundingNote } from '../_components/invoice-view';
import { IssueForm } from './issue-form';

export const metadata: Metadata = { title: 'New invoice' };

export default async function NewInvoicePage({ searchParams }: { searchParams: Promise<{ customer?: string }> }) {
  await requirePageUser('invoices.issue', '/invoices/new');
  const { customer } = await searchParams;
  const customers = await findCustomersToInvoice();
  const chosenId = customer ?? (customers.length === 1 ? customers[0]!.id : undefined);
  const chosen = chosenId ? await invoiceCandidates(chosenId) : null;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader title="New invoice" description="Bill one customer's shipped work orders, with any extra charges. Issued invoices are never edited; a credit note corrects one." />
      <BillingTabs canIssue />
      {customers.length === 0 && !chosen ? (
        <EmptyState title="Nothing to invoice" description="Work orders appear here once they are shipped. Every shipped order is already on an invoice." />
      ) : (
        <Card title="Customer">
          {/* A plain GET form: choosing a customer reloads the page with their shipped orders. */}
          <form method="get" action="/invoices/new" className="flex flex-wrap items-end gap-3">
            <SelectField
              label="Customer with shipped orders"
              name="customer"
              defaultValue={chosen?.customer.id ?? ''}
              placeholder="Choose a customer"
              options={customers.map((c) => ({ value: c.id, label: `${c.name} (${c.shipped_orders} shipped)` }))}
              className="min-w-72"
            />
            <SubmitButton variant="secondary">Show shipped orders</SubmitButton>
          </form>
        </Card>
      )}
      {chosen ? (
        <IssueForm
          key={chosen.customer.id}
          customer={{
            id: chosen.customer.id,
            name: chosen.customer.name,
            taxRateBp: chosen.customer.tax_rate_bp,
            termsDays: chosen.customer.payment_terms_days,
            billingEmail: chosen.customer.billing_email,
          }}
          candidates={chosen.candidates}
          today={todayIso()}
        />
      ) : null}
      <RoundingNote rule={ROUNDING_RULE} />
    </div>
  );
}
