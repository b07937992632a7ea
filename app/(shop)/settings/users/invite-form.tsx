'use client';

import { useActionState, useState } from 'react';
import { SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { ROLE_LABELS, ROLES } from '@/lib/auth/roles';
import { inviteUserAction } from './actions';

export function InviteForm({ customers }: { customers: { id: string; name: string }[] }) {
  const [state, action] = useActionState(inviteUserAction, initialFormState);
  const [role, setRole] = useState('estimator');
  return (
    <form action={action} className="grid gap-4 sm:grid-cols-2" noValidate>
      <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <TextField label="Name" name="name" defaultValue={state.ok ? '' : state.values?.name} errors={state.fieldErrors?.name} required />
      <TextField label="E-mail" name="email" type="email" defaultValue={state.ok ? '' : state.values?.email} errors={state.fieldErrors?.email} required />
      <SelectField
        label="Role"
        name="role"
        value={role}
        onChange={(e) => setRole(e.target.value)}
        options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
        errors={state.fieldErrors?.role}
        required
      />
      {role === 'customer' ? (
        <SelectField
          label="Customer account"
          name="customerId"
          defaultValue={state.values?.customerId ?? ''}
          options={[{ value: '', label: 'Choose…' }, ...customers.map((c) => ({ value: c.id, label: c.name }))]}
          errors={state.fieldErrors?.customerId}
          required
        />
      ) : null}
      <div className="sm:col-span-2">
        <SubmitButton pendingLabel="Sending…">Send invitation</SubmitButton>
      </div>
    </form>
  );
}
