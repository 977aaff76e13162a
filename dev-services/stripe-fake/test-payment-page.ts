// The hosted test-payment page at each Checkout Session's URL: a plain page of Restday's own where a
// person or a browser test pays with a test card, then lands on the session's success URL.
import express, { Router } from 'express';
import { formatMoney, isCurrencyCode } from '../../shared/domain/money';
import { StripeApiError } from './api-error';
import type { FakeAccount } from './fake-account';
import type { CheckoutSession, LineItem, Recurring } from './stripe-objects';

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (character) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[character] ?? character);

const money = (amount: number, currency: string) => (isCurrencyCode(currency) ? formatMoney(amount, currency) : `${amount} ${currency.toUpperCase()}`);

function cadence(recurring: Recurring | null | undefined): string {
  if (!recurring) return '';
  const unit = recurring.interval_count === 1 ? recurring.interval : `${recurring.interval_count} ${recurring.interval}s`;
  return ` every ${unit}`;
}

const styles = `
  body { margin: 0; font: 16px/1.5 system-ui, sans-serif; color: #2b2118; background: #f7f3ee; }
  main { max-width: 34rem; margin: 2rem auto; padding: 0 1rem; }
  .notice { border: 2px dashed #8a5a00; background: #fff4d6; padding: .75rem 1rem; }
  table { width: 100%; border-collapse: collapse; margin: 1rem 0; }
  th, td { text-align: left; padding: .35rem .25rem; border-bottom: 1px solid #d9cfc4; }
  td.amount, th.amount { text-align: right; }
  form { display: grid; gap: .35rem; margin: 1.5rem 0; }
  label { font-weight: 600; margin-top: .5rem; }
  input { font: inherit; padding: .5rem; border: 1px solid #6b5a4b; border-radius: 4px; }
  button { font: inherit; font-weight: 600; margin-top: 1rem; padding: .65rem; border: 0; border-radius: 4px; background: #5b3a1e; color: #fff; cursor: pointer; }
  .error { border-left: 4px solid #a61b1b; background: #fde8e8; padding: .5rem .75rem; }
  a { color: #5b3a1e; }
  .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip-path: inset(50%); white-space: nowrap; }
`;

function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)} · Restday test payment</title>
<style>${styles}</style>
</head>
<body>
<main>
<p class="notice"><strong>Test payment page.</strong> This page belongs to Restday's local payment fake for development and tests. No card is charged and no money moves.</p>
${body}
</main>
</body>
</html>`;
}

function summary(session: CheckoutSession, items: LineItem[]): string {
  const rows = items
    .map(
      (item) =>
        `<tr><td>${escapeHtml(item.description)}</td><td>${item.quantity}</td><td class="amount">${escapeHtml(money(item.amount_total, item.currency))}</td></tr>`,
    )
    .join('\n');
  const every = cadence(items[0]?.price.recurring);
  return `<table>
<caption class="visually-hidden">Items in this payment</caption>
<thead><tr><th scope="col">Item</th><th scope="col">Quantity</th><th scope="col" class="amount">Amount</th></tr></thead>
<tbody>
${rows}
</tbody>
<tfoot><tr><th scope="row" colspan="2">Total${escapeHtml(every)}</th><td class="amount"><strong>${escapeHtml(money(session.amount_total, session.currency))}</strong></td></tr></tfoot>
</table>`;
}

interface FormValues {
  cardNumber: string;
  expiry: string;
  cvc: string;
}

function paymentForm(session: CheckoutSession, items: LineItem[], values: FormValues, error?: string): string {
  const every = cadence(items[0]?.price.recurring);
  const cancel = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back to the shop</a></p>` : '';
  return page(
    'Pay',
    `<h1>Test payment</h1>
${summary(session, items)}
${error ? `<p class="error" role="alert">${escapeHtml(error)}</p>` : ''}
<form method="post" action="/test-payment/${escapeHtml(session.id)}">
<label for="card-number">Card number</label>
<input id="card-number" name="cardNumber" inputmode="numeric" autocomplete="off" required value="${escapeHtml(values.cardNumber)}" aria-describedby="test-cards">
<label for="card-expiry">Expiry date (MM/YY)</label>
<input id="card-expiry" name="expiry" autocomplete="off" required placeholder="12/34" value="${escapeHtml(values.expiry)}">
<label for="card-cvc">Security code (CVC)</label>
<input id="card-cvc" name="cvc" inputmode="numeric" autocomplete="off" required value="${escapeHtml(values.cvc)}">
<button type="submit">Pay ${escapeHtml(money(session.amount_total, session.currency))}${escapeHtml(every)}</button>
</form>
${cancel}
<section aria-labelledby="test-cards-heading">
<h2 id="test-cards-heading">Test cards</h2>
<ul id="test-cards">
<li><code>4242 4242 4242 4242</code> pays</li>
<li><code>4000 0000 0000 0002</code> is declined</li>
<li><code>4000 0000 0000 9995</code> is declined for insufficient funds</li>
</ul>
<p>Use any expiry date in the future and any three digits as the security code.</p>
</section>`,
  );
}

