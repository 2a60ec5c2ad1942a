import { env } from '$env/dynamic/private';
import { db } from '../db';
import { deliverOne, drainOutbox, queueMail, type MailMessage, type MailSettings } from './outbox';

export function mailSettings(): MailSettings {
	return {
		host: env.SMTP_HOST ?? '127.0.0.1',
		port: Number(env.SMTP_PORT ?? 2525),
		from: env.MAIL_FROM ?? 'Atelier Ondine <atelier@ondine.example>',
		retryScale: Number(env.OUTBOX_RETRY_SCALE ?? 1)
	};
}

export function sendMail(message: MailMessage) {
	return queueMail(db, mailSettings(), message);
}

/**
 * Sends messages queued inside a transaction, once it has committed. Callers do not wait for it:
 * the message is safe in the outbox, and an SMTP round trip should not hold up the answer. It never
 * throws; a failed send waits for the outbox worker.
 */
export async function deliverQueued(ids: number[]) {
	for (const id of ids) await deliverOne(db, mailSettings(), id).catch(() => false);
}

let timer: ReturnType<typeof setInterval> | null = null;

export function stopOutboxWorker() {
	if (timer) clearInterval(timer);
	timer = null;
}
/** Retries unsent mail in the background of each app server. */
export function startOutboxWorker(everyMs = Number(env.OUTBOX_INTERVAL_MS ?? 10_000)) {
	if (timer) return;
	timer = setInterval(() => {
		drainOutbox(db, mailSettings()).catch(() => {
			/* the database may be away for a moment; the next tick tries again */
		});
	}, everyMs);
	timer.unref();
}
