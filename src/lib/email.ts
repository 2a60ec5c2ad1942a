// One rule for e-mail addresses everywhere (sign-in, links, register, checkout, orders, staff invites),
// so the same person always gets the same string and the database compares it byte for byte.
// Home-made because no package applies exactly this rule; it runs in the browser (form checks) and on
// the server alike, so it uses the WHATWG URL parser for the domain: its host parsing is the same
// UTS #46 "domain to ASCII" that node:url's domainToASCII performs.

export type EmailCheck = { ok: true; email: string } | { ok: false; message: string };

export const EMAIL_MESSAGES = {
	shape: 'Enter an e-mail address such as name@example.com.',
	local:
		'Use an address with plain letters (a–z), digits and . _ - + before the @: our mail server cannot deliver to other characters there.',
	domain: 'The part after the @ is not a domain mail can be delivered to. Check it, e.g. name@example.com.'
} as const;

// RFC 5321 dot-atom in ASCII (quoted local parts are refused: mail servers treat them unevenly).
const LOCAL = /^[a-z0-9!#$%&'*+/=?^_`{|}~-]+(\.[a-z0-9!#$%&'*+/=?^_`{|}~-]+)*$/;
const LABEL = /^(?!-)[a-z0-9-]{1,63}(?<!-)$/;
// Characters that would make the URL parser read something other than a host.
const NOT_IN_DOMAIN = /[\s/\\?#@:[\]%,;<>"()]/;

function domainToAscii(domain: string): string | null {
	if (!domain || NOT_IN_DOMAIN.test(domain)) return null;
	try {
		return new URL(`http://${domain}/`).hostname;
	} catch {
		return null;
	}
}

/**
 * Trimmed, Unicode NFC, local part lower-cased (one rule: mail providers treat case alike, and an
 * account must not split on it), domain lower-cased in its ASCII (punycode) form. Addresses our
 * mail server could not deliver to are refused with a message that says why.
 */
export function checkEmail(raw: string): EmailCheck {
	const value = raw.trim().normalize('NFC');
	const at = value.lastIndexOf('@');
	if (at <= 0 || at === value.length - 1 || value.length > 254) return { ok: false, message: EMAIL_MESSAGES.shape };
	const local = value.slice(0, at).toLowerCase();
	const domain = value.slice(at + 1);
	if (local.includes('@')) return { ok: false, message: EMAIL_MESSAGES.shape };
	// eslint-disable-next-line no-control-regex
	if (/[^\x00-\x7f]/.test(local)) return { ok: false, message: EMAIL_MESSAGES.local };
	if (local.length > 64 || !LOCAL.test(local)) return { ok: false, message: EMAIL_MESSAGES.shape };
	const ascii = domainToAscii(domain);
	const labels = ascii?.split('.') ?? [];
	// Two labels at least, each a valid DNS label, and a top-level label that is not a number (the
	// URL parser turns "1.2.3.4" into an IP address: mail to bare addresses is not accepted).
	if (
		!ascii ||
		ascii.length > 253 ||
		labels.length < 2 ||
		!labels.every((l) => LABEL.test(l)) ||
		/^\d+$/.test(labels.at(-1)!)
	) {
		return { ok: false, message: EMAIL_MESSAGES.domain };
	}
	return { ok: true, email: `${local}@${ascii}` };
}

/** The normalised address, or null when it is not one we can deliver to. */
export function normaliseEmail(raw: string): string | null {
	const r = checkEmail(raw);
	return r.ok ? r.email : null;
}
