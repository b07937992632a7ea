import type { Metadata } from 'next';
import { TokenPanel } from '@/components/api-tokens/token-panel';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { db } from '@/db';
import { listApiTokens } from '@/lib/api/tokens';
import { tokenViews } from '@/lib/api/token-view';

export const metadata: Metadata = { title: 'API tokens' };

export default async function PortalApiTokensPage() {
  const me = await requirePageUser('api.tokens', '/portal/api-tokens');
  const admin = await db.selectFrom('users').select('is_customer_admin').where('id', '=', me.id).executeTakeFirst();
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="API tokens"
        description="Let your purchasing or quality system read your company’s quotes, orders, shipments, certificates and invoices. The API is described at /api/v1/openapi.json."
      />
      {admin?.is_customer_admin ? (
        <TokenPanel tokens={tokenViews(await listApiTokens(me))} customers={null} />
      ) : (
        <p className="text-sm text-ink-muted">Your company’s administrator makes API tokens. Ask them, or ask the shop to make you one.</p>
      )}
    </div>
  );
}
