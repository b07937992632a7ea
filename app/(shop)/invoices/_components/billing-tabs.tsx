import { LinkTabs } from '@/components/ui/tabs';

export function BillingTabs({ canIssue }: { canIssue: boolean }) {
  return (
    <LinkTabs
      label="Billing"
      items={[
        { href: '/invoices', label: 'Invoices' },
        ...(canIssue ? [{ href: '/invoices/new', label: 'New invoice' }] : []),
        { href: '/invoices/receivables', label: 'Receivables' },
        { href: '/invoices/exceptions', label: 'Payment exceptions' },
      ]}
    />
  );
}
