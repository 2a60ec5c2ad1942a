import { createHmac, timingSafeEqual } from 'node:crypto';
import { env } from '$env/dynamic/private';

// A guest has no account, so her order page opens with a token that only the shop can make:
// an HMAC of the order number under the server secret. Nothing is stored; every app server can check it.
function sign(number: string) {
	return createHmac('sha256', `order-link:${env.AUTH_SECRET ?? ''}`).update(number).digest('base64url').slice(0, 32);
}

export function orderToken(number: string) {
	return sign(number);
}

export function checkOrderToken(number: string, token: string | null | undefined) {
	if (!token) return false;
	const a = Buffer.from(sign(number));
	const b = Buffer.from(token);
	return a.length === b.length && timingSafeEqual(a, b);
}

export function orderLink(number: string) {
	const origin = env.ORIGIN ?? 'http://127.0.0.1:3000';
	return `${origin}/orders/${encodeURIComponent(number)}?t=${orderToken(number)}`;
}
