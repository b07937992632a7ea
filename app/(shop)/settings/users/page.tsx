import type { Metadata } from 'next';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { findCustomerChoices, findUsers } from '@/lib/users/queries';
import { InviteForm } from './invite-form';
import { UserRowForm } from './user-row-form';

export const metadata: Metadata = { title: 'Users' };

export default async function UsersPage() {
  const me = await requirePageUser('users.manage', '/settings/users');
  const [users, customers] = await Promise.all([findUsers(), findCustomerChoices()]);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Users" description="Invite staff and customer contacts, and choose what each may do." />
      <Card title="Invite someone" description="They receive an e-mail with a link to choose their password. The link works for seven days.">
        <InviteForm customers={customers} />
      </Card>
      <Card title="Everyone with an account" padding="none">
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="bg-surface-muted text-left text-ink-muted">
              <tr>
                <th className="px-4 py-2 font-medium">Name</th>
                <th className="px-4 py-2 font-medium">E-mail</th>
                <th className="px-4 py-2 font-medium">Role</th>
                <th className="px-4 py-2 font-medium">Role and access</th>
              </tr>
            </thead>
            <tbody>
              {users.map((u) => (
                <tr key={u.id} className="border-t border-surface-line align-top">
                  <td className="px-4 py-2">
                    {u.name}
                    {u.has_password ? null : (
                      <Badge tone="copper" className="ml-2">
                        invited
                      </Badge>
                    )}
                  </td>
                  <td className="px-4 py-2">{u.email}</td>
                  <td className="px-4 py-2">
                    {ROLE_LABELS[u.role]}
                    {u.customer_name ? <div className="text-xs text-ink-muted">{u.customer_name}</div> : null}
                  </td>
                  <td className="px-4 py-2">
                    <UserRowForm userId={u.id} role={u.role} isActive={u.is_active} isCustomerAdmin={u.is_customer_admin} isSelf={u.id === me.id} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
    </div>
  );
}
