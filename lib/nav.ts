// The staff navigation: each role sees only what it may use.
import type { Role } from '@/db/types';
import { type Permission, roleCan } from '@/lib/auth/roles';

/** A count shown beside an item, resolved per request by the layout (e.g. open bath alerts). */
export type NavBadge = 'openBathAlerts';

export type NavItem = { href: string; label: string; permission: Permission; badge?: NavBadge };

export const STAFF_NAV: NavItem[] = [
  { href: '/home', label: 'Home', permission: 'staff.area' },
  { href: '/floor', label: 'Floor', permission: 'bath.log' },
  { href: '/baths', label: 'Baths', permission: 'bath.read', badge: 'openBathAlerts' },
  { href: '/estimating/workbench', label: 'Workbench', permission: 'plating.estimate' },
  { href: '/quotes', label: 'Quotes', permission: 'quotes.read' },
  { href: '/receiving', label: 'Receiving', permission: 'dock.receive' },
  { href: '/work-orders', label: 'Work orders', permission: 'orders.read' },
  { href: '/schedule', label: 'Schedule', permission: 'schedule.read' },
  { href: '/quality', label: 'Quality', permission: 'quality.read' },
  { href: '/customers', label: 'Customers', permission: 'customers.read' },
  { href: '/parts', label: 'Parts', permission: 'customers.read' },
  { href: '/finishes', label: 'Finishes', permission: 'quotes.read' },
  { href: '/reports/job-costs', label: 'Job costs', permission: 'reports.read' },
  { href: '/invoices', label: 'Invoices', permission: 'invoices.read' },
  { href: '/settings/users', label: 'Users', permission: 'users.manage' },
  { href: '/settings/rates', label: 'Rates', permission: 'rates.manage' },
  { href: '/settings/passivation', label: 'Passivation windows', permission: 'bath.limits' },
  { href: '/settings/api-tokens', label: 'API tokens', permission: 'settings.manage' },
  { href: '/settings/mailbox', label: 'Demo mailbox', permission: 'mailbox.read' },
];

export const CUSTOMER_NAV: NavItem[] = [
  { href: '/portal', label: 'Overview', permission: 'portal.use' },
  { href: '/portal/quotes', label: 'Quotes', permission: 'portal.use' },
  { href: '/portal/orders', label: 'Orders', permission: 'portal.use' },
  { href: '/portal/certificates', label: 'Certificates', permission: 'portal.use' },
  { href: '/portal/invoices', label: 'Invoices', permission: 'portal.use' },
  { href: '/portal/api-tokens', label: 'API tokens', permission: 'api.tokens' },
];

export function navFor(role: Role, items: NavItem[], opts: { demoMode: boolean }): { href: string; label: string; badge?: NavBadge }[] {
  return items
    .filter((i) => roleCan(role, i.permission))
    .filter((i) => opts.demoMode || i.href !== '/settings/mailbox')
    .map(({ href, label, badge }) => (badge ? { href, label, badge } : { href, label }));
}
