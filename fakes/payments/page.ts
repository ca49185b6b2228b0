// The fake's own checkout page: plain HTML, labelled fields, enough contrast for axe.
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
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Pay ${esc(money(session.amount_total, session.currency))} — local test checkout</title>
<style>
 body{font-family:system-ui,sans-serif;background:#f4f1ea;color:#1f2933;margin:0;padding:2rem 1rem}
 main{max-width:28rem;margin:0 auto;background:#fff;border:1px solid #d5d0c4;border-radius:12px;padding:1.5rem}
 h1{font-size:1.35rem;margin:0 0 .25rem} .amount{font-size:2rem;font-weight:700;margin:.5rem 0}
 label{display:block;font-weight:600;margin-top:1rem} input{width:100%;box-sizing:border-box;font-size:1rem;padding:.6rem;border:1px solid #6b7280;border-radius:8px}
 .row{display:flex;gap:.75rem} .row>div{flex:1} button{margin-top:1.25rem;width:100%;font-size:1.05rem;font-weight:700;padding:.75rem;border:0;border-radius:8px;background:#1d4ed8;color:#fff;cursor:pointer}
 .error{background:#fde8e8;color:#8a1c1c;border:1px solid #e0a3a3;border-radius:8px;padding:.75rem;margin-top:1rem}
 .note{font-size:.9rem;color:#4b5563} a{color:#1e40af}
</style></head>
<body><main>
<p class="note">Local test payment server — no real card is charged.</p>
<h1>${esc(session.line_items_name)}</h1>
<p class="amount">${esc(money(session.amount_total, session.currency))}</p>
${session.customer_email ? `<p class="note">Receipt to ${esc(session.customer_email)}</p>` : ''}
${
  closed
    ? `<p class="error" role="alert">This checkout is ${esc(session.status === 'complete' ? 'already paid' : 'no longer open')}.</p>`
    : `
${options.error ? `<p class="error" role="alert" id="pay-error">${esc(options.error)}</p>` : ''}
<form method="post" action="/pay/${esc(session.id)}" novalidate>
 <label for="card">Card number</label>
 <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" value="${esc(v.card ?? '')}" ${options.error ? 'aria-describedby="pay-error" aria-invalid="true"' : ''} required>
 <div class="row">
  <div><label for="exp">Expiry (MM/YY)</label><input id="exp" name="exp" autocomplete="cc-exp" value="${esc(v.exp ?? '')}" required></div>
  <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" value="${esc(v.cvc ?? '')}" required></div>
 </div>
 <label for="name">Name on card</label>
 <input id="name" name="name" autocomplete="cc-name" value="${esc(v.name ?? '')}">
 <button type="submit">Pay ${esc(money(session.amount_total, session.currency))}</button>
</form>
<p class="note">Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined. Any future expiry and any 3 digits.</p>`
}
${session.cancel_url ? `<p><a href="${esc(session.cancel_url)}">Cancel and go back</a></p>` : ''}
</main></body></html>`;
}
