// The kinds of extra line an invoice may carry besides its work orders. Pure.
import type { InvoiceLineKind } from '@/db/types';

export type ExtraKind = Exclude<InvoiceLineKind, 'work_order'>;

export const EXTRA_KINDS: readonly { kind: ExtraKind; label: string }[] = [
  { kind: 'rush', label: 'Rush charge' },
  { kind: 'expedite', label: 'Expedite / freight' },
  { kind: 'rework', label: 'Rework at no charge' },
  { kind: 'other', label: 'Other charge' },
];
