import Link from 'next/link';
import { Card } from '@/components/ui/card';
import type { QuoteDetail } from '@/lib/quotes/queries';
import { formatDateTime, formatDay } from '@/lib/quotes/format';
import { QUOTE_STATUS_LABELS } from '@/lib/quotes/status';

export function QuoteSummary({ quote }: { quote: QuoteDetail }) {
  const rows: [string, React.ReactNode][] = [
    ['Customer', <Link key="c" href={`/customers/${quote.customer_id}`}>{quote.customer_name}</Link>],
    ['Contact', quote.contact_name ? `${quote.contact_name} <${quote.contact_email}>` : 'None chosen yet'],
    ['Estimator', quote.creator_name ?? '—'],
    ['Rates', `In force from ${formatDay(quote.rates_from)}`],
    ['Validity', quote.expires_at ? `Until ${formatDay(quote.expires_at)}` : `${quote.valid_days} days from sending`],
    ['Sent', formatDateTime(quote.sent_at)],
  ];
  if (quote.po_number) rows.push(['Purchase order', `${quote.po_number} (accepted ${formatDateTime(quote.decided_at)} by ${quote.decider_name ?? '—'})`]);
  if (quote.decline_reason) rows.push(['Declined', `${quote.decline_reason} (${formatDateTime(quote.decided_at)}, ${quote.decider_name ?? '—'})`]);
  return (
    <Card padding="sm">
      <div className="flex flex-wrap gap-6">
        <dl className="grid flex-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-[8rem_1fr]">
          {rows.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-ink-muted">{k}</dt>
              <dd>{v}</dd>
            </div>
          ))}
        </dl>
        {quote.revisions.length > 1 ? (
          <nav aria-label="Revisions" className="text-sm">
            <p className="mb-1 text-ink-muted">Revisions</p>
            <ul className="flex flex-col gap-0.5">
              {quote.revisions.map((r) => (
                <li key={r.id}>
                  {r.id === quote.id ? (
                    <strong>
                      Rev {r.revision} · {QUOTE_STATUS_LABELS[r.status]}
                    </strong>
                  ) : (
                    <Link href={`/quotes/${r.id}`}>
                      Rev {r.revision} · {QUOTE_STATUS_LABELS[r.status]}
                    </Link>
                  )}
                </li>
              ))}
            </ul>
          </nav>
        ) : null}
      </div>
      {quote.notes ? <p className="mt-3 border-t border-surface-line pt-2 text-sm">{quote.notes}</p> : null}
    </Card>
  );
}
