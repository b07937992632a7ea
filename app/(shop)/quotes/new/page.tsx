import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { findCustomersForQuote } from '@/lib/quotes/queries';
import { NewQuoteForm } from './new-quote-form';

export const metadata: Metadata = { title: 'New quote' };

export default async function NewQuotePage({ searchParams }: { searchParams: Promise<{ customer?: string }> }) {
  await requirePageUser('quotes.write', '/quotes/new');
  const [customers, sp] = await Promise.all([findCustomersForQuote(), searchParams]);
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={<Link href="/quotes">Quotes</Link>}
        title="New quote"
        description="Start a draft for a customer; the rates in force today apply. Add lines on the next page."
      />
      <Card>
        <NewQuoteForm customers={customers} customerId={customers.some((c) => c.id === sp.customer) ? sp.customer : undefined} />
      </Card>
    </div>
  );
}
