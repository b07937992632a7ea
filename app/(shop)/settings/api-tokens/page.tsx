import type { Metadata } from 'next';
import { TokenPanel } from '@/components/api-tokens/token-panel';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { listApiTokens } from '@/lib/api/tokens';
import { tokenViews } from '@/lib/api/token-view';
import { findCustomerChoices } from '@/lib/users/queries';

export const metadata: Metadata = { title: 'API tokens' };

export default async function ApiTokensPage() {
  const me = await requirePageUser('settings.manage', '/settings/api-tokens');
  const [tokens, customers] = await Promise.all([listApiTokens(me), findCustomerChoices()]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="API tokens"
        description="For the shop’s and the customers’ other systems: a lab posting analyses, a buyer’s purchasing system reading orders. The API is described at /api/v1/openapi.json."
      />
      <TokenPanel tokens={tokenViews(tokens)} customers={customers} />
    </div>
  );
}
