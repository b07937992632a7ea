import 'server-only';
import type { TokenView } from '@/components/api-tokens/token-panel';
import { formatWhen } from '@/lib/bath/display';
import type { TokenRow } from './tokens';

export function tokenViews(rows: TokenRow[]): TokenView[] {
  return rows.map((t) => ({
    id: t.id,
    name: t.name,
    prefix: t.prefix,
    roleLabel: t.roleLabel,
    customerName: t.customerName,
    madeBy: t.madeBy,
    perMinute: t.perMinute,
    created: formatWhen(t.createdAt),
    lastUsed: t.lastUsedAt ? formatWhen(t.lastUsedAt) : null,
    revoked: t.revokedAt ? formatWhen(t.revokedAt) : null,
  }));
}
