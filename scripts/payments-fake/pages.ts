// Plain pages of the fake provider: checkout (a person or a browser test confirms a test card), the
// customer-management page (cancel at period end, resume, card) and an invoice. No scripts.
import type { Invoice, Json, Price, Subscription } from './store';

export const TEST_CARD = '4242 4242 4242 4242';
export const DECLINED_CARD = '4000 0000 0000 0002';

const esc = (s: unknown) =>
	String(s ?? '').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const money = (minor: number, currency: string) =>
	new Intl.NumberFormat('en-GB', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
const day = (s: number) => new Date(s * 1000).toISOString().slice(0, 10);

function layout(title: string, body: string): string {
	return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(title)}</title>
<style>
body{font:15px/1.45 system-ui,sans-serif;background:#f4f4f7;color:#1a1f36;margin:0;padding:2rem}
main{max-width:30rem;margin:0 auto;background:#fff;border:1px solid #e3e3ea;border-radius:8px;padding:1.5rem}
h1{font-size:1.2rem;margin-top:0}label{display:block;margin:.7rem 0 .2rem;font-weight:600}
input{width:100%;box-sizing:border-box;padding:.45rem;border:1px solid #c7c7d1;border-radius:4px;font:inherit}
button{margin-top:1rem;padding:.5rem 1rem;border:0;border-radius:4px;background:#4b47c9;color:#fff;font:inherit;cursor:pointer}
button.plain{background:#fff;color:#4b47c9;border:1px solid #4b47c9}.error{color:#a11;font-weight:600}
.note{color:#555;font-size:.85rem}dl{display:grid;grid-template-columns:auto 1fr;gap:.2rem 1rem}dt{color:#555}
</style></head><body><main>${body}
<p class="note">Local test payments: nothing leaves this machine and no money moves.</p></main></body></html>`;
}

export function checkoutPage(session: Json, price: Price, quantity: number, error?: string): string {
	const total = money(price.unit_amount * quantity, price.currency);
	const closed = session.status !== 'open';
	return layout(
		'Checkout',
		`<h1>Subscribe to Dartelier Studio</h1>
<dl><dt>Plan</dt><dd>${esc(price.nickname)}</dd><dt>Seats</dt><dd data-testid="checkout-seats">${quantity}</dd>
<dt>Total</dt><dd>${total} a ${price.recurring.interval}</dd></dl>
${closed ? `<p>This checkout is ${esc(session.status)}.</p><p><a href="${esc(session.success_url)}">Back to Dartelier</a></p>` : `
${error ? `<p class="error" role="alert">${esc(error)}</p>` : ''}
<form method="post" action="/checkout/${esc(session.id)}/pay">
<label for="card">Card number</label><input id="card" name="card" inputmode="numeric" autocomplete="off" placeholder="${TEST_CARD}" required>
<label for="expiry">Expiry (MM / YY)</label><input id="expiry" name="expiry" placeholder="12 / 34" required>
<label for="cvc">CVC</label><input id="cvc" name="cvc" inputmode="numeric" placeholder="123" required>
<label for="holder">Name on card</label><input id="holder" name="holder" autocomplete="off">
<button type="submit">Pay and subscribe</button>
</form>
<p class="note">Test card ${TEST_CARD} (any future expiry, any CVC) is accepted; ${DECLINED_CARD} is declined.</p>
<form method="post" action="/checkout/${esc(session.id)}/cancel"><button class="plain" type="submit">Cancel and go back</button></form>`}`
	);
}

export function portalPage(session: Json, subs: Subscription[], cardLast4: string | null): string {
	const rows = subs
		.map((s) => {
			const item = s.items.data[0];
			return `<section><dl><dt>Subscription</dt><dd>${esc(s.id)}</dd><dt>Status</dt><dd data-testid="portal-status">${esc(s.status)}${s.cancel_at_period_end ? ' (ends at period end)' : ''}</dd>
<dt>Seats</dt><dd>${item.quantity}</dd><dt>Billed</dt><dd>${money(item.price.unit_amount * item.quantity, item.price.currency)} a ${item.price.recurring.interval}</dd>
<dt>Period ends</dt><dd>${day(item.current_period_end)}</dd></dl>
${s.status === 'canceled' ? '' : s.cancel_at_period_end
	? `<form method="post" action="/portal/${esc(session.id)}/resume"><input type="hidden" name="subscription" value="${esc(s.id)}"><button type="submit">Keep the plan</button></form>`
	: `<form method="post" action="/portal/${esc(session.id)}/cancel"><input type="hidden" name="subscription" value="${esc(s.id)}"><button class="plain" type="submit">Cancel at period end</button></form>`}
</section>`;
		})
		.join('');
	return layout(
		'Manage billing',
		`<h1>Manage billing</h1>${rows || '<p>No subscriptions.</p>'}
<h2>Card</h2><p>${cardLast4 ? `Card ending ${esc(cardLast4)}` : 'No card on file.'}</p>
<form method="post" action="/portal/${esc(session.id)}/card"><label for="card">New card number</label><input id="card" name="card" placeholder="${TEST_CARD}" required><button type="submit">Save the card</button></form>
${session.return_url ? `<p><a href="${esc(session.return_url)}">Back to Dartelier</a></p>` : ''}`
	);
}

export function invoicePage(i: Invoice): string {
	return layout(
		`Invoice ${i.number}`,
		`<h1>Invoice ${esc(i.number)}</h1><dl><dt>Date</dt><dd>${day(i.created)}</dd><dt>Amount</dt><dd>${money(i.amount_due, i.currency)}</dd>
<dt>Status</dt><dd>${esc(i.status)}</dd></dl>`
	);
}
