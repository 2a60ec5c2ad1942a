import { json } from '@sveltejs/kit';
import type { FailureAnswer, WebhookAnswer } from '$lib/api/answers';
import { db } from '$lib/server/db';
import { deliverQueued } from '$lib/server/mail';
import { stripe, webhookSecret } from '$lib/server/order/payments/stripe';
import { applyEvent } from '$lib/server/order/payments/webhook';
import type { RequestHandler } from './$types';

// The provider signs every delivery; an unsigned, tampered or stale one (older than the SDK's
// 300 s tolerance) is refused with 400 and changes nothing.
export const POST: RequestHandler = async ({ request }) => {
	const signature = request.headers.get('stripe-signature');
	const body = await request.text();
	if (!signature) return json({ message: 'Missing signature.' } satisfies FailureAnswer, { status: 400 });
	let event;
	try {
		event = stripe().webhooks.constructEvent(body, signature, webhookSecret());
	} catch {
		return json({ message: 'Signature check failed.' } satisfies FailureAnswer, { status: 400 });
	}
	let applied;
	try {
		applied = await applyEvent(db, stripe(), event);
	} catch (err) {
		// Nothing of it was recorded (one transaction): a non-2xx answer makes the provider send it again.
		console.error(`[payments] event ${event.id} (${event.type}) not applied: ${(err as Error).message}`);
		return json({ message: 'The event could not be applied just now; send it again.' } satisfies FailureAnswer, { status: 503 });
	}
	const { duplicate, mailIds } = applied;
	// The event is applied and its mail is in the outbox: answer now and send the mail after. Holding
	// the answer for an SMTP round trip (at least the mail server's greeting delay) caps how fast
	// events are taken when they come one at a time, as the payment fake sends them. A failed send
	// waits in the outbox for the worker, as before; deliverQueued catches every failure itself.
	void deliverQueued(mailIds);
	return json({ received: true, duplicate } satisfies WebhookAnswer);
};
