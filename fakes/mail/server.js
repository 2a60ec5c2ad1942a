// @ts-check
// Local stand-in for an outgoing mail service: an SMTP listener that keeps
// every message in memory, and a small web inbox (its own port) so a person
// trying the demo can read what the shop sent, plus a JSON API for tests.
//
// SMTP: loopback, no TLS (STARTTLS is not offered), AUTH optional and any
// credentials accepted, messages up to 10 MB.
// Web:  GET /  (list, newest first) · GET /messages/:id (one message)
//       GET /api/messages[?to=address] · GET /api/messages/:id
//       DELETE /api/messages · DELETE /api/messages/:id · GET /healthz
import { createServer } from 'node:http';
import { pathToFileURL } from 'node:url';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { createWebHandler } from './web.js';

/**
 * @typedef {{ address: string, name: string }} Address
 * @typedef {{
 *   id: string, from: Address | null, to: string[], cc: string[],
 *   envelope: { from: string | null, to: string[] },
 *   subject: string, text: string | null, html: string | null,
 *   date: string | null, receivedAt: string, messageId: string | null,
 *   headers: Record<string, string>,
 *   attachments: { filename: string | null, contentType: string, size: number, cid: string | null }[],
 *   size: number
 * }} StoredMessage
 * @typedef {{ smtpPort: number, webPort: number, webUrl: string, close: () => Promise<void>, messages: StoredMessage[] }} MailFake
 */

export const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;
// Enough for a full benchmark run; the oldest go first beyond it.
const MAX_MESSAGES = 5000;
// Headers a test or a person may want to check; the rest stay out of the JSON.
const KEPT_HEADERS = [
	'message-id',
	'date',
	'from',
	'to',
	'cc',
	'reply-to',
	'subject',
	'list-unsubscribe',
	'auto-submitted',
	'content-type'
];

/**
 * @param {import('mailparser').AddressObject | import('mailparser').AddressObject[] | undefined} field
 * @returns {Address[]}
 */
function addresses(field) {
	const list = field === undefined ? [] : Array.isArray(field) ? field : [field];
	/** @type {Address[]} */
	const out = [];
	/** @param {import('mailparser').EmailAddress[]} items */
	const walk = (items) => {
		for (const a of items) {
			if (a.group) walk(a.group);
			else if (a.address) out.push({ address: a.address, name: a.name ?? '' });
		}
	};
	for (const obj of list) walk(obj.value);
	return out;
}

/**
 * @param {Buffer} raw
 * @param {import('smtp-server').SMTPServerSession} session
 * @param {string} id
 * @returns {Promise<StoredMessage>}
 */
async function toStored(raw, session, id) {
	const mail = await simpleParser(raw, { skipTextToHtml: true, skipImageLinks: true });
	/** @type {Record<string, string>} */
	const headers = {};
	for (const { key, line } of mail.headerLines) {
		if (KEPT_HEADERS.includes(key) || key.startsWith('x-')) {
			const value = line
				.slice(line.indexOf(':') + 1)
				.replace(/\r?\n[ \t]+/g, ' ')
				.trim();
			headers[key] = headers[key] ? `${headers[key]}, ${value}` : value;
		}
	}
	const mailFrom = session.envelope.mailFrom;
	return {
		id,
		from: addresses(mail.from)[0] ?? null,
		to: addresses(mail.to).map((a) => a.address),
		cc: addresses(mail.cc).map((a) => a.address),
		envelope: {
			from: mailFrom ? mailFrom.address : null,
			to: session.envelope.rcptTo.map((r) => r.address)
		},
		subject: mail.subject ?? '',
		text: mail.text ?? null,
		html: typeof mail.html === 'string' ? mail.html : null,
		date: mail.date ? mail.date.toISOString() : null,
		receivedAt: new Date().toISOString(),
		messageId: mail.messageId ?? null,
		headers,
		attachments: mail.attachments.map((a) => ({
			filename: a.filename ?? null,
			contentType: a.contentType,
			size: a.size,
			// The Content-ID an inline image is named by from the HTML (<img src="cid:…">).
			cid: a.cid ?? null
		})),
		size: raw.length
	};
}

/**
 * Start the mail fake.
 * @param {{ smtpPort?: number, webPort?: number, host?: string, log?: (line: string) => void }} [options]
 * @returns {Promise<MailFake>}
 */
