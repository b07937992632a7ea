import type { Metadata } from 'next';
import { turnaroundText } from '@/lib/schedule/turnaround';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Money } from '@/components/money';
import { Badge } from '@/components/ui/badge';
import { buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { can, requirePageUser } from '@/lib/auth/current-user';
import { ESTIMATE_CAUTION } from '@/lib/plating';
import { bathHazardsByFinish } from '@/lib/finishes/bath-hazards';
import { quoteHazards } from '@/lib/quotes/hazards';
import { findQuoteChoices, getQuote } from '@/lib/quotes/queries';
import { canRevise, isEditable, QUOTE_STATUS_LABELS, quoteLabel } from '@/lib/quotes/status';
import { clearOverrideAction, removeLineAction, resendQuoteAction, reviseQuoteAction } from '../actions';
import { ActionButton } from './action-button';
import { AddLineForm } from './add-line-form';
import { HeaderForm } from './header-form';
import { QuoteLineCard } from './line-card';
import { QuoteSummary } from './quote-summary';
import { SendForm } from './send-form';

export const metadata: Metadata = { title: 'Quote' };

const UUID = /^[0-9a-f-]{36}$/i;

export default async function QuotePage({ params, searchParams }: { params: Promise<{ quoteId: string }>; searchParams: Promise<{ sent?: string }> }) {
  const [{ quoteId }, { sent }] = await Promise.all([params, searchParams]);
  const user = await requirePageUser('quotes.read', `/quotes/${quoteId}`);
  const quote = UUID.test(quoteId) ? await getQuote(quoteId) : null;
  if (!quote) notFound();
  const status = quote.effective_status;
  const draft = isEditable(status);
  const mayPrice = draft && can(user, 'quotes.price');
  const mayWrite = can(user, 'quotes.write');
  const choices = draft && (mayPrice || mayWrite) ? await findQuoteChoices(quote.customer_id) : null;
  const engineNotes = [...new Set(quote.lines.flatMap((l) => l.cost.cautions).filter((c) => c !== ESTIMATE_CAUTION))];
  const hazards = quoteHazards(quote.lines, await bathHazardsByFinish(quote.lines.map((l) => l.finishId)));

  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={<Link href="/quotes">Quotes</Link>}
        title={<span className="font-mono">{quoteLabel(quote)}</span>}
        meta={
          <>
            <Badge tone={status === 'accepted' ? 'action' : status === 'draft' ? 'outline' : 'copper'}>{QUOTE_STATUS_LABELS[status]}</Badge>
            {quote.is_rush ? <Badge tone="copper">Rush</Badge> : null}
          </>
        }
        description={[`${quote.customer_name} · ${quote.lines.length} line${quote.lines.length === 1 ? '' : 's'}`, turnaroundText(quote.turnaround_days)].filter(Boolean).join(' · ')}
        actions={
          <>
            <a className={buttonClasses({ variant: 'secondary' })} href={`/api/quotes/${quote.id}/pdf`} target="_blank" rel="noopener">
              Quote PDF
            </a>
            {mayWrite && canRevise(status) ? <ActionButton action={reviseQuoteAction} fields={{ quoteId: quote.id }} label={`Revise as rev ${String.fromCharCode(quote.revision.charCodeAt(0) + 1)}`} pendingLabel="Copying…" /> : null}
            {mayWrite && status === 'sent' ? <ActionButton action={resendQuoteAction} fields={{ quoteId: quote.id }} label="E-mail again" pendingLabel="Sending…" /> : null}
          </>
        }
      />

      {sent === 'ok' && status === 'sent' ? <FormMessage tone="success" message={`Sent to ${quote.contact_email} with the PDF attached.`} /> : null}
      {sent === 'failed' && status === 'sent' ? (
        <FormMessage tone="error" message='The quote is marked sent, but the e-mail could not be delivered. Use "E-mail again" once the mail server is reachable.' />
      ) : null}

      <QuoteSummary quote={quote} />

      {quote.lines.length === 0 ? (
        <EmptyState title="No lines yet" description={mayPrice ? 'Add a part, a finish and a quantity below; the line is priced from the plating calculation and the rates.' : 'The estimator has not added lines yet.'} />
      ) : (
        quote.lines.map((l) => (
          <QuoteLineCard
            key={l.id}
            line={l}
            units={user.unitSystem}
            actions={
              mayPrice ? (
                <>
                  {l.override ? <ActionButton action={clearOverrideAction} fields={{ quoteId: quote.id, lineId: l.id }} label="Use computed price" /> : null}
                  <ActionButton action={removeLineAction} fields={{ quoteId: quote.id, lineId: l.id }} label="Remove line" variant="ghost" confirm={`Remove line ${l.lineNo}?`} />
                </>
              ) : null
            }
            overrideQuoteId={mayPrice ? quote.id : null}
          />
        ))
      )}

      <Card title="Total" actions={<Money cents={quote.total_cents} className="text-xl font-semibold" />}>
        <p className="text-sm text-ink-muted">Before tax. The customer sees the line totals and unit prices, not the cost build-up.</p>
      </Card>

      {hazards.length ? (
        <Caution kind={hazards}>{engineNotes.join(' ')}</Caution>
      ) : engineNotes.length ? (
        <p className="text-sm text-ink">{engineNotes.join(' ')}</p>
      ) : null}
      {quote.lines.length ? <p className="text-xs text-ink-muted">{ESTIMATE_CAUTION}</p> : null}

      {choices && mayPrice ? (
        <Card title="Add a line" description="Parts are this customer's; the finish's tank, current density and efficiency drive the calculation.">
          <AddLineForm quoteId={quote.id} choices={choices} />
        </Card>
      ) : null}

      {choices && draft && mayWrite ? (
        <div className="grid gap-4 lg:grid-cols-2">
          <Card title="Rush and notes">
            <HeaderForm quoteId={quote.id} contactUserId={quote.contact_user_id} isRush={quote.is_rush} notes={quote.notes} />
          </Card>
          <Card title="Send" description={`The contact receives the PDF and a link to accept or decline. The quote is then valid for ${quote.valid_days} days and can no longer be edited.`}>
            <SendForm quoteId={quote.id} contacts={choices.contacts} contactUserId={quote.contact_user_id} />
          </Card>
        </div>
      ) : null}
    </div>
  );
}
