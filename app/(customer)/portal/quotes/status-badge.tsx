import { Badge } from '@/components/ui/badge';
import type { QuoteStatus } from '@/db/types';
import { QUOTE_STATUS_LABELS } from '@/lib/quotes/status';

// The customer reads "Open" for a quote waiting on them.
export function PortalQuoteStatus({ status }: { status: QuoteStatus }) {
  if (status === 'sent') return <Badge tone="action">Open</Badge>;
  return <Badge tone={status === 'accepted' ? 'outline' : 'neutral'}>{QUOTE_STATUS_LABELS[status]}</Badge>;
}
