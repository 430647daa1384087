import { formatCents as usd } from '@cc/shared';

// The fake payment service's own payment page: one small form, readable at phone width, that says
// plainly it is a test page and which card numbers it takes.

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);


const STYLE = `
  *{box-sizing:border-box} body{margin:0;font-family:system-ui,sans-serif;background:#eef1f4;color:#1b1f24}
  main{max-width:420px;margin:0 auto;padding:24px 16px}
  .card{background:#fff;border-radius:12px;padding:20px;box-shadow:0 1px 3px rgba(0,0,0,.15)}
  h1{font-size:1.25rem;margin:0 0 4px} .amount{font-size:2rem;font-weight:700;margin:8px 0 16px}
  .test{background:#fff4d6;border:1px solid #b58100;border-radius:8px;padding:8px 12px;font-size:.9rem;margin-bottom:16px}
  label{display:block;font-weight:600;margin:12px 0 4px} input{width:100%;font-size:1.1rem;padding:10px;border:1px solid #5c6670;border-radius:6px}
  .row{display:flex;gap:12px} .row>div{flex:1}
  .error{background:#fde8e8;border:1px solid #b3261e;color:#8c1d18;border-radius:8px;padding:8px 12px;margin-bottom:12px}
  button{font-size:1.05rem;padding:12px 16px;border-radius:8px;border:0;cursor:pointer;width:100%;margin-top:16px}
  .pay{background:#1d4ed8;color:#fff} .cancel{background:transparent;color:#1d4ed8;text-decoration:underline;margin-top:8px}
  code{font-size:.95rem}`;

export function renderPaymentPage(session: { id: string; amount_total: number; description: string }, error: string | null): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Test payment · ${escape(usd(session.amount_total))}</title><style>${STYLE}</style></head>
<body><main>
<div class="card">
  <h1>${escape(session.description)}</h1>
  <p class="amount" data-testid="fake-pay-amount">${escape(usd(session.amount_total))}</p>
  <p class="test" role="note">Test payment page on this computer: no card is charged. Use a published test card: <code>4242 4242 4242 4242</code> is paid, <code>4000 0000 0000 0002</code> is declined; any future expiry, any 3 digits.</p>
  ${error ? `<p class="error" role="alert" data-testid="fake-pay-error">${escape(error)}</p>` : ''}
  <form method="post" action="/pay/${escape(session.id)}">
    <label for="card">Card number</label>
    <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required data-testid="fake-pay-card">
    <div class="row">
      <div><label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" autocomplete="cc-exp" required data-testid="fake-pay-expiry"></div>
      <div><label for="cvc">Security code</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" required data-testid="fake-pay-cvc"></div>
    </div>
    <button class="pay" type="submit" data-testid="fake-pay-submit">Pay ${escape(usd(session.amount_total))}</button>
  </form>
  <form method="post" action="/pay/${escape(session.id)}/cancel"><button class="cancel" type="submit">Cancel and go back</button></form>
</div>
</main></body></html>`;
}
