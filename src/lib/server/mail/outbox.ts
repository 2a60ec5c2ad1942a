import nodemailer from 'nodemailer';
import { and, asc, eq, isNull, lte, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { outbox } from '../db/schema';
import { mailImages } from '../outputs/garment';

export type MailMessage = { to: string; subject: string; text: string; html: string; orderId?: number | null };

export type MailSettings = { host: string; port: number; from: string; /** shortens the retry waits (tests) */ retryScale?: number };

// Retries back off from half a minute to an hour; a message is never dropped.
const RETRY_SECONDS = [30, 60, 300, 900, 3600];

export function createTransport(settings: MailSettings) {
	return nodemailer.createTransport({
		host: settings.host,
		port: settings.port,
		secure: false,
		// The local mail fake speaks plain SMTP on loopback; a real relay would set TLS here.
		ignoreTLS: settings.host === '127.0.0.1' || settings.host === 'localhost',
		connectionTimeout: 5_000,
		greetingTimeout: 5_000
	});
}

type Inserter = Pick<Db, 'insert'>;

/** Puts a message in the outbox, inside the caller's transaction when there is one. */
export async function enqueueMail(db: Inserter, message: MailMessage) {
	const [row] = await db
		.insert(outbox)
		.values({
			orderId: message.orderId ?? null,
			toAddress: message.to,
			subject: message.subject,
			text: message.text,
			html: message.html
		})
		.$returningId();
	return row.id;
}

/**
 * Queues a message and tries to send it at once. Whatever the mail server does, the message is in
 * the outbox first, so an outage delays it and never loses it.
 */
export async function queueMail(db: Db, settings: MailSettings, message: MailMessage) {
	const id = await enqueueMail(db, message);
	await deliverOne(db, settings, id);
	return id;
}

export async function deliverOne(db: Db, settings: MailSettings, id: number) {
	return db.transaction(async (tx) => {
		// SKIP LOCKED: two app servers draining the outbox never send the same message twice.
		const [msg] = await tx
			.select()
			.from(outbox)
			.where(and(eq(outbox.id, id), isNull(outbox.sentAt)))
			.for('update', { skipLocked: true });
		if (!msg) return false;
		try {
			// The skirt drawings the HTML names go with it as inline images (outputs/garment.ts says why),
			// read through this transaction's own connection: through the pool, each sending held one
			// connection and asked for another, and as many mails at once as the pool has connections
			// waited for ever.
			const attachments = await mailImages(tx, msg.html).catch(() => []);
			await createTransport(settings).sendMail({
				from: settings.from,
				to: msg.toAddress,
				subject: msg.subject,
				text: msg.text,
				html: msg.html,
				...(attachments.length ? { attachments } : {})
			});
			await tx.update(outbox).set({ sentAt: new Date(), attempts: msg.attempts + 1, lastError: null }).where(eq(outbox.id, id));
			return true;
		} catch (err) {
			const wait = RETRY_SECONDS[Math.min(msg.attempts, RETRY_SECONDS.length - 1)] * (settings.retryScale ?? 1);
			await tx
				.update(outbox)
				.set({
					attempts: msg.attempts + 1,
					lastError: String(err instanceof Error ? err.message : err).slice(0, 500),
					nextAttemptAt: sql`DATE_ADD(CURRENT_TIMESTAMP(3), INTERVAL ${Math.round(wait * 1e6)} MICROSECOND)`
				})
				.where(eq(outbox.id, id));
			return false;
		}
	});
}

/** Sends every message that is due; returns how many went out. */
export async function drainOutbox(db: Db, settings: MailSettings, limit = 20) {
	const due = await db
		.select({ id: outbox.id })
		.from(outbox)
		.where(and(isNull(outbox.sentAt), lte(outbox.nextAttemptAt, sql`CURRENT_TIMESTAMP(3)`)))
		.orderBy(asc(outbox.id))
		.limit(limit);
	let sent = 0;
	for (const { id } of due) if (await deliverOne(db, settings, id)) sent++;
	return sent;
}