export async function startMailFake({ smtpPort = 0, webPort = 0, host = '127.0.0.1', log = () => {} } = {}) {
	/** @type {StoredMessage[]} oldest first; the API and pages show newest first */
	const messages = [];
	let counter = 0;

	const smtp = new SMTPServer({
		banner: 'Quarterline mail fake (local test inbox)',
		authOptional: true,
		// No TLS here: the fake is loopback only, and clients connect with ignoreTLS.
		disabledCommands: ['STARTTLS'],
		hideSTARTTLS: true,
		allowInsecureAuth: true,
		size: MAX_MESSAGE_BYTES,
		logger: false,
		// Loopback only: a reverse DNS lookup per connection would only add delay.
		disableReverseLookup: true,
		closeTimeout: 1000,
		onAuth(auth, _session, callback) {
			// Any user name and password: the app may be configured with credentials for a real service.
			callback(null, { user: auth.username ?? 'local' });
		},
		onData(stream, session, callback) {
			/** @type {Buffer[]} */
			const chunks = [];
			stream.on('data', (/** @type {Buffer} */ c) => chunks.push(c));
			stream.on('error', (err) => callback(err));
			stream.on('end', () => {
				if (stream.sizeExceeded) {
					const err = /** @type {Error & { responseCode?: number }} */ (
						new Error(`Message is larger than the ${MAX_MESSAGE_BYTES / 1024 / 1024} MB this inbox takes`)
					);
					err.responseCode = 552;
					return callback(err);
				}
				counter += 1;
				toStored(Buffer.concat(chunks), session, String(counter))
					.then((msg) => {
						messages.push(msg);
						if (messages.length > MAX_MESSAGES) messages.splice(0, messages.length - MAX_MESSAGES);
						log(`mail ${msg.id} to ${msg.envelope.to.join(', ')}: ${msg.subject}`);
						callback(null, `Message ${msg.id} stored`);
					})
					.catch((err) => {
						const e = /** @type {Error & { responseCode?: number }} */ (
							new Error(`Could not read the message: ${err.message}`)
						);
						e.responseCode = 554;
						callback(e);
					});
			});
		}
	});
	smtp.on('error', (err) => log(`smtp error: ${err.message}`));

	const web = createServer(createWebHandler(messages));

	await Promise.all([
		new Promise((resolve, reject) => {
			smtp.server.once('error', reject);
			smtp.listen(smtpPort, host, () => resolve(undefined));
		}),
		new Promise((resolve, reject) => {
			web.once('error', reject);
			web.listen(webPort, host, () => resolve(undefined));
		})
	]);
	/** @param {import('node:net').AddressInfo | string | null} a */
	const portOf = (a) => (typeof a === 'object' && a ? a.port : 0);
	const actualSmtp = portOf(smtp.server.address());
	const actualWeb = portOf(web.address());
	const webUrl = `http://${host.includes(':') ? `[${host}]` : host}:${actualWeb}`;

	/** @type {Promise<void> | null} */
	let closing = null;
	return {
		smtpPort: actualSmtp,
		webPort: actualWeb,
		webUrl,
		messages,
		close() {
			closing ??= Promise.all([
				new Promise((resolve) => smtp.close(() => resolve(undefined))),
				new Promise((resolve) => {
					web.close(() => resolve(undefined));
					web.closeAllConnections();
				})
			]).then(() => undefined);
			return closing;
		}
	};
}

// Run directly: `node fakes/mail/server.js`.
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
	const env = process.env;
	const fake = await startMailFake({
		smtpPort: Number(env.MAIL_SMTP_PORT || 2525),
		webPort: Number(env.MAIL_WEB_PORT || 8025),
		host: env.MAIL_HOST ?? '127.0.0.1',
		log: (line) => console.error(`[mail] ${line}`)
	});
	console.log(
		`Mail fake: SMTP on ${fake.webUrl.replace(/^http:\/\/(.*):\d+$/, 'smtp://$1')}:${fake.smtpPort}, inbox on ${fake.webUrl}`
	);
	const stop = async () => {
		await fake.close();
		process.exit(0);
	};
	process.once('SIGTERM', stop);
	process.once('SIGINT', stop);
}
