'use client';

import { useActionState } from 'react';
import { SelectField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { sendQuoteAction } from '../actions';

type Contact = { id: string; name: string; email: string };

/** Picks the customer's contact and e-mails the quote PDF with a link into the customer area. */
export function SendForm({ quoteId, contacts, contactUserId }: { quoteId: string; contacts: Contact[]; contactUserId: string | null }) {
  const [state, action] = useActionState(sendQuoteAction, initialFormState);
  return (
    <form action={action} className="flex flex-wrap items-end gap-3" noValidate>
      <input type="hidden" name="quoteId" value={quoteId} />
      <FormMessage className="w-full" tone={state.ok ? 'success' : 'error'} message={state.message} />
      <SelectField
        className="min-w-64"
        label="Send to"
        name="contactUserId"
        defaultValue={state.values?.contactUserId ?? contactUserId ?? ''}
        placeholder="Choose the customer's contact…"
        options={contacts.map((c) => ({ value: c.id, label: `${c.name} <${c.email}>` }))}
        errors={state.fieldErrors?.contactUserId}
        hint={contacts.length === 0 ? 'This customer has no contact who can sign in. Invite one under Users first.' : undefined}
        required
      />
      <SubmitButton pendingLabel="Sending…">Send quote</SubmitButton>
    </form>
  );
}
