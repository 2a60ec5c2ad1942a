import { domainToASCII } from 'node:url';
import { describe, expect, it } from 'vitest';
import { checkEmail, EMAIL_MESSAGES, normaliseEmail } from './email';

describe('one rule for e-mail addresses', () => {
	it('trims, lower-cases, and gives the same string for the same address however it is typed', () => {
		expect(normaliseEmail('  Priya@Example.COM ')).toBe('priya@example.com');
		expect(normaliseEmail('priya.anand+skirts@example.com')).toBe('priya.anand+skirts@example.com');
	});

	it('writes an internationalised domain in its ASCII form, as node:url domainToASCII does (UTS #46)', () => {
		// xn--bcher-kva is the ACE form of "bücher" (RFC 3492's punycode, [from memory]); checked against Node.
		expect(normaliseEmail('anna@Bücher.example')).toBe('anna@xn--bcher-kva.example');
		expect(domainToASCII('Bücher.example')).toBe('xn--bcher-kva.example');
		for (const d of ['Exämple.com', 'ÉCOLE.fr', 'straße.de', 'münchen.de'])
			expect(normaliseEmail(`a@${d}`)).toBe(`a@${domainToASCII(d)}`);
	});

	it('applies Unicode NFC first, so a decomposed domain gives the same ASCII form as a composed one', () => {
		const composed = 'anna@b\u00fccher.example';
		const decomposed = 'anna@bu\u0308cher.example';
		expect(normaliseEmail(decomposed)).toBe(normaliseEmail(composed));
	});

	it('refuses a non-ASCII local part with a message that says so (look-alikes such as priyá@…)', () => {
		for (const a of ['priyá@example.com', 'pri\u0443a@example.com', 'zoë@example.com', 'prıya@example.com']) {
			expect(checkEmail(a)).toEqual({ ok: false, message: EMAIL_MESSAGES.local });
		}
	});

	it('refuses what no mail server would deliver: no domain, one label, bad labels, IP hosts, lists, quotes', () => {
		const bad = [
			'',
			'priya',
			'@example.com',
			'priya@',
			'a@b@example.com',
			'a@localhost',
			'a@-x.com',
			'a@x-.com',
			'a@exa mple.com',
			'a@example.com.',
			'a@1.2.3.4',
			'a@[127.0.0.1]',
			'a@example.com,b@example.com',
			'"a b"@example.com',
			'a..b@example.com',
			'.a@example.com',
			'a@ex_ample.com',
			'a@example.com/x',
			`${'a'.repeat(65)}@example.com`,
			`a@${'b'.repeat(64)}.com`
		];
		for (const a of bad) expect(normaliseEmail(a), a).toBeNull();
	});

	it('is idempotent: a normalised address normalises to itself', () => {
		for (const a of ['Priya@Example.com', 'anna@Bücher.example', 'x_y-z+1@sub.Domain.CO.uk']) {
			const once = normaliseEmail(a)!;
			expect(normaliseEmail(once)).toBe(once);
		}
	});
});
