import Stripe from 'stripe';
import { env } from '$env/dynamic/private';

let client: Stripe | null = null;

/**
 * The payment provider's SDK. Locally it points at the payment fake (STRIPE_API_HOST/PORT/PROTOCOL);
 * without those it talks to the real provider with the real key.
 */
export function stripe() {
	if (!client) {
		const local = env.STRIPE_API_HOST
			? { host: env.STRIPE_API_HOST, port: Number(env.STRIPE_API_PORT ?? 443), protocol: (env.STRIPE_API_PROTOCOL ?? 'https') as 'http' | 'https' }
			: {};
		// The SDK does not retry on its own: a failed checkout is shown to the shopper, who can try again.
		client = new Stripe(env.STRIPE_SECRET_KEY ?? 'sk_test_missing', { ...local, maxNetworkRetries: 0, timeout: 10_000 });
	}
	return client;
}

export function webhookSecret() {
	return env.STRIPE_WEBHOOK_SECRET ?? '';
}
