// Every e-mail uses the same words as the shop, a short summary and one link.
import { firstName } from '$lib/orders/names';
const esc = (s: string) =>
	s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export type MailImage = { cid: string; alt: string };

export function layout(title: string, paragraphs: string[], link?: { href: string; label: string }, images: MailImage[] = []) {
	const pictures = images.map((i) => `<p style="margin:0 0 14px"><img src="cid:${esc(i.cid)}" alt="${esc(i.alt)}" width="280" style="display:block;width:280px;max-width:100%;height:auto;border:1px solid #e3dccd;border-radius:6px;background:#fff"></p>`).join('');
	const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${esc(p)}</p>`).join('') + pictures;
	const button = link
		? `<p style="margin:22px 0"><a href="${esc(link.href)}" style="background:#35598A;color:#fff;padding:10px 18px;border-radius:6px;text-decoration:none">${esc(link.label)}</a></p>`
		: '';
	return `<!doctype html><html lang="en"><body style="margin:0;background:#F6F1E7;color:#1E2230;font-family:Georgia,serif;font-size:16px;line-height:1.5"><div style="max-width:560px;margin:0 auto;padding:28px"><h1 style="font-size:22px;font-weight:600;margin:0 0 18px">${esc(title)}</h1>${body}${button}<p style="color:#6B6F7A;font-size:13px;margin-top:28px">Atelier Ondine · made to your measurements</p></div></body></html>`;
}

export function signInLinkMail(url: string) {
	const intro = 'Here is your sign-in link for Atelier Ondine. It works once and for one hour.';
	const safety = 'If you did not ask for it, you can ignore this e-mail: nobody can sign in without the link.';
	return {
		subject: 'Your sign-in link',
		text: `${intro}\n\n${url}\n\n${safety}\n`,
		html: layout('Your sign-in link', [intro, safety], { href: url, label: 'Sign in' })
	};
}

export function registerAttemptMail(signInUrl: string) {
	const intro = 'Someone, perhaps you, tried to make a new account at Atelier Ondine with this e-mail address. You have an account with us already, so nothing has changed.';
	const next = 'To get in, sign in with your password, or ask for a sign-in link on the same page: it works without a password.';
	const safety = 'If it was not you, you can ignore this e-mail: your account and its password stay as they were.';
	const subject = 'Someone tried to make an account with your address';
	return {
		subject,
		text: `${intro}\n\n${next}\n\n${signInUrl}\n\n${safety}\n`,
		html: layout(subject, [intro, next, safety], { href: signInUrl, label: 'Sign in' })
	};
}

type OrderSummary = {
	number: string;
	shopperName: string;
	total: string;
	promisedDate: string;
	lines: string[];
	link: string;
	images?: MailImage[];
};


function orderMail(subject: string, o: OrderSummary, lead: string, extra: string[] = []) {
	const paragraphs = [`Dear ${firstName(o.shopperName)},`, lead, ...o.lines.map((l) => `• ${l}`), `Total ${o.total}. We plan to ship by ${o.promisedDate}.`, ...extra];
	return {
		subject,
		text: `${paragraphs.join('\n\n')}\n\nYour order: ${o.link}\n`,
		html: layout(subject, paragraphs, { href: o.link, label: `See order ${o.number}` }, o.images)
	};
}

export function orderReceivedMail(o: OrderSummary) {
	return orderMail(`Order ${o.number} received: awaiting payment`, o, `We have your order ${o.number}. It is awaiting payment: once the payment goes through we start drafting your pattern.`);
}

/** `promise`: the remake promise in the checkout's words (fit/promise.ts, from the shop's settings). */
export function paymentConfirmedMail(o: OrderSummary & { promise: string }) {
	return orderMail(`Order ${o.number} is paid`, o, `Thank you: your payment for order ${o.number} went through. Your skirt joins the cutting queue now.`, [
		`Your skirt is made to your measurements, so the usual right to return it does not apply in many places. Our remake promise still does. ${o.promise}`
	]);
}

export function shippedMail(o: OrderSummary & { carrier: string; tracking: string }) {
	return orderMail(`Order ${o.number} has shipped`, o, `Your skirt is on its way with ${o.carrier}. Tracking number: ${o.tracking}.`);
}

export function refundMail(o: OrderSummary & { refunded: string }) {
	return orderMail(`Refund for order ${o.number}`, o, `We have refunded ${o.refunded} for order ${o.number}. Your bank may take a few days to show it.`);
}
