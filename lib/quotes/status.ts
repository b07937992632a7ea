// Quote status rules that need no database: expiry, revision letters, labels. Pure.
import type { QuoteStatus } from '@/db/types';

export const QUOTE_STATUS_LABELS: Record<QuoteStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  accepted: 'Accepted',
  declined: 'Declined',
  expired: 'Expired',
  superseded: 'Superseded',
};

const DAY_MS = 86_400_000;

/** A quote is good for `validDays` whole days from the moment it is sent. */
export function expiryFrom(sentAt: Date, validDays: number): Date {
  return new Date(sentAt.getTime() + validDays * DAY_MS);
}

/** A sent quote past its date reads as expired even before anything rewrites its row. */
export function effectiveQuoteStatus(q: { status: QuoteStatus; expires_at: Date | null }, now: Date = new Date()): QuoteStatus {
  if (q.status === 'sent' && q.expires_at !== null && q.expires_at.getTime() <= now.getTime()) return 'expired';
  return q.status;
}

/** Only a draft may be edited; every other state is a record of what the customer saw. */
export function isEditable(status: QuoteStatus): boolean {
  return status === 'draft';
}

/** Sent, expired and declined quotes may be revised; the revision supersedes them. */
export function canRevise(status: QuoteStatus): boolean {
  return status === 'sent' || status === 'expired' || status === 'declined';
}

export function nextRevision(revision: string): string | null {
  if (!/^[A-Z]$/.test(revision)) return null;
  return revision === 'Z' ? null : String.fromCharCode(revision.charCodeAt(0) + 1);
}

export function quoteLabel(q: { number: string; revision: string }): string {
  return q.revision === 'A' ? q.number : `${q.number} rev ${q.revision}`;
}
