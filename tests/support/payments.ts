import Stripe from 'stripe';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testEnv } from './env';
import { signInCookie } from './session';

/** The provider's API at the payment fake, read the way the shop's SDK reads it. */
export async function fakeApi(path: string) {
	const res = await fetch(`${testEnv.paymentsUrl}/v1${path}`, { headers: { authorization: `Bearer ${testEnv.stripeKey}` } });
	return res.json();
}

type Session = { id: string; status: string; url: string | null; amount_total: number; client_reference_id: string | null; payment_intent: string | null };

/** Every checkout session the payment fake holds for one order number (walks the whole list). */
export async function sessionsFor(orderNumber: string): Promise<Session[]> {
	const out: Session[] = [];
	let after = '';
	for (;;) {
		const page = await fakeApi(`/checkout/sessions?limit=100${after ? `&starting_after=${after}` : ''}`);
		out.push(...page.data.filter((s: Session) => s.client_reference_id === orderNumber));
		if (!page.has_more) return out;
		after = page.data.at(-1).id;
	}
}

export async function refundsOf(paymentIntent: string): Promise<{ id: string; amount: number }[]> {
	return (await fakeApi(`/refunds?payment_intent=${encodeURIComponent(paymentIntent)}&limit=100`)).data;
}

/** The SDK pointed at the payment fake, for a test that plays the provider's side. */
export function fakeStripe() {
	const u = new URL(testEnv.paymentsUrl);
	return new Stripe(testEnv.stripeKey, { host: u.hostname, port: Number(u.port), protocol: 'http', maxNetworkRetries: 0 });
}

/** Posts an event signed with the shop's real webhook secret, as a provider (or someone holding the secret) would. */
export function postSignedEvent(type: string, object: Record<string, unknown>) {
	const payload = JSON.stringify({ id: `evt_test_${crypto.randomUUID().replaceAll('-', '')}`, object: 'event', type, created: Math.floor(Date.now() / 1000), data: { object } });
	const signature = fakeStripe().webhooks.generateTestHeaderString({ payload, secret: testEnv.webhookSecret });
	return fetch(`${testEnv.appUrl}/api/webhooks/stripe`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload });
}

export function ownerCookie() {
	const owner = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
	return signInCookie(owner.email, DEMO_SIGN_INS.password);
}

/** The back office's one-line answer to a form action (data-testid="action-message"), as the page shows it. */
export function actionMessage(html: string) {
	const m = html.match(/data-testid="action-message"[^>]*>([^<]*)</);
	return m ? m[1].replaceAll('&amp;', '&').replaceAll('&#39;', "'").replaceAll('&quot;', '"') : null;
}

/** The refund form's key as the owner's order page hands it out when it loads (a new one on each load). */
export async function refundFormKey(orderId: number, cookie: string) {
	const page = await (await fetch(`${testEnv.appUrl}/admin/orders/${orderId}`, { headers: { cookie } })).text();
	return page.match(/name="refundKey"[^>]*value="([^"]+)"/)?.[1] ?? page.match(/value="([^"]+)"[^>]*name="refundKey"/)?.[1] ?? '';
}
