'use client';

import { useActionState, useState } from 'react';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { SelectField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { initialFormState } from '@/lib/action-state';
import { ROLE_LABELS, ROLES } from '@/lib/auth/roles';
import { createTokenAction, revokeTokenAction } from '@/app/(shop)/settings/api-tokens/actions';

export type TokenView = {
  id: string;
  name: string;
  prefix: string;
  roleLabel: string;
  customerName: string | null;
  madeBy: string;
  perMinute: number;
  created: string;
  lastUsed: string | null;
  revoked: string | null;
};

/** The owner chooses role and customer; a customer's administrator makes tokens for their company. */
export function TokenPanel({ tokens, customers }: { tokens: TokenView[]; customers: { id: string; name: string }[] | null }) {
  const [state, action] = useActionState(createTokenAction, initialFormState);
  // One revoke state for the table: the revoked row turns into a badge, so its message lives above it.
  const [revoked, revoke] = useActionState(revokeTokenAction, initialFormState);
  const [role, setRole] = useState(customers ? 'plater' : 'customer');
  return (
    <div className="flex flex-col gap-6">
      <Card title="Make a token" description="A token is a password for a program. It is shown once; keep it in that program’s secret store.">
        <form action={action} className="grid gap-4 sm:grid-cols-2" noValidate>
          <FormMessage className="sm:col-span-2" tone={state.ok ? 'success' : 'error'} message={state.message} />
          {state.secret ? (
            <div className="sm:col-span-2">
              <label className="text-sm font-medium" htmlFor="new-token">
                The new token
              </label>
              <input id="new-token" readOnly value={state.secret} onFocus={(e) => e.currentTarget.select()} className="mt-1 w-full rounded-md border border-surface-line bg-surface-muted px-2 py-1 font-mono text-sm" />
            </div>
          ) : null}
          <TextField label="Name" name="name" hint="The system that will use it, e.g. “Purchasing system”" errors={state.fieldErrors?.name} required />
          {customers ? (
            <>
              <SelectField label="Role" name="role" value={role} onChange={(e) => setRole(e.target.value)} options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))} errors={state.fieldErrors?.role} required />
              {role === 'customer' ? (
                <SelectField label="Customer" name="customerId" defaultValue="" options={[{ value: '', label: 'Choose…' }, ...customers.map((c) => ({ value: c.id, label: c.name }))]} errors={state.fieldErrors?.customerId} required />
              ) : null}
              <TextField label="Requests a minute" name="perMinute" inputMode="numeric" defaultValue="120" errors={state.fieldErrors?.perMinute} />
            </>
          ) : (
            <input type="hidden" name="role" value="customer" />
          )}
          <div className="sm:col-span-2">
            <SubmitButton pendingLabel="Making…">Make token</SubmitButton>
          </div>
        </form>
      </Card>
      <Card title="Tokens" padding="none">
        <FormMessage className="m-4" tone={revoked.ok ? 'success' : 'error'} message={revoked.message} />
        {tokens.length === 0 ? (
          <p className="p-4 text-sm text-ink-muted">No tokens yet.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <thead className="bg-surface-muted text-left text-ink-muted">
                <tr>
                  <th className="px-4 py-2 font-medium">Name</th>
                  <th className="px-4 py-2 font-medium">Starts with</th>
                  <th className="px-4 py-2 font-medium">Acts as</th>
                  <th className="px-4 py-2 font-medium">Made</th>
                  <th className="px-4 py-2 font-medium">Last used</th>
                  <th className="px-4 py-2 font-medium" />
                </tr>
              </thead>
              <tbody>
                {tokens.map((t) => (
                  <tr key={t.id} className="border-t border-surface-line align-top">
                    <td className="px-4 py-2">{t.name}</td>
                    <td className="px-4 py-2 font-mono">{t.prefix}…</td>
                    <td className="px-4 py-2">
                      {t.roleLabel}
                      {t.customerName ? <div className="text-xs text-ink-muted">{t.customerName}</div> : null}
                      <div className="text-xs text-ink-muted">{t.perMinute} requests a minute</div>
                    </td>
                    <td className="px-4 py-2">
                      {t.created}
                      <div className="text-xs text-ink-muted">by {t.madeBy}</div>
                    </td>
                    <td className="px-4 py-2">{t.lastUsed ?? 'never'}</td>
                    <td className="px-4 py-2">{t.revoked ? <Badge tone="neutral">revoked {t.revoked}</Badge> : <RevokeForm tokenId={t.id} name={t.name} action={revoke} />}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
    </div>
  );
}

function RevokeForm({ tokenId, name, action }: { tokenId: string; name: string; action: (form: FormData) => void }) {
  return (
    <form action={action} className="flex items-center gap-2">
      <input type="hidden" name="tokenId" value={tokenId} />
      <SubmitButton size="sm" variant="secondary" aria-label={`Revoke ${name}`}>
        Revoke
      </SubmitButton>
    </form>
  );
}
