import { testEnv } from './env';

/** A tiny cookie jar, so a test can walk the shop like one browser without JavaScript. */
export class Browser {
	cookies = new Map<string, string>();
	header() {
		return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
	}
	keep(res: Response) {
		for (const c of res.headers.getSetCookie()) {
			const [pair] = c.split(';');
			const i = pair.indexOf('=');
			const name = pair.slice(0, i);
			const value = pair.slice(i + 1);
			if (/max-age=0|expires=thu, 01 jan 1970/i.test(c) || value === '') this.cookies.delete(name);
			else this.cookies.set(name, value);
		}
		return res;
	}
	async get(path: string) {
		return this.keep(await fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: { cookie: this.header() } }));
	}
	async post(path: string, fields: Record<string, string>) {
		return this.keep(
			await fetch(`${testEnv.appUrl}${path}`, {
				method: 'POST',
				redirect: 'manual',
				headers: { 'content-type': 'application/x-www-form-urlencoded', accept: 'text/html', origin: testEnv.appUrl, cookie: this.header() },
				body: new URLSearchParams(fields)
			})
		);
	}
}

export const GUEST_ADDRESS = {
	email: 'mirela.test@example.com',
	name: 'Mirela Voss',
	line1: 'Hafenstraße 4',
	line2: '',
	city: 'Kiel',
	postcode: '24103',
	country: 'DE',
	measurementConsent: 'on',
	madeToMeasure: 'on'
};

export type SkirtFields = { waist: number; hip: number; length: number; waistToHip?: number; fabricId: number; units?: 'cm' | 'in'; lining?: boolean };

/** Adds a skirt to the bag through the measuring form, as the shop's page posts it. */
export async function addToBag(browser: Browser, style: string, s: SkirtFields) {
	const fields: Record<string, string> = {
		units: s.units ?? 'cm',
		waist: String(s.waist),
		hip: String(s.hip),
		length: String(s.length),
		fabricId: String(s.fabricId),
		waistband: 'band',
		closureKind: 'zip',
		closurePosition: 'centre-back',
		vent: 'auto'
	};
	if (s.waistToHip) fields.waistToHip = String(s.waistToHip);
	else fields.unknownDepth = 'on';
	if (s.lining) fields.lining = 'on';
	return browser.post(`/styles/${style}/make?/add`, fields);
}

/** Checks out the bag; returns the payment page address and the checkout session id. */
export async function checkout(browser: Browser, address: Record<string, string> = GUEST_ADDRESS) {
	const res = await browser.post('/checkout', address);
	const location = res.headers.get('location') ?? '';
	const sessionId = location.match(/\/pay\/(cs_[A-Za-z0-9_]+)/)?.[1] ?? null;
	return { res, location, sessionId };
}

export async function payWithCard(sessionId: string, card: string) {
	const res = await fetch(`${testEnv.paymentsUrl}/_fake/sessions/${sessionId}/pay`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ card }) });
	return { status: res.status, body: await res.json() };
}

/** Waits until `check` returns something truthy (webhooks arrive a moment after the payment). */
export async function eventually<T>(check: () => Promise<T | null | undefined | false>, timeoutMs = 10_000): Promise<T> {
	const until = Date.now() + timeoutMs;
	for (;;) {
		const v = await check();
		if (v) return v;
		if (Date.now() > until) throw new Error('timed out waiting');
		await new Promise((r) => setTimeout(r, 150));
	}
}

export async function mailsTo(address: string): Promise<{ subject: string; text: string; html: string }[]> {
	const body = await (await fetch(`${testEnv.mailUrl}/api/messages?to=${encodeURIComponent(address)}`)).json();
	return body.data;
}

export const CARDS = { success: '4242424242424242', decline: '4000000000000002' };

/** A new order paid through the payment fake, for tests that need their own order to move. */
export async function paidOrder(fabricId: number, email = `order-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.com`, style = 'rue-straight') {
	const browser = new Browser();
	const added = await addToBag(browser, style, { waist: 72, hip: 98, length: 60, waistToHip: 20.5, fabricId });
	if (added.status !== 303) throw new Error(`adding to the bag answered ${added.status}`);
	const { sessionId } = await checkout(browser, { ...GUEST_ADDRESS, email });
	if (!sessionId) throw new Error('checkout gave no payment session');
	await payWithCard(sessionId, CARDS.success);
	const res = await eventually(async () => {
		const r = await fetch(`${testEnv.paymentsUrl}/v1/checkout/sessions/${sessionId}`, { headers: { authorization: `Bearer ${testEnv.stripeKey}` } });
		const s = await r.json();
		return s.payment_status === 'paid' ? s : null;
	});
	return { sessionId, number: res.client_reference_id as string, email };
}
