// @ts-check
// The hosted payment page: our own plain look (paper, ink, chalk blue), no
// script, every value escaped. It exists so a person trying the shop can
// finish a purchase with a test card and see what a decline looks like.

/** @typedef {Record<string, any>} Obj */

/** @param {unknown} value */
export function escapeHtml(value) {
	return String(value ?? '')
		.replaceAll('&', '&amp;')
		.replaceAll('<', '&lt;')
		.replaceAll('>', '&gt;')
		.replaceAll('"', '&quot;')
		.replaceAll("'", '&#39;');
}

/**
 * Minor units to a display amount, with the currency's own number of decimals.
 * @param {number} minor
 * @param {string} currency
 */
export function money(minor, currency) {
	const fmt = new Intl.NumberFormat('en-GB', {
		style: 'currency',
		currency: currency.toUpperCase()
	});
	return fmt.format(minor / 10 ** (fmt.resolvedOptions().maximumFractionDigits ?? 2));
}

const STYLE = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #F6F1E7; color: #1E2230; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; }
main { max-width: 34rem; margin: 0 auto; padding: 2rem 1.25rem 3rem; }
h1, h2 { font-family: Georgia, "Times New Roman", serif; font-weight: 600; line-height: 1.25; }
h1 { font-size: 1.6rem; margin: .25rem 0 .75rem; }
h2 { font-size: 1.15rem; margin: 1.75rem 0 .5rem; }
.badge { display: inline-block; margin: 0; padding: .1rem .55rem; border: 1px solid #35598A; border-radius: 999px; color: #35598A; font-size: .8rem; letter-spacing: .04em; text-transform: uppercase; }
.lead, .hint, .small { color: #4F535E; }
.hint { font-size: .875rem; margin: .25rem 0 0; }
.small { font-size: .8rem; }
table { width: 100%; border-collapse: collapse; font-variant-numeric: tabular-nums; }
th, td { padding: .45rem 0; border-bottom: 1px solid #D9D1C1; text-align: left; vertical-align: top; }
th { font-size: .85rem; font-weight: 600; color: #4F535E; }
.num { text-align: right; white-space: nowrap; padding-left: 1rem; }
tfoot td { border-bottom: 0; font-weight: 700; font-size: 1.05rem; padding-top: .6rem; }
.card { background: #FFFDF8; border: 1px solid #D9D1C1; border-radius: .5rem; padding: 1.25rem; margin-top: 1rem; }
.field { margin-bottom: 1rem; }
.row { display: flex; gap: 1rem; flex-wrap: wrap; }
.row .field { flex: 1 1 9rem; }
label { display: block; font-weight: 600; margin-bottom: .3rem; }
input { width: 100%; font: inherit; font-variant-numeric: tabular-nums; padding: .6rem .7rem; border: 1px solid #6B6F7A; border-radius: .375rem; background: #fff; color: #1E2230; }
input[aria-invalid="true"] { border-color: #A8323E; border-width: 2px; }
input:focus-visible, button:focus-visible, a:focus-visible { outline: 3px solid #35598A; outline-offset: 2px; }
button { width: 100%; font: inherit; font-weight: 700; padding: .75rem 1rem; border: 0; border-radius: .375rem; background: #35598A; color: #fff; cursor: pointer; }
button:hover { background: #2B4A73; }
a { color: #35598A; }
.error { color: #A8323E; font-weight: 600; margin: .3rem 0 0; font-size: .9rem; }
.alert { border: 2px solid #A8323E; background: #FBEDEE; color: #1E2230; border-radius: .375rem; padding: .75rem 1rem; margin: 0 0 1rem; }
.alert strong { color: #A8323E; }
.done { border: 2px solid #3F6B4E; background: #EEF4EF; border-radius: .375rem; padding: .75rem 1rem; }
.cancel { margin-top: 1rem; text-align: center; }
footer { margin-top: 2rem; }
.flush { margin-top: 0; }
`;

/**
 * @param {string} title
 * @param {string} body
 */
function layout(title, body) {
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
<p class="badge">Test mode</p>
${body}
<footer><p class="small">Quarterline test payment page, served by the local payment fake. It takes no money and keeps nothing once it stops.</p></footer>
</main>
</body>
</html>`;
}

/**
 * @param {Obj} session
 * @param {Obj[]} lineItems
 */
function summary(session, lineItems) {
	const rows = lineItems
		.map(
			(li) =>
				`<tr><td>${escapeHtml(li.description)}</td><td class="num">${li.quantity}</td><td class="num">${escapeHtml(money(li.amount_total, li.currency))}</td></tr>`
		)
		.join('\n');
	return `<h2 id="summary-heading">You are paying</h2>
<table aria-labelledby="summary-heading">
<thead><tr><th scope="col">Item</th><th scope="col" class="num">Qty</th><th scope="col" class="num">Amount</th></tr></thead>
<tbody>
${rows}
</tbody>
<tfoot><tr><td colspan="2">Total</td><td class="num">${escapeHtml(money(session.amount_total, session.currency))}</td></tr></tfoot>
</table>
${session.customer_email ? `<p class="hint">Receipt to ${escapeHtml(session.customer_email)}</p>` : ''}`;
}

/**
 * @typedef {{ card?: string, exp?: string, cvc?: string }} Values
 * @typedef {{ field: 'card' | 'exp' | 'cvc', message: string }} FieldProblem
 */

/**
 * @param {string} name
 * @param {string} label
 * @param {string} hint
 * @param {{ value?: string, problem?: FieldProblem, attrs: string }} opts
 */
function field(name, label, hint, { value, problem, attrs }) {
	const bad = problem?.field === name;
	const described = `${name}-hint${bad ? ` ${name}-error` : ''}`;
	return `<div class="field">
<label for="${name}">${label}</label>
<input id="${name}" name="${name}" ${attrs} value="${escapeHtml(value ?? '')}" aria-describedby="${described}"${bad ? ' aria-invalid="true"' : ''}>
<p id="${name}-hint" class="hint">${hint}</p>
${bad ? `<p id="${name}-error" class="error">${escapeHtml(problem?.message)}</p>` : ''}
</div>`;
}

const FIELD_NAMES = { card: 'the card number', exp: 'the expiry date', cvc: 'the security code' };

/**
 * The payment form for an open session.
 * @param {{ session: Obj, lineItems: Obj[], values?: Values, problem?: FieldProblem, declined?: string }} opts
 */
export function payPage({ session, lineItems, values = {}, problem, declined }) {
	const total = money(session.amount_total, session.currency);
	const alert = declined
		? `<div class="alert" role="alert"><strong>${escapeHtml(declined)}</strong><br>You can try again with another card.</div>`
		: problem
			? `<div class="alert" role="alert"><strong>Please check the card details.</strong><br>See <a href="#${problem.field}">${FIELD_NAMES[problem.field]}</a> below.</div>`
			: '';
	const cancel = session.cancel_url
		? `<p class="cancel"><a href="${escapeHtml(session.cancel_url)}">Cancel and go back to the shop</a></p>`
		: '';
	const body = `<h1>Quarterline test payment — no real money moves</h1>
<p class="lead">This page stands in for a card payment provider while you try the shop. Never type a real card number here: only the test numbers below work.</p>
${summary(session, lineItems)}
<div class="card">
<h2 id="card-heading" class="flush">Card details</h2>
${alert}
<form method="post" action="/pay/${escapeHtml(session.id)}" aria-labelledby="card-heading" novalidate>
${field('card', 'Card number', '4242 4242 4242 4242 pays. 4000 0000 0000 0002 shows a declined card.', {
	value: values.card,
	problem,
	attrs: 'type="text" inputmode="numeric" autocomplete="off" spellcheck="false" maxlength="23" required'
})}
<div class="row">
${field('exp', 'Expiry date (MM / YY)', 'Any month in the future.', {
	value: values.exp,
	problem,
	attrs: 'type="text" inputmode="numeric" autocomplete="off" maxlength="7" placeholder="MM / YY" required'
})}
${field('cvc', 'Security code (CVC)', 'Any 3 digits.', {
	value: '',
	problem,
	attrs: 'type="text" inputmode="numeric" autocomplete="off" maxlength="4" required'
})}
</div>
<button type="submit">Pay ${escapeHtml(total)}</button>
</form>
${cancel}
</div>`;
	return layout(`Pay ${total} — Quarterline test payment`, body);
}

/**
 * What a visitor sees for a session that is no longer open.
 * @param {Obj} session
 */
export function closedPage(session) {
	if (session.status === 'complete') {
		const next = String(session.success_url).replaceAll('{CHECKOUT_SESSION_ID}', session.id);
		return layout(
			'Payment complete — Quarterline test payment',
			`<h1>This payment is complete</h1>
<div class="done" role="status"><p>${escapeHtml(money(session.amount_total, session.currency))} was paid with a test card. No real money moved.</p></div>
<p><a href="${escapeHtml(next)}">Continue to the shop</a></p>`
		);
	}
	const back = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Go back to the shop</a></p>` : '';
	return layout(
		'Payment page expired — Quarterline test payment',
		`<h1>This payment page has expired</h1>
<p>No money was taken. Start the checkout again from the shop to get a new payment page.</p>
${back}`
	);
}

export function notFoundPage() {
	return layout(
		'No such payment — Quarterline test payment',
		`<h1>No such payment</h1>
<p>This payment page does not exist here. Payment pages live only as long as the local payment fake runs; start the checkout again from the shop.</p>`
	);
}
