// Roles and the permission vocabulary: the one place that says who may do what.
// Pure data and functions, safe to import from client components for showing or hiding UI
// (hiding is never the check: server code calls requirePermission).
import type { Role } from '@/db/types';

export const ROLES = ['owner', 'estimator', 'plater', 'supervisor', 'customer'] as const satisfies readonly Role[];
export const STAFF_ROLES = ['owner', 'estimator', 'plater', 'supervisor'] as const satisfies readonly Role[];

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  estimator: 'Estimator',
  plater: 'Plater',
  supervisor: 'Supervisor',
  customer: 'Customer contact',
};

const ALL_STAFF = STAFF_ROLES;
const OFFICE = ['owner', 'estimator', 'supervisor'] as const;

export const PERMISSIONS = {
  'account.self': [...ALL_STAFF, 'customer'],
  'staff.area': ALL_STAFF,
  'users.manage': ['owner'],
  'settings.manage': ['owner'],
  'rates.manage': ['owner'],
  'mailbox.read': ['owner'],
  'customers.read': OFFICE,
  'customers.write': ['owner', 'estimator'],
  'plating.estimate': OFFICE,
  'quotes.read': OFFICE,
  'quotes.write': ['owner', 'estimator'],
  'quotes.price': ['owner', 'estimator'],
  'orders.read': ALL_STAFF,
  'orders.advance': ['owner', 'supervisor', 'plater'],
  'runs.log': ['owner', 'supervisor', 'plater'],
  'dock.receive': ['owner', 'supervisor', 'plater'],
  'dock.ship': ['owner', 'supervisor', 'plater'],
  'schedule.read': ALL_STAFF,
  'schedule.plan': ['owner', 'supervisor'],
  'tanks.capacity': ['owner', 'supervisor'],
  'bath.read': ALL_STAFF,
  'bath.log': ['owner', 'supervisor', 'plater'],
  'bath.limits': ['owner', 'supervisor'],
  'alerts.ack': ['owner', 'supervisor'],
  'quality.read': ALL_STAFF,
  'quality.record': ['owner', 'supervisor', 'plater'],
  'certificates.issue': ['owner', 'supervisor'],
  'quality.disposition': ['owner', 'supervisor'],
  'invoices.read': ['owner'],
  'invoices.issue': ['owner'],
  'reports.read': ['owner'],
  'portal.use': ['customer'],
  // A customer's API tokens page; lib/api/tokens.ts lets only their company's administrator in.
  'api.tokens': ['customer'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function roleCan(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

export function isStaffRole(role: Role): boolean {
  return role !== 'customer';
}
