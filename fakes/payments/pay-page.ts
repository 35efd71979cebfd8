import type { CheckoutSession, LineItem } from './state.ts';

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

function money(amount: number, currency: string): string {
  const upper = currency.toUpperCase();
  return new Intl.NumberFormat('en', { style: 'currency', currency: upper }).format(amount / 10 ** fractionDigits(upper));
}

/** Minor-unit exponent of a currency, from Intl (JPY 0, USD 2, BHD 3…). */
export function fractionDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

const STYLE = `
  *{box-sizing:border-box} body{margin:0;font:16px/1.5 system-ui,sans-serif;background:#eef1f4;color:#1b2430}
  main{max-width:880px;margin:40px auto;display:grid;grid-template-columns:1fr 1fr;gap:0;background:#fff;border-radius:14px;overflow:hidden;box-shadow:0 8px 30px rgba(20,30,40,.12)}
  section{padding:32px} .summary{background:#1b2430;color:#e9eef3} .summary h1{font-size:18px;margin:0 0 4px}
  .total{font-size:34px;font-weight:700;margin:8px 0 24px} table{width:100%;border-collapse:collapse;font-size:14px}
  td{padding:6px 0;border-bottom:1px solid #2c3846} td.r{text-align:right} .note{font-size:12px;opacity:.7;margin-top:24px}
  label{display:block;font-size:13px;font-weight:600;margin:14px 0 4px} input{width:100%;padding:10px 12px;border:1px solid #c5ced8;border-radius:8px;font:inherit}
  .row{display:grid;grid-template-columns:1fr 1fr;gap:12px} button{margin-top:22px;width:100%;padding:12px;border:0;border-radius:8px;background:#2f6fdf;color:#fff;font:600 16px system-ui;cursor:pointer}
  .error{background:#fde8e8;color:#8a1c1c;border-radius:8px;padding:10px 12px;font-size:14px;margin-bottom:6px} a{color:inherit}
  .badge{display:inline-block;font-size:11px;font-weight:700;letter-spacing:.08em;background:#f6c343;color:#1b2430;border-radius:4px;padding:2px 6px;margin-bottom:14px}
  @media (max-width:720px){main{grid-template-columns:1fr;margin:0;border-radius:0}}`;

/** The hosted-style pay page of the local payments stand-in. */
export function payPage(input: { session: CheckoutSession; items: LineItem[]; merchant: string; error?: string; email?: string }): string {
  const { session, items } = input;
  const rows = items
    .map((i) => `<tr><td>${escapeHtml(i.description)} × ${i.quantity}</td><td class="r">${money(i.amount_total, i.currency)}</td></tr>`)
    .join('');
  const closed =
    session.status !== 'open'
      ? `<p>${session.status === 'expired' ? 'This payment page has expired.' : 'This payment is already complete.'}</p>${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Return to the shop</a></p>` : ''}`
      : '';
  const form = `
    <form method="post" action="/pay/${session.id}" autocomplete="off">
      ${input.error ? `<div class="error" role="alert">${escapeHtml(input.error)}</div>` : ''}
      <label for="email">E-mail</label><input id="email" name="email" type="email" required value="${escapeHtml(input.email ?? session.customer_email ?? '')}">
      <label for="card">Card number</label><input id="card" name="card" inputmode="numeric" placeholder="4242 4242 4242 4242" required>
      <div class="row"><div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required></div>
      <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="123" required></div></div>
      <label for="name">Name on card</label><input id="name" name="name" required>
      <button type="submit">Pay ${money(session.amount_total, session.currency)}</button>
    </form>
    ${session.cancel_url ? `<p class="note"><a href="${escapeHtml(session.cancel_url)}">Cancel and return to the shop</a></p>` : ''}`;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Pay ${escapeHtml(input.merchant)}</title><link rel="icon" href="data:,"><style>${STYLE}</style></head><body><main>
<section class="summary"><span class="badge">TEST MODE</span><h1>${escapeHtml(input.merchant)}</h1>
<div class="total">${money(session.amount_total, session.currency)}</div><table>${rows}</table>
<p class="note">Local payments stand-in: no money moves. Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined; 4000 0000 0000 9995 is declined for insufficient funds.</p></section>
<section><h2 style="margin-top:0;font-size:18px">Pay by card</h2>${closed || form}</section></main></body></html>`;
}
