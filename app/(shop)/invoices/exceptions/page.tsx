import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { EXCEPTION_WORDS, findPaymentExceptions, formatExceptionAmount } from '@/lib/billing/exceptions';
import { formatDateTime } from '@/lib/quotes/format';
import { BillingTabs } from '../_components/billing-tabs';
import { LINK } from '../_components/invoice-view';
import { ResolveExceptionForm } from './resolve-form';

export const metadata: Metadata = { title: 'Payment exceptions' };

type Props = { searchParams: Promise<{ status?: string; before?: string }> };

/** "before" is the last row of the previous page: its time and id. */
function parseCursor(before: string | undefined): { createdAt: Date; id: string } | undefined {
  const m = /^(\d{4}-\d{2}-\d{2}T[\d:.]+Z)_([0-9a-f-]{36})$/.exec(before ?? '');
  if (!m) return undefined;
  const createdAt = new Date(m[1]!);
  return Number.isNaN(createdAt.getTime()) ? undefined : { createdAt, id: m[2]! };
}

export default async function PaymentExceptionsPage({ searchParams }: Props) {
  const user = await requirePageUser('invoices.read', '/invoices/exceptions');
  const params = await searchParams;
  const status = params.status === 'resolved' ? 'resolved' : 'open';
  const { rows, hasMore } = await findPaymentExceptions({ status, before: parseCursor(params.before) });
  const mayResolve = can(user, 'invoices.issue');
  const last = rows[rows.length - 1];
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Payment exceptions"
        description="Payments that did not match what was asked: a different amount, another currency, an unknown or settled invoice, another customer's invoice. Each keeps everything the payment service sent."
      />
      <BillingTabs canIssue={mayResolve} />
      <p className="text-sm">
        {status === 'open' ? (
          <>Showing open exceptions · <Link href="/invoices/exceptions?status=resolved" className={LINK}>show resolved</Link></>
        ) : (
          <>Showing resolved exceptions · <Link href="/invoices/exceptions" className={LINK}>show open</Link></>
        )}
      </p>
      {rows.length === 0 ? (
        <EmptyState title={status === 'open' ? 'No open exceptions' : 'Nothing resolved yet'} description="Every payment received so far matched its invoice." />
      ) : (
        <div className="flex flex-col gap-3">
          {rows.map((e) => (
            <Card
              key={e.id}
              title={`${EXCEPTION_WORDS[e.reason]}: ${formatExceptionAmount(e.amount_cents, e.currency)}`}
              description={`${formatDateTime(e.created_at)} · ${e.source === 'stripe' ? 'card payment online' : 'recorded by the office'}`}
            >
              <div className="grid gap-3 text-sm md:grid-cols-[1fr_18rem]">
                <div className="flex flex-col gap-2">
                  <p>{e.message}</p>
                  <p className="flex flex-wrap items-center gap-2">
                    {e.payment_id ? <Badge tone="neutral">On the invoice</Badge> : <Badge tone="copper">On no invoice</Badge>}
                    {e.invoice_id && e.invoice_number ? (
                      <Link href={`/invoices/${e.invoice_id}`} className={LINK}>Invoice {e.invoice_number}</Link>
                    ) : null}
                    {e.customer_name ? <span className="text-ink-muted">{e.customer_name}</span> : null}
                    {e.stripe_payment_intent_id ? <span className="font-mono text-xs text-ink-muted">{e.stripe_payment_intent_id}</span> : null}
                  </p>
                  <details>
                    <summary className="cursor-pointer text-ink-muted">What the payment service sent</summary>
                    <pre className="mt-2 max-h-64 overflow-auto rounded bg-surface-sunken p-2 text-xs">{JSON.stringify(e.payload, null, 2)}</pre>
                  </details>
                  {e.status === 'resolved' ? <p className="text-ink-muted">Resolved {e.resolved_at ? formatDateTime(e.resolved_at) : ''}: {e.resolution}</p> : null}
                </div>
                {e.status === 'open' && mayResolve ? (
                  <div>
                    <ResolveExceptionForm exceptionId={e.id} onBooks={!!e.payment_id} />
                    {e.payment_id && e.invoice_id ? (
                      <p className="mt-2 text-xs text-ink-muted">To give the excess back, refund it from the invoice&apos;s page first.</p>
                    ) : null}
                  </div>
                ) : null}
              </div>
            </Card>
          ))}
          {hasMore && last ? (
            <Link className={LINK} href={`/invoices/exceptions?${new URLSearchParams({ ...(status === 'resolved' ? { status } : {}), before: `${last.created_at.toISOString()}_${last.id}` })}`}>
              Older exceptions →
            </Link>
          ) : null}
        </div>
      )}
    </div>
  );
}
