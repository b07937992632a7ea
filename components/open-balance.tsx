import { Money } from './money';

/**
 * What is owed on an invoice, said one way everywhere (staff lists, the customer's portal, PDFs):
 * an amount due, or, when more was paid than asked, the excess as credit on account.
 */
export function OpenBalance({ openCents, currency = 'USD' }: { openCents: number; currency?: string }) {
  if (openCents >= 0) return <Money cents={openCents} currency={currency} />;
  return (
    <span className="whitespace-nowrap">
      <Money cents={-openCents} currency={currency} /> <span className="text-ink-muted">credit</span>
    </span>
  );
}
