import type { Metadata } from 'next';
import { LinkButton } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { QuotesGrid } from './quotes-grid';

export const metadata: Metadata = { title: 'Quotes' };

export default async function QuotesPage() {
  const user = await requirePageUser('quotes.read', '/quotes');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Quotes"
        description="Every quote with its revisions. A sent quote past its validity date shows as expired."
        actions={can(user, 'quotes.write') ? <LinkButton href="/quotes/new">New quote</LinkButton> : null}
      />
      <QuotesGrid />
    </div>
  );
}
