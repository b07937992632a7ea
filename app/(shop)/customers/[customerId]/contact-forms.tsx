'use client';

import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { addContactAction, inviteContactAction, removeContactAction } from '../actions';

export function AddContactForm({ customerId }: { customerId: string }) {
  const [state, action] = useActionState(addContactAction, initialFormState);
  const v = (k: string) => (state.ok ? '' : (state.values?.[k] ?? ''));
  const e = (k: string) => state.fieldErrors?.[k];
  return (
    <form action={action} className="grid gap-4 sm:grid-cols-3" noValidate>
      <FormMessage className="sm:col-span-3" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <input type="hidden" name="customerId" value={customerId} />
      <TextField label="Name" name="name" defaultValue={v('name')} errors={e('name')} required />
      <TextField label="E-mail" name="email" type="email" defaultValue={v('email')} errors={e('email')} />
      <TextField label="Phone" name="phone" type="tel" defaultValue={v('phone')} errors={e('phone')} />
      <div className="flex flex-wrap items-center gap-6 sm:col-span-3">
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" name="isBilling" defaultChecked={v('isBilling') === 'on'} className="size-4" /> Billing contact
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" name="maySignIn" defaultChecked={v('maySignIn') === 'on'} className="size-4" /> May sign in to the customer area
          <span className="text-ink-muted">(sends an invitation e-mail)</span>
        </label>
      </div>
      <div className="sm:col-span-3">
        <SubmitButton pendingLabel="Adding…">Add contact</SubmitButton>
      </div>
    </form>
  );
}

export function ContactActions({ customerId, contactId, canInvite }: { customerId: string; contactId: string; canInvite: boolean }) {
  const [inviteState, invite] = useActionState(inviteContactAction, initialFormState);
  const [removeState, remove] = useActionState(removeContactAction, initialFormState);
  const message = inviteState.message ?? removeState.message;
  const ok = inviteState.message ? inviteState.ok : removeState.ok;
  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex gap-2">
        {canInvite ? (
          <form action={invite}>
            <input type="hidden" name="customerId" value={customerId} />
            <input type="hidden" name="contactId" value={contactId} />
            <SubmitButton size="sm" variant="secondary" pendingLabel="Sending…">
              Invite to sign in
            </SubmitButton>
          </form>
        ) : null}
        <form action={remove}>
          <input type="hidden" name="customerId" value={customerId} />
          <input type="hidden" name="contactId" value={contactId} />
          <Button type="submit" size="sm" variant="ghost">
            Remove
          </Button>
        </form>
      </div>
      {message ? <FormMessage tone={ok ? 'success' : 'error'} message={message} /> : null}
    </div>
  );
}