function closedPage(session: CheckoutSession): string {
  if (session.status === 'complete') {
    const successUrl = session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id);
    return page('Paid', `<h1>This test payment is complete</h1><p><a href="${escapeHtml(successUrl)}">Back to the shop</a></p>`);
  }
  const back = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Back to the shop</a></p>` : '';
  return page('Expired', `<h1>This test payment has expired</h1><p>Start the checkout again from the shop.</p>${back}`);
}

/** Month and two- or four-digit year, still in the future at the end of that month. */
function parseExpiry(text: string): { month: number; year: number } | null {
  const match = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(text);
  if (!match) return null;
  const month = Number(match[1]);
  const year = match[2]!.length === 2 ? 2000 + Number(match[2]) : Number(match[2]);
  if (month < 1 || month > 12) return null;
  const firstOfNextMonth = Date.UTC(year, month, 1);
  return firstOfNextMonth > Date.now() ? { month, year } : null;
}

export function testPaymentPageRoutes(account: FakeAccount): Router {
  const router = Router();
  router.use(express.urlencoded({ extended: false, limit: '10kb' }));

  const sessionOr404 = (id: string) => {
    try {
      return account.retrieveCheckoutSession(id);
    } catch (error) {
      if (error instanceof StripeApiError && error.status === 404) return undefined;
      throw error;
    }
  };

  router.get('/:id', (req, res) => {
    const session = sessionOr404(req.params.id);
    if (!session) return void res.status(404).type('html').send(page('Not found', '<h1>No such test payment</h1>'));
    if (session.status !== 'open') return void res.type('html').send(closedPage(session));
    res.type('html').send(paymentForm(session, account.lineItemsOf(session.id), { cardNumber: '', expiry: '', cvc: '' }));
  });

  router.post('/:id', (req, res) => {
    const session = sessionOr404(req.params.id);
    if (!session) return void res.status(404).type('html').send(page('Not found', '<h1>No such test payment</h1>'));
    if (session.status !== 'open') return void res.status(409).type('html').send(closedPage(session));
    const body = req.body as Partial<Record<keyof FormValues, unknown>>;
    const values: FormValues = {
      cardNumber: typeof body.cardNumber === 'string' ? body.cardNumber : '',
      expiry: typeof body.expiry === 'string' ? body.expiry : '',
      cvc: typeof body.cvc === 'string' ? body.cvc : '',
    };
    const items = account.lineItemsOf(session.id);
    const refuse = (status: number, message: string) =>
      res
        .status(status)
        .type('html')
        .send(paymentForm(session, items, values, message));

    const expiry = parseExpiry(values.expiry);
    if (!expiry) return void refuse(400, 'Enter the expiry date as MM/YY, in the future.');
    if (!/^\d{3,4}$/.test(values.cvc.trim())) return void refuse(400, 'Enter the three- or four-digit security code.');

    const result = account.payCheckoutSession(session.id, { number: values.cardNumber, expMonth: expiry.month, expYear: expiry.year, cvc: values.cvc.trim() });
    if (!result.ok) return void refuse(402, result.decline.message);
    res.redirect(303, result.session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', result.session.id));
  });

  return router;
}
