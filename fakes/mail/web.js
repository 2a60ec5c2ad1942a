// @ts-check
// The mail fake's web side: an inbox page, a message page and a JSON API.
// Everything that came from a message is escaped; a message's HTML is shown
// only inside a sandboxed iframe (no scripts, no same-origin access), so
// nothing from a mail runs in the inbox.

/** @typedef {import('./server.js').StoredMessage} StoredMessage */

/** @param {unknown} value */
export function escapeHtml(value) {
	return String(value ?? '')
		.replaceAll('&', '&amp;')
		.replaceAll('<', '&lt;')
		.replaceAll('>', '&gt;')
		.replaceAll('"', '&quot;')
		.replaceAll("'", '&#39;');
}

/**
 * Escape plain text and turn http(s) addresses into links. Escaping comes
 * first, so a link can only ever be an href of escaped characters.
 * @param {string} text
 */
export function linkify(text) {
	return escapeHtml(text).replace(/\bhttps?:\/\/[^\s<>"']+/g, (match) => {
		const trail = /(?:[.,;:!?)\]]|&gt;)+$/.exec(match)?.[0] ?? '';
		const href = match.slice(0, match.length - trail.length);
		return `<a href="${href}" rel="noopener noreferrer" target="_blank">${href}</a>${trail}`;
	});
}

// The mail HTML inherits this policy inside its srcdoc frame: styles and images
// as a mail client shows them, never a script.
const CSP =
	"default-src 'none'; style-src 'unsafe-inline'; img-src data: http: https:; frame-ancestors 'none'; form-action 'self'";

const STYLE = `
* { box-sizing: border-box; }
body { margin: 0; background: #F6F1E7; color: #1E2230; font: 16px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; }
main { max-width: 60rem; margin: 0 auto; padding: 2rem 1.25rem 3rem; }
h1, h2 { font-family: Georgia, "Times New Roman", serif; font-weight: 600; line-height: 1.25; }
h1 { font-size: 1.6rem; margin: .25rem 0 .5rem; overflow-wrap: anywhere; }
h2 { font-size: 1.15rem; margin: 1.75rem 0 .5rem; }
a { color: #35598A; }
a:focus-visible, button:focus-visible { outline: 3px solid #35598A; outline-offset: 2px; }
.badge { display: inline-block; margin: 0; padding: .1rem .55rem; border: 1px solid #35598A; border-radius: 999px; color: #35598A; font-size: .8rem; letter-spacing: .04em; text-transform: uppercase; }
.muted { color: #4F535E; }
.bar { display: flex; gap: 1rem; align-items: center; flex-wrap: wrap; margin: 1rem 0; }
.bar form { margin-left: auto; }
button { font: inherit; font-weight: 600; padding: .45rem .9rem; border: 2px solid #A8323E; border-radius: .375rem; background: #fff; color: #A8323E; cursor: pointer; }
table { width: 100%; border-collapse: collapse; background: #FFFDF8; border: 1px solid #D9D1C1; font-variant-numeric: tabular-nums; }
th, td { text-align: left; padding: .55rem .75rem; border-bottom: 1px solid #D9D1C1; vertical-align: top; }
th { font-size: .85rem; color: #4F535E; font-weight: 600; }
td.time { white-space: nowrap; color: #4F535E; }
td.subject { overflow-wrap: anywhere; }
caption { caption-side: bottom; text-align: left; padding-top: .5rem; }
.empty { background: #FFFDF8; border: 1px dashed #6B6F7A; border-radius: .5rem; padding: 1.5rem; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 0; }
dt { color: #4F535E; font-weight: 600; }
dd { margin: 0; overflow-wrap: anywhere; }
pre { white-space: pre-wrap; overflow-wrap: anywhere; background: #FFFDF8; border: 1px solid #D9D1C1; border-radius: .5rem; padding: 1rem; font: 14px/1.5 ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; }
iframe { width: 100%; height: 32rem; border: 1px solid #D9D1C1; border-radius: .5rem; background: #fff; resize: vertical; }
`;

/**
 * @param {string} title
 * @param {string} body
 */
