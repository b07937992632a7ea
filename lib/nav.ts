// The staff navigation: each role sees only what it may use.
import type { Role } from '@/db/types';
import { type Permission, roleCan } from '@/lib/auth/roles';

export type NavItem = { href: string; label: string; permission: Permission };

export const STAFF_NAV: NavItem[] = [
  { href: '/home', label: 'Home', permission: 'staff.area' },
  { href: '/settings/users', label: 'Users', permission: 'users.manage' },
  { href: '/settings/mailbox', label: 'Demo mailbox', permission: 'mailbox.read' },
];

export const CUSTOMER_NAV: NavItem[] = [{ href: '/portal', label: 'Overview', permission: 'portal.use' }];

export function navFor(role: Role, items: NavItem[], opts: { demoMode: boolean }): { href: string; label: string }[] {
  return items
    .filter((i) => roleCan(role, i.permission))
    .filter((i) => opts.demoMode || i.href !== '/settings/mailbox')
    .map(({ href, label }) => ({ href, label }));
}
