// The stand-in payment page the fake's checkout URLs point at: plain HTML, no scripts, no assets.
import { TEST_CARDS } from './stripe-fake-checkout';
import type { CheckoutSession, LineItem } from './stripe-fake-store';

export const escapeHtml = (value: string) =>
  value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/** Amounts are in the currency's minor unit; Intl knows how many decimals each currency has. */
export function formatAmount(minor: number, currency: string): string {
  try {
    const format = new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() });
    const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
    return format.format(minor / 10 ** digits);
  } catch {
    return `${(minor / 100).toFixed(2)} ${currency.toUpperCase()}`;
  }
}

const STYLE = `
  *{box-sizing:border-box}
  body{margin:0;min-height:100vh;display:flex;align-items:center;justify-content:center;
    background:#eef1f4;color:#1d2329;font:16px/1.5 system-ui,-apple-system,"Segoe UI",sans-serif}
  main{background:#fff;width:min(100% - 2rem,26rem);padding:2rem;border-radius:10px;
    box-shadow:0 1px 3px rgba(0,0,0,.12),0 6px 18px rgba(0,0,0,.06)}
  h1{font-size:1.35rem;margin:0 0 1rem}
  .amount{font-size:2rem;font-weight:650;margin:0}
  .description{margin:.25rem 0 1.25rem;color:#46515c}
  label{display:block;font-weight:600;margin-bottom:.35rem}
  input{width:100%;padding:.65rem .75rem;font:inherit;border:1px solid #8a96a3;border-radius:6px}
  input:focus-visible,button:focus-visible,a:focus-visible{outline:3px solid #2f6fdf;outline-offset:2px}
  button{margin-top:1rem;width:100%;padding:.75rem;font:inherit;font-weight:600;color:#fff;
    background:#1f5fbf;border:0;border-radius:6px;cursor:pointer}
  button:hover{background:#194f9f}
  .cancel{display:inline-block;margin-top:.9rem;color:#1f5fbf}
  .error{margin:0 0 1rem;padding:.6rem .75rem;border-radius:6px;background:#fdecec;color:#8a1c1c;
    border:1px solid #e9b4b4}
  .note{margin-top:1.5rem;padding-top:1rem;border-top:1px solid #dde2e7;font-size:.9rem;color:#46515c}
  .note ul{margin:.4rem 0 0;padding-left:1.2rem}
  code{font-family:ui-monospace,monospace}
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>
`;
}

const NOTICE = `<div class="note">
  <p>This is a local test payment page. No real card is charged.</p>
  <p>Test card numbers:</p>
  <ul>
    <li><code>4242 4242 4242 4242</code> — payment succeeds</li>
    <li><code>4000 0000 0000 0002</code> — card is declined</li>
  </ul>
</div>`;

export type PayPageInput = {
  session: CheckoutSession;
  lineItems: LineItem[];
  error?: string;
  card?: string;
};

export function renderPayPage({ session, lineItems, error, card }: PayPageInput): string {
  const description = lineItems.map((i) => (i.quantity > 1 ? `${i.description} × ${i.quantity}` : i.description));
  const errorBlock = error
    ? `<p class="error" id="card-error" role="alert">${escapeHtml(error)}</p>`
    : `<p id="card-error" role="alert" hidden></p>`;
  const cancel = session.cancel_url
    ? `<a class="cancel" href="${escapeHtml(session.cancel_url)}">Cancel and go back</a>`
    : '';
  const body = `<h1>Test payment</h1>
<p class="amount">${escapeHtml(formatAmount(session.amount_total, session.currency))}</p>
<p class="description">${escapeHtml(description.join(', '))}</p>
${errorBlock}
<form method="post" action="/pay/${encodeURIComponent(session.id)}">
  <label for="card">Card number</label>
  <input id="card" name="card" type="text" inputmode="numeric" autocomplete="cc-number"
    required placeholder="${TEST_CARDS.succeeds.replace(/(\d{4})(?=\d)/g, '$1 ')}" value="${escapeHtml(card ?? '')}"
    aria-describedby="card-error"${error ? ' aria-invalid="true"' : ''}>
  <button type="submit">Pay ${escapeHtml(formatAmount(session.amount_total, session.currency))}</button>
</form>
${cancel}
${NOTICE}`;
  return layout('Test payment', body);
}

export function renderDonePage(session: CheckoutSession, continueUrl: string | null): string {
  const link = continueUrl ? `<p><a href="${escapeHtml(continueUrl)}">Continue</a></p>` : '';
  return layout('Test payment', `<h1>Test payment</h1>
<p>This payment of ${escapeHtml(formatAmount(session.amount_total, session.currency))} is complete.</p>
${link}
${NOTICE}`);
}

export function renderNotFoundPage(id: string): string {
  return layout('Payment not found', `<h1>Payment not found</h1>
<p>There is no test payment with the id <code>${escapeHtml(id)}</code>. It may have been made before the local
fake's state was cleared.</p>`);
}
