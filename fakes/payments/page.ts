// The fake's own practice payment page: plain HTML in Brinewright's palette, labelled fields,
// enough contrast for axe, and a layout that fits a 390 px phone.
import { CARDS, spaced } from './cards';

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function money(cents: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}

type PageSession = {
  id: string;
  amount_total: number;
  currency: string;
  customer_email: string | null;
  cancel_url: string | null;
  status: string;
  line_items_name: string;
};

export function checkoutPage(session: PageSession, options: { error?: string; values?: Record<string, string> } = {}): string {
  const v = options.values ?? {};
  const closed = session.status !== 'open';
  const amount = esc(money(session.amount_total, session.currency));
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Practice payment of ${amount} · Brinewright</title>
<style>
 *{box-sizing:border-box}
 body{font-family:system-ui,sans-serif;background:#fbf8f1;color:#1d2522;margin:0}
 .band{background:#1a4037;color:#eef6f3;padding:1rem}
 .band p{margin:0 auto;max-width:44rem} .band strong{color:#f5e1cf}
 main{max-width:44rem;margin:0 auto;padding:1.25rem 1rem 2rem}
 h1{font-family:Merriweather,Georgia,serif;color:#13302a;font-size:1.4rem;margin:0 0 1rem}
 .bill{border-left:6px solid #b86a2e;background:#f2ece0;padding:.75rem 1rem;margin:0 0 1.25rem}
 .bill dl{display:grid;grid-template-columns:auto 1fr;gap:.25rem 1rem;margin:0} .bill dt{color:#46524d} .bill dd{margin:0;font-weight:600}
 fieldset{border:1px solid #abd3c4;border-radius:.9rem;padding:1rem;margin:0;background:#fff}
 legend{font-weight:700;color:#1f5043;padding:0 .35rem}
 label{display:block;font-weight:600;margin-top:.85rem} input{width:100%;font-size:1rem;padding:.55rem;border:1px solid #46524d;border-radius:.5rem;background:#fff;color:#1d2522}
 .pair{display:grid;grid-template-columns:repeat(auto-fit,minmax(9rem,1fr));gap:0 .75rem}
 button{margin-top:1.1rem;font-size:1rem;font-weight:700;padding:.65rem 1.25rem;border:0;border-radius:.5rem;background:#9a5523;color:#fff;cursor:pointer}
 button:focus-visible,input:focus-visible,a:focus-visible{outline:2px solid #b86a2e;outline-offset:2px}
 .problem{background:#fbeff2;color:#6e1834;border-left:6px solid #a3294f;padding:.75rem 1rem;margin:0 0 1rem}
 .numbers{font-size:.95rem;color:#46524d;margin-top:1.25rem} .numbers code{font-size:1rem;color:#1d2522;white-space:nowrap}
 a{color:#1f5043}
</style></head>
<body>
<div class="band"><p><strong>Practice payment.</strong> This page belongs to Brinewright's local stand-in for the card service: no money moves and no card is charged.</p></div>
<main>
<h1>Practice payment for ${esc(session.line_items_name)}</h1>
<div class="bill"><dl>
 <dt>Course fee</dt><dd>${amount}</dd>
 ${session.customer_email ? `<dt>Receipt goes to</dt><dd>${esc(session.customer_email)}</dd>` : ''}
</dl></div>
${
  closed
    ? `<p class="problem" role="alert">${esc(session.status === 'complete' ? 'This fee is already paid.' : 'This practice payment has closed. Go back to the course page to hold a seat again.')}</p>`
    : `
${options.error ? `<p class="problem" role="alert" id="pay-error">${esc(options.error)}</p>` : ''}
<form method="post" action="/pay/${esc(session.id)}" novalidate>
<fieldset><legend>Practice card</legend>
 <label for="card">Card number</label>
 <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" value="${esc(v.card ?? '')}" ${options.error ? 'aria-describedby="pay-error" aria-invalid="true"' : ''} required>
 <div class="pair">
  <div><label for="exp">Expiry (MM/YY)</label><input id="exp" name="exp" autocomplete="cc-exp" value="${esc(v.exp ?? '')}" required></div>
  <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" value="${esc(v.cvc ?? '')}" required></div>
 </div>
 <label for="name">Name on card</label>
 <input id="name" name="name" autocomplete="cc-name" value="${esc(v.name ?? '')}">
 <button type="submit">Pay the course fee (${amount})</button>
</fieldset>
</form>
<p class="numbers">Practice numbers: <code>${spaced(CARDS.pays)}</code> goes through; <code>${spaced(CARDS.declined)}</code> is turned down by the card's bank. Any expiry date still to come and any three digits.</p>`
}
${session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">Leave without paying</a></p>` : ''}
</main></body></html>`;
}
