import { json } from '@sveltejs/kit';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { stripe, webhookSecret } from '$lib/server/payments/stripe';
import { applyEvent } from '$lib/server/payments/webhook';
import type { RequestHandler } from './$types';

// The provider signs every delivery; an unsigned, tampered or stale one (older than the SDK's
// 300 s tolerance) is refused with 400 and changes nothing.
export const POST: RequestHandler = async ({ request }) => {
	const signature = request.headers.get('stripe-signature');
	const body = await request.text();
	if (!signature) return json({ message: 'Missing signature.' }, { status: 400 });
	let event;
	try {
		event = stripe().webhooks.constructEvent(body, signature, webhookSecret());
	} catch {
		return json({ message: 'Signature check failed.' }, { status: 400 });
	}
	const { duplicate, mailIds } = await applyEvent(db, event);
	// The event is applied and its mail is in the outbox: answer now and send the mail after. Holding
	// the answer for an SMTP round trip (at least the mail server's greeting delay) caps how fast
	// events are taken when they come one at a time, as the payment fake sends them. A failed send
	// waits in the outbox for the worker, as before; deliverQueued catches every failure itself.
	void deliverQueued(mailIds);
	return json({ received: true, duplicate });
};