function layout(title, body) {
	return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<p class="badge">Local test inbox</p>
${body}
</main>
</body>
</html>`;
}

/** @param {string | null} iso */
function when(iso) {
	if (!iso) return '—';
	return `<time datetime="${escapeHtml(iso)}">${escapeHtml(iso.slice(0, 19).replace('T', ' '))} UTC</time>`;
}

/**
 * @param {StoredMessage[]} list newest first
 */
function listPage(list) {
	const rows = list
		.map(
			(m) => `<tr>
<td class="time">${when(m.receivedAt)}</td>
<td>${escapeHtml(m.to.join(', ') || m.envelope.to.join(', '))}</td>
<td class="subject"><a href="/messages/${encodeURIComponent(m.id)}">${escapeHtml(m.subject || '(no subject)')}</a></td>
</tr>`
		)
		.join('\n');
	const body = list.length
		? `<table>
<caption class="muted">${list.length} message${list.length === 1 ? '' : 's'}, newest first.</caption>
<thead><tr><th scope="col">Received</th><th scope="col">To</th><th scope="col">Subject</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>`
		: `<div class="empty"><p><strong>No messages yet.</strong></p><p class="muted">Mail the shop sends (order received, payment confirmed, shipped, sign-in links) appears here.</p></div>`;
	return layout(
		'Quarterline mail — local test inbox',
		`<h1>Quarterline mail</h1>
<p class="muted">Every message the shop sent on this computer. Nothing here left the machine, and it is gone once the mail fake stops.</p>
<div class="bar"><a href="/">Refresh</a>${list.length ? '<form method="post" action="/clear"><button type="submit">Delete all messages</button></form>' : ''}</div>
${body}`
	);
}

/** @param {StoredMessage} m */
function messagePage(m) {
	const from = m.from ? (m.from.name ? `${m.from.name} <${m.from.address}>` : m.from.address) : '—';
	const rows = [
		['From', escapeHtml(from)],
		['To', escapeHtml(m.to.join(', ') || '—')],
		...(m.cc.length ? [['Cc', escapeHtml(m.cc.join(', '))]] : []),
		['Sent', when(m.date)],
		['Received', when(m.receivedAt)],
		...(m.attachments.length
			? [
					[
						'Attachments',
						m.attachments
							.map((a) => escapeHtml(`${a.filename ?? 'unnamed'} (${a.contentType}, ${a.size} bytes)`))
							.join('<br>')
					]
				]
			: [])
	];
	const meta = rows.map(([k, v]) => `<dt>${k}</dt><dd>${v}</dd>`).join('\n');
	// Links in the mail's HTML open in a new tab; the frame itself may not run script or reach this page.
	const srcdoc = `<base target="_blank">${m.html ?? ''}`;
	const html = m.html
		? `<iframe title="HTML version of the message" sandbox="allow-popups allow-popups-to-escape-sandbox" srcdoc="${escapeHtml(srcdoc)}"></iframe>`
		: '<p class="muted">This message has no HTML version.</p>';
	return layout(
		`${m.subject || '(no subject)'} — Quarterline mail`,
		`<p><a href="/">← All messages</a></p>
<h1>${escapeHtml(m.subject || '(no subject)')}</h1>
<dl>
${meta}
</dl>
<h2>HTML</h2>
${html}
<h2>Text</h2>
${m.text ? `<pre>${linkify(m.text)}</pre>` : '<p class="muted">This message has no text version.</p>'}`
	);
}

/**
 * @param {import('node:http').ServerResponse} res
 * @param {number} status
 * @param {unknown} body
 */
function sendJson(res, status, body) {
	const text = JSON.stringify(body, null, 2);
	res.writeHead(status, {
		'content-type': 'application/json; charset=utf-8',
		'cache-control': 'no-store'
	});
	res.end(text);
}

/**
 * @param {import('node:http').ServerResponse} res
 * @param {number} status
 * @param {string} html
 */
function sendHtml(res, status, html) {
	res.writeHead(status, {
		'content-type': 'text/html; charset=utf-8',
		'content-security-policy': CSP,
		'x-content-type-options': 'nosniff',
		'referrer-policy': 'no-referrer',
		'cache-control': 'no-store'
	});
	res.end(html);
}

/**
 * @param {StoredMessage} m
 * @param {string} address lower case
 */
function addressedTo(m, address) {
	return [...m.to, ...m.cc, ...m.envelope.to].some((a) => a.toLowerCase() === address);
}

/**
 * @param {StoredMessage[]} messages the live store, oldest first
 * @returns {import('node:http').RequestListener}
 */
export function createWebHandler(messages) {
	const newestFirst = () => [...messages].reverse();
	/** @param {string} id */
	const find = (id) => messages.find((m) => m.id === id);

	return (req, res) => {
		const url = new URL(req.url ?? '/', 'http://inbox.invalid');
		const seg = url.pathname
			.split('/')
			.filter(Boolean)
			.map((s) => {
				try {
					return decodeURIComponent(s);
				} catch {
					return s;
				}
			});
		const method = req.method ?? 'GET';
		const path = url.pathname;

		if (path === '/healthz' && method === 'GET') return sendJson(res, 200, { ok: true, messages: messages.length });

		if (seg[0] === 'api' && seg[1] === 'messages') {
			if (seg.length === 2 && method === 'GET') {
				const to = url.searchParams.get('to')?.trim().toLowerCase();
				const list = newestFirst().filter((m) => !to || addressedTo(m, to));
				return sendJson(res, 200, { data: list });
			}
			if (seg.length === 2 && method === 'DELETE') {
				const count = messages.length;
				messages.length = 0;
				return sendJson(res, 200, { deleted: count });
			}
			const m = seg.length === 3 ? find(seg[2]) : undefined;
			if (seg.length === 3 && method === 'GET') {
				return m ? sendJson(res, 200, m) : sendJson(res, 404, { error: `No message with id ${seg[2]}` });
			}
			if (seg.length === 3 && method === 'DELETE') {
				if (!m) return sendJson(res, 404, { error: `No message with id ${seg[2]}` });
				messages.splice(messages.indexOf(m), 1);
				return sendJson(res, 200, { deleted: 1 });
			}
			return sendJson(res, 405, { error: `${method} is not allowed on ${path}` });
		}

		if (path === '/' && method === 'GET') return sendHtml(res, 200, listPage(newestFirst()));
		if (path === '/clear' && method === 'POST') {
			// Only this page's own form may empty the inbox (a browser sends Origin on form posts).
			const origin = req.headers.origin;
			if (origin && origin !== `http://${req.headers.host}`)
				return sendJson(res, 403, { error: 'Cross-site request refused' });
			messages.length = 0;
			req.resume();
			res.writeHead(303, { location: '/' });
			return res.end();
		}
		if (seg[0] === 'messages' && seg.length === 2 && method === 'GET') {
			const m = find(seg[1]);
			if (m) return sendHtml(res, 200, messagePage(m));
			return sendHtml(
				res,
				404,
				layout('Not found — Quarterline mail', '<h1>No such message</h1><p><a href="/">All messages</a></p>')
			);
		}
		sendHtml(
			res,
			404,
			layout('Not found — Quarterline mail', '<h1>Nothing here</h1><p><a href="/">All messages</a></p>')
		);
	};
}
