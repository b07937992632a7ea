'use client';

import { useActionState } from 'react';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { ROLE_LABELS, STAFF_ROLES } from '@/lib/auth/roles';
import type { Role } from '@/db/types';
import { updateUserAction } from './actions';

// One user's role and active flag, saved on its own so a mistake touches one row only.
export function UserRowForm({ userId, role, isActive, isCustomerAdmin, isSelf }: { userId: string; role: Role; isActive: boolean; isCustomerAdmin: boolean; isSelf: boolean }) {
  const [state, action] = useActionState(updateUserAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="userId" value={userId} />
      {role === 'customer' ? (
        <input type="hidden" name="role" value="customer" />
      ) : (
        <select name="role" defaultValue={role} disabled={isSelf} aria-label="Role" className="min-h-8 rounded-md border border-surface-line bg-surface px-2 text-sm">
          {STAFF_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
      )}
      <label className="flex items-center gap-1 text-sm">
        <input type="checkbox" name="isActive" defaultChecked={isActive} disabled={isSelf} /> Active
      </label>
      {role === 'customer' ? (
        <label className="flex items-center gap-1 text-sm" title="May make and revoke API tokens for their company">
          <input type="checkbox" name="isCustomerAdmin" defaultChecked={isCustomerAdmin} /> Company administrator
        </label>
      ) : null}
      {isSelf ? null : (
        <SubmitButton size="sm" variant="secondary">
          Save
        </SubmitButton>
      )}
      <span aria-live="polite" className={state.ok ? 'text-xs text-ok' : 'text-xs text-out'}>
        {state.message}
      </span>
    </form>
  );
}
