'use client';

import { useActionState, useMemo, useState } from 'react';
import { formatMoney } from '@/components/money';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { NumberField, SelectField, TextareaField, TextField } from '@/components/ui/field';
import { FormMessage } from '@/components/ui/form-message';
import { SubmitButton } from '@/components/ui/submit-button';
import { Table, TBody, Td, Th, THead, Tr } from '@/components/ui/table';
import { initialFormState } from '@/lib/action-state';
import { formatTaxRate, invoiceTotals } from '@/lib/billing/arithmetic';
import { addDaysIso, isIsoDate } from '@/lib/billing/dates';
import { EXTRA_KINDS, type ExtraKind } from '@/lib/billing/extra-kinds';
import type { InvoiceCandidate } from '@/lib/billing/orders';
import { issueInvoiceAction } from '../actions';

type Customer = { id: string; name: string; taxRateBp: number; termsDays: number; billingEmail: string | null };
type Extra = { key: number; kind: ExtraKind; description: string; quantity: string; unitPrice: string };

const qty = new Intl.NumberFormat('en-US', { maximumFractionDigits: 4 });
const unitPriceText = (cents: number) =>
  new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', minimumFractionDigits: 2, maximumFractionDigits: 6 }).format(cents / 100);

// The same wording of a day as the rest of the app ("31 Dec 2026"), without the server-side helpers.
const dayText = (iso: string) => new Date(`${iso}T00:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** For the preview only; the server parses every amount exactly and reports bad input by field. */
function previewCents(text: string): number | null {
  const v = Number(text.trim().replace(/^\$/, '').replace(/,/g, '') || '0');
  return Number.isFinite(v) && v >= 0 ? Math.round(v * 100) : null;
}

export function IssueForm({ customer, candidates, today }: { customer: Customer; candidates: InvoiceCandidate[]; today: string }) {
  const [state, action] = useActionState(issueInvoiceAction, initialFormState);
  const [selected, setSelected] = useState(() => new Set(candidates.filter((c) => !c.blockedReason).map((c) => c.id)));
  const [extras, setExtras] = useState<Extra[]>([]);
  const [issuedOn, setIssuedOn] = useState(today);
  const fe = state.fieldErrors ?? {};

  const totals = useMemo(() => {
    const lines = candidates.filter((c) => selected.has(c.id)).map((c) => ({ quantity: c.quantity, unitPriceCents: c.unitPriceCents }));
    for (const e of extras) {
      const cents = previewCents(e.unitPrice);
      const q = Number(e.quantity);
      if (cents === null || !(q > 0)) return null;
      lines.push({ quantity: q, unitPriceCents: e.kind === 'rework' ? 0 : cents });
    }
    try {
      return invoiceTotals(lines, customer.taxRateBp);
    } catch {
      return null;
    }
  }, [candidates, selected, extras, customer.taxRateBp]);

  const toggle = (id: string) =>
    setSelected((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const updateExtra = (key: number, patch: Partial<Extra>) => setExtras((xs) => xs.map((x) => (x.key === key ? { ...x, ...patch } : x)));
  const extrasJson = JSON.stringify(extras.map(({ kind, description, quantity, unitPrice }) => ({ kind, description, quantity, unitPrice })));

  return (
    <form action={action} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="customerId" value={customer.id} />
      <input type="hidden" name="orderIds" value={[...selected].join(',')} />
      <input type="hidden" name="extras" value={extrasJson} />
      <FormMessage tone="error" message={state.ok ? null : state.message} />

      <Card title={`Shipped work orders for ${customer.name}`} description="Each is billed at its accepted unit price for the quantity shipped." padding="none">
        {candidates.length === 0 ? (
          <p className="p-4 text-sm text-ink-muted">This customer has no shipped work orders waiting to be invoiced.</p>
        ) : (
          <Table caption="Shipped work orders" captionHidden>
            <THead>
              <tr>
                <Th>Bill</Th>
                <Th>Line</Th>
                <Th numeric>Quantity</Th>
                <Th numeric>Unit price</Th>
                <Th numeric>Amount</Th>
              </tr>
            </THead>
            <TBody>
              {candidates.map((c) => (
                <Tr key={c.id}>
                  <Td>
                    <input
                      type="checkbox"
                      className="size-5"
                      aria-label={`Bill ${c.number}`}
                      checked={selected.has(c.id)}
                      disabled={!!c.blockedReason}
                      onChange={() => toggle(c.id)}
                    />
                  </Td>
                  <Td>
                    {c.description}
                    {c.blockedReason ? <span className="block text-sm text-out">Cannot be billed: {c.blockedReason}</span> : null}
                  </Td>
                  <Td numeric>{c.blockedReason && !c.unit ? '—' : `${qty.format(c.quantity)} ${c.unit}`}</Td>
                  <Td numeric>{c.unit ? unitPriceText(c.unitPriceCents) : '—'}</Td>
                  <Td numeric>{c.unit ? formatMoney(c.amountCents) : '—'}</Td>
                </Tr>
              ))}
            </TBody>
          </Table>
        )}
        {fe.orderIds ? <p className="px-4 pb-3 text-sm text-out">{fe.orderIds.join(' ')}</p> : null}
      </Card>

      <Card
        title="Extra lines"
        description="Rush or expedite charges, freight, or rework done at no charge (billed at zero)."
        actions={
          <Button variant="secondary" size="sm" onClick={() => setExtras((xs) => [...xs, { key: Date.now(), kind: 'rush', description: '', quantity: '1', unitPrice: '' }])}>
            Add a line
          </Button>
        }
      >
        {extras.length === 0 ? <p className="text-sm text-ink-muted">No extra lines.</p> : null}
        <div className="flex flex-col gap-3">
          {extras.map((x, i) => (
            <fieldset key={x.key} className="grid items-end gap-3 sm:grid-cols-[11rem_1fr_6rem_8rem_auto]">
              <legend className="sr-only">Extra line {i + 1}</legend>
              <SelectField
                label="Kind"
                name={`extraKind${i}`}
                value={x.kind}
                onChange={(e) => updateExtra(x.key, { kind: e.target.value as ExtraKind })}
                options={EXTRA_KINDS.map((k) => ({ value: k.kind, label: k.label }))}
                errors={fe[`extras.${i}.kind`]}
              />
              <TextField label="Description" name={`extraDescription${i}`} value={x.description} onChange={(e) => updateExtra(x.key, { description: e.target.value })} errors={fe[`extras.${i}.description`]} />
              <NumberField label="Quantity" name={`extraQuantity${i}`} value={x.quantity} onChange={(e) => updateExtra(x.key, { quantity: e.target.value })} errors={fe[`extras.${i}.quantity`]} />
              <NumberField
                label="Unit price ($)"
                name={`extraPrice${i}`}
                value={x.kind === 'rework' ? '0' : x.unitPrice}
                disabled={x.kind === 'rework'}
                onChange={(e) => updateExtra(x.key, { unitPrice: e.target.value })}
                errors={fe[`extras.${i}.unitPrice`]}
              />
              <Button variant="ghost" size="sm" onClick={() => setExtras((xs) => xs.filter((y) => y.key !== x.key))} aria-label={`Remove extra line ${i + 1}`}>
                Remove
              </Button>
            </fieldset>
          ))}
        </div>
      </Card>

      <Card title="Issue" footer={<SubmitButton pendingLabel="Issuing…" disabled={selected.size === 0}>Issue invoice</SubmitButton>}>
        <div className="grid gap-4 md:grid-cols-2">
          <div className="flex flex-col gap-3">
            <TextField label="Invoice date" name="issuedOn" type="date" value={issuedOn} max={today} onChange={(e) => setIssuedOn(e.target.value)} errors={fe.issuedOn} />
            <TextareaField label="Notes on the invoice" name="notes" defaultValue={state.values?.notes} errors={fe.notes} hint="Optional. Printed on the invoice." />
          </div>
          <dl className="grid grid-cols-[1fr_auto] content-start gap-x-6 gap-y-1 text-sm tabular">
            <dt>Subtotal</dt>
            <dd className="text-right">{totals ? formatMoney(totals.subtotalCents) : '—'}</dd>
            <dt>Tax ({formatTaxRate(customer.taxRateBp)})</dt>
            <dd className="text-right">{totals ? formatMoney(totals.taxCents) : '—'}</dd>
            <dt className="font-semibold">Total</dt>
            <dd className="text-right font-semibold">{totals ? formatMoney(totals.totalCents) : '—'}</dd>
            <dt className="text-ink-muted">Terms</dt>
            <dd className="text-right text-ink-muted">
              Net {customer.termsDays} days{isIsoDate(issuedOn) ? `, due ${dayText(addDaysIso(issuedOn, customer.termsDays))}` : ''}
            </dd>
            <dt className="col-span-2 mt-2 text-ink-muted">
              {customer.billingEmail
                ? `The invoice PDF and a link to pay online go to ${customer.billingEmail}.`
                : 'This customer has no billing e-mail on record: the invoice will be issued but not e-mailed.'}
            </dt>
          </dl>
        </div>
      </Card>
    </form>
  );
}
