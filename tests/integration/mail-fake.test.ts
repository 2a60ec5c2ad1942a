// The mail fake, fed by nodemailer as the shop feeds it, read back through its
// JSON API and its inbox pages.
import nodemailer from 'nodemailer';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startMailFake } from '../../fakes/mail/server.js';

let fake: Awaited<ReturnType<typeof startMailFake>>;
let transport: nodemailer.Transporter;

type ApiMessage = {
	id: string;
	subject: string;
	text: string | null;
	html: string | null;
	to: string[];
	from: { address: string; name: string };
};

async function list(query = ''): Promise<ApiMessage[]> {
	const res = await fetch(`${fake.webUrl}/api/messages${query}`);
	expect(res.status).toBe(200);
	return (await res.json()).data;
}

function send(to: string, subject: string, extra: Partial<nodemailer.SendMailOptions> = {}) {
	return transport.sendMail({
		from: 'Atelier Ondine <orders@atelier-ondine.example>',
		to,
		subject,
		...extra
	});
}

beforeAll(async () => {
	fake = await startMailFake({ smtpPort: 0, webPort: 0 });
	transport = nodemailer.createTransport({
		host: '127.0.0.1',
		port: fake.smtpPort,
		secure: false,
		ignoreTLS: true
	});
});

afterAll(async () => {
	transport?.close();
	await fake?.close();
});

beforeEach(async () => {
	await fetch(`${fake.webUrl}/api/messages`, { method: 'DELETE' });
});

describe('mail fake', () => {
	it('stores a text and HTML message sent with nodemailer', async () => {
		const info = await send('ines.marlow@example.test', 'Order Q-1042 received', {
			text: 'Thank you, Ines. Your order Q-1042 is awaiting payment.\nSee it at http://127.0.0.1:3000/orders/Q-1042?t=abc&x=1.',
			html: '<p>Thank you, Ines. Your order <strong>Q-1042</strong> is awaiting payment.</p>'
		});
		expect(info.accepted).toEqual(['ines.marlow@example.test']);

		const [m] = await list();
		expect(m.subject).toBe('Order Q-1042 received');
		expect(m.to).toEqual(['ines.marlow@example.test']);
		expect(m.from).toEqual({ address: 'orders@atelier-ondine.example', name: 'Atelier Ondine' });
		expect(m.text).toContain('Your order Q-1042 is awaiting payment.');
		expect(m.html).toContain('<strong>Q-1042</strong>');

		const one = await (await fetch(`${fake.webUrl}/api/messages/${m.id}`)).json();
		expect(one.subject).toBe('Order Q-1042 received');
		expect((await fetch(`${fake.webUrl}/api/messages/no-such-id`)).status).toBe(404);

		// The message page shows the text with its link made clickable, and the HTML only inside a sandboxed frame.
		const page = await (await fetch(`${fake.webUrl}/messages/${m.id}`)).text();
		expect(page).toContain('<a href="http://127.0.0.1:3000/orders/Q-1042?t=abc&amp;x=1"');
		expect(page).toMatch(/<iframe [^>]*sandbox="[^"]*"[^>]*srcdoc="[^"]*&lt;strong&gt;Q-1042&lt;\/strong&gt;/);
		expect(page).not.toContain('<strong>Q-1042</strong>');
	});

	it('filters by recipient, newest first', async () => {
		await send('ines.marlow@example.test', 'Payment confirmed for Q-1042', { text: 'Paid.' });
		await send('tomas.reyes@example.test', 'Your sign-in link', { text: 'Sign in.' });
		await send('Ines.Marlow@example.test', 'Order Q-1042 shipped', { text: 'Shipped.' });

		expect((await list()).map((m) => m.subject)).toEqual([
			'Order Q-1042 shipped',
			'Your sign-in link',
			'Payment confirmed for Q-1042'
		]);
		const ines = await list('?to=ines.marlow@example.test');
		expect(ines.map((m) => m.subject)).toEqual(['Order Q-1042 shipped', 'Payment confirmed for Q-1042']);
		expect(await list('?to=nobody@example.test')).toEqual([]);
	});

	it('escapes a subject with markup on the inbox page', async () => {
		await send('ines.marlow@example.test', 'Your <b>bold</b> skirt & more', { text: 'Hello.' });
		const res = await fetch(`${fake.webUrl}/`);
		expect(res.headers.get('content-security-policy')).toContain("default-src 'none'");
		const html = await res.text();
		expect(html).toContain('Your &lt;b&gt;bold&lt;/b&gt; skirt &amp; more');
		expect(html).not.toContain('<b>bold</b>');
		expect(html).toContain('ines.marlow@example.test');
	});

	it('empties the inbox on DELETE', async () => {
		await send('ines.marlow@example.test', 'One', { text: '1' });
		await send('ines.marlow@example.test', 'Two', { text: '2' });
		expect(await list()).toHaveLength(2);
		const res = await fetch(`${fake.webUrl}/api/messages`, { method: 'DELETE' });
		expect(await res.json()).toEqual({ deleted: 2 });
		expect(await list()).toEqual([]);
		expect(await (await fetch(`${fake.webUrl}/`)).text()).toContain('No messages yet.');
	});

	it('refuses a message over 10 MB with SMTP 552', async () => {
		const err = await send('ines.marlow@example.test', 'Too big', {
			text: 'x'.repeat(11 * 1024 * 1024)
		}).catch((e) => e);
		expect(err.responseCode).toBe(552);
		expect(await list()).toEqual([]);
		const health = await (await fetch(`${fake.webUrl}/healthz`)).json();
		expect(health).toEqual({ ok: true, messages: 0 });
	});
});
