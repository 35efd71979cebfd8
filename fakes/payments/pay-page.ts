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

/** The practice cards the page offers, by what happens when each is used. */
export const PRACTICE_OUTCOMES = [
  { card: '4242 4242 4242 4242', words: 'Goes through' },
  { card: '4000 0000 0000 0002', words: 'Refused' },
  { card: '4000 0000 0000 9995', words: 'Not enough funds' },
] as const;

// Etchwell's own colours: birch paper, graphite text, ember for the one action.
const STYLE = `
  *{box-sizing:border-box} body{margin:0;font:16px/1.5 system-ui,sans-serif;background:#f4eee4;color:#2a2521}
  .strip{background:#2a2521;color:#fbf8f3;text-align:center;font-size:14px;font-weight:600;padding:10px 16px}
  main{max-width:480px;margin:32px auto;padding:0 16px}
  .card{background:#fbf8f3;border:1px solid #e8dfcf;border-radius:18px;padding:24px}
  h1{font-size:15px;font-weight:600;margin:0;color:#6b625a} .total{font-size:32px;font-weight:800;margin:2px 0 12px}
  ul.lines{list-style:none;margin:0 0 20px;padding:0;font-size:14px} ul.lines li{display:flex;justify-content:space-between;gap:12px;padding:6px 0;border-top:1px dashed #e8dfcf}
  label{display:block;font-size:14px;font-weight:600;margin:14px 0 4px}
  input{width:100%;min-height:44px;padding:10px 12px;border:1px solid #cfc4b3;border-radius:10px;font:inherit;background:#fff}
  input:focus-visible,button:focus-visible,a:focus-visible{outline:3px solid #c2410c;outline-offset:2px}
  .pair{display:grid;grid-template-columns:1fr 1fr;gap:12px}
  .pay{margin-top:22px;width:100%;min-height:48px;border:0;border-radius:999px;background:#c2410c;color:#fff;font:700 16px system-ui;cursor:pointer}
  fieldset{border:0;margin:0 0 4px;padding:0} legend{font-size:14px;font-weight:600;margin-bottom:6px}
  .outcomes{display:flex;flex-wrap:wrap;gap:8px} .outcomes button{min-height:40px;padding:6px 12px;border:1px solid #cfc4b3;border-radius:999px;background:#fff;font:600 14px system-ui;color:#2a2521;cursor:pointer}
  .outcomes small{display:block;font-weight:400;color:#6b625a}
  .error{background:#fbe3dc;color:#7c2d12;border-radius:10px;padding:10px 12px;font-size:14px;margin:12px 0 0}
  .back{display:inline-block;margin-top:18px;font-size:14px;color:#2a2521;min-height:24px}`;

// Fills the card number from an outcome button; without scripts the numbers are there to type.
const SCRIPT = `document.querySelectorAll('[data-card]').forEach(function(b){b.addEventListener('click',function(){var f=document.getElementById('card');f.value=b.getAttribute('data-card');f.focus();});});`;

/** The pay page of the local payments stand-in: practice only, in Etchwell's own look and words. */
export function payPage(input: { session: CheckoutSession; items: LineItem[]; merchant: string; error?: string; email?: string }): string {
  const { session, items } = input;
  const total = money(session.amount_total, session.currency);
  const lines = items
    .map((i) => `<li><span>${escapeHtml(i.description)} × ${i.quantity}</span><span>${money(i.amount_total, i.currency)}</span></li>`)
    .join('');
  const back = session.cancel_url ? `<a class="back" href="${escapeHtml(session.cancel_url)}">← Back to the shop without paying</a>` : '';
  const closed =
    session.status !== 'open'
      ? `<p>${session.status === 'expired' ? 'The time to pay on this page has run out.' : 'This has been paid already.'}</p>${back}`
      : '';
  const outcomes = PRACTICE_OUTCOMES.map(
    (o) => `<button type="button" data-card="${o.card}">${o.words}<small>${o.card}</small></button>`,
  ).join('');
  const form = `
    <form method="post" action="/pay/${session.id}" autocomplete="off">
      <fieldset><legend>Pick what should happen</legend><div class="outcomes">${outcomes}</div></fieldset>
      ${input.error ? `<p class="error" role="alert">${escapeHtml(input.error)}</p>` : ''}
      <label for="email">E-mail</label><input id="email" name="email" type="email" required value="${escapeHtml(input.email ?? session.customer_email ?? '')}">
      <label for="card">Card number</label><input id="card" name="card" inputmode="numeric" required>
      <div class="pair"><div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required></div>
      <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="3 digits" required></div></div>
      <label for="name">Name on card</label><input id="name" name="name" autocomplete="off" required>
      <button class="pay" type="submit">Pay ${total}</button>
    </form>
    ${back}`;
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Practice payment · ${escapeHtml(input.merchant)}</title><link rel="icon" href="data:,"><style>${STYLE}</style></head><body>
<p class="strip">Practice payment — no money moves</p>
<main><div class="card"><h1>${escapeHtml(input.merchant)}</h1><div class="total">${total}</div><ul class="lines">${lines}</ul>
${closed || form}</div></main><script>${SCRIPT}</script></body></html>`;
}
