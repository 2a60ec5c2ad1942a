import {
	boolean,
	date,
	datetime,
	decimal,
	index,
	int,
	json,
	mysqlEnum,
	mysqlTable,
	primaryKey,
	text,
	timestamp,
	varchar
} from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';
import { ORDER_STAGES } from '$lib/orders/stages';
import type { FitAdjustments } from '$lib/drafting/fit';
import type { FitAnswers } from '$lib/fit/report';
import type { Figures } from '$lib/drafting/block';
import type { HouseRulesInput } from '$lib/drafting/rules';
import type { StyleId } from '$lib/drafting/options';
import type { Erased, LinePricing, StoredChoice, StoredMeasurements } from '../order/lines';
import type { Layout } from '$lib/drafting/fabric';

/** Where a set of figures came from (issue: a way in without a tape measure). */
export const FIGURE_SOURCES = ['measured', 'size_chart', 'flat_garment'] as const;
export type FigureSource = (typeof FIGURE_SOURCES)[number];

// Money is integer minor units (cents); lengths are decimal centimetres with one fixed decimal
// (a millimetre), never floats: the same figures must come back out that went in.
const cm = (name: string, precision = 6) => decimal(name, { precision, scale: 1, mode: 'number' });
const created = () =>
	timestamp('created_at', { fsp: 3 })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP(3)`);
const updated = () =>
	timestamp('updated_at', { fsp: 3 })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP(3)`)
		.$onUpdate(() => new Date());

export const ROLES = ['shopper', 'cutter', 'owner'] as const;
export type Role = (typeof ROLES)[number];

// Auth.js tables keep the names and columns its Drizzle adapter expects; our own columns ride along.
export const users = mysqlTable('user', {
	id: varchar('id', { length: 255 })
		.primaryKey()
		.$defaultFn(() => crypto.randomUUID()),
	name: varchar('name', { length: 255 }),
	// Compared byte for byte (utf8mb4_bin, set in migration 0001; drizzle-kit does not track collations,
	// so keep it if this column is ever changed): the default collation is accent- and case-insensitive,
	// which would let "priyá@…" find the account of "priya@…". Addresses are normalised before they are
	// stored, so an exact comparison is the right one.
	email: varchar('email', { length: 255 }).unique(),
	emailVerified: timestamp('emailVerified', { mode: 'date', fsp: 3 }),
	image: varchar('image', { length: 255 }),
	role: mysqlEnum('role', ROLES).notNull().default('shopper'),
	passwordHash: varchar('password_hash', { length: 255 }),
	disabledAt: timestamp('disabled_at', { fsp: 3 }),
	// Carried in the session cookie and compared on every request: raising it (sign-out, switching the
	// account off, a new password) ends every session of this person at once, on every app server.
	sessionVersion: int('session_version').notNull().default(0),
	// A cutter the owner allows to decide fit reports (alteration, remake, decline); owners always may.
	fitDecider: boolean('fit_decider').notNull().default(false),
	createdAt: created(),
	updatedAt: updated()
});

export const accounts = mysqlTable(
	'account',
	{
		userId: varchar('userId', { length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		type: varchar('type', { length: 255 }).$type<'email' | 'oauth' | 'oidc' | 'webauthn'>().notNull(),
		provider: varchar('provider', { length: 255 }).notNull(),
		providerAccountId: varchar('providerAccountId', { length: 255 }).notNull(),
		refresh_token: varchar('refresh_token', { length: 255 }),
		access_token: varchar('access_token', { length: 255 }),
		expires_at: int('expires_at'),
		token_type: varchar('token_type', { length: 255 }),
		scope: varchar('scope', { length: 255 }),
		id_token: varchar('id_token', { length: 2048 }),
		session_state: varchar('session_state', { length: 255 })
	},
	(t) => [primaryKey({ columns: [t.provider, t.providerAccountId] }), index('account_user_idx').on(t.userId)]
);

export const sessions = mysqlTable(
	'session',
	{
		sessionToken: varchar('sessionToken', { length: 255 }).primaryKey(),
		userId: varchar('userId', { length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		expires: timestamp('expires', { mode: 'date' }).notNull()
	},
	(t) => [index('session_user_idx').on(t.userId)]
);

export const verificationTokens = mysqlTable(
	'verificationToken',
	{
		// utf8mb4_bin like user.email (migration 0001).
		identifier: varchar('identifier', { length: 255 }).notNull(),
		token: varchar('token', { length: 255 }).notNull(),
		expires: timestamp('expires', { mode: 'date' }).notNull()
	},
	(t) => [primaryKey({ columns: [t.identifier, t.token] })]
);

// Failed password sign-ins, kept in the database so every app server throttles the same e-mail alike.
export const signInAttempts = mysqlTable(
	'sign_in_attempt',
	{
		id: int('id').autoincrement().primaryKey(),
		email: varchar('email', { length: 255 }).notNull(),
		succeeded: boolean('succeeded').notNull(),
		createdAt: created()
	},
	(t) => [index('sign_in_attempt_email_idx').on(t.email, t.createdAt)]
);

// Fixed-window counters for rate limits (sign-in per e-mail and per client, orders per client and per
// e-mail). One row per key, changed by one atomic upsert, so concurrent requests cannot both slip under
// the limit and every app server counts alike.
export const rateCounters = mysqlTable('rate_counter', {
	key: varchar('key', { length: 191 }).primaryKey(),
	hits: int('hits').notNull(),
	windowStart: timestamp('window_start', { fsp: 3 }).notNull()
});

// A shopper's saved set of measurements ("measure card"). Body measurements are personal data:
// the consent time is kept, and the shopper can export or delete them.
export const measurementProfiles = mysqlTable(
	'measurement_profile',
	{
		id: int('id').autoincrement().primaryKey(),
		userId: varchar('user_id', { length: 255 })
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		name: varchar('name', { length: 80 }).notNull(),
		waist: cm('waist_cm', 5).notNull(),
		hip: cm('hip_cm', 5).notNull(),
		length: cm('length_cm', 5).notNull(),
		waistToHip: cm('waist_to_hip_cm', 5),
		// Optional: the vent, the taper and "past the knee" are drafted from it (house default otherwise).
		waistToKnee: cm('waist_to_knee_cm', 5),
		// Fit adjustments beyond the four girths (hollow back, rounded abdomen, ...), each in cm.
		adjustments: json('adjustments').$type<FitAdjustments>(),
		// Where the figures came from: her own tape, a published size chart, or a skirt that fits her laid flat.
		source: mysqlEnum('figures_source', FIGURE_SOURCES).notNull().default('measured'),
		units: mysqlEnum('units', ['cm', 'in']).notNull().default('cm'),
		consentAt: timestamp('consent_at', { fsp: 3 }).notNull(),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [index('measurement_profile_user_idx').on(t.userId)]
);

export const uploads = mysqlTable(
	'upload',
	{
		id: int('id').autoincrement().primaryKey(),
		ownerId: varchar('owner_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		purpose: varchar('purpose', { length: 40 }).notNull(),
		storageKey: varchar('storage_key', { length: 255 }).notNull().unique(),
		mime: varchar('mime', { length: 80 }).notNull(),
		bytes: int('bytes').notNull(),
		width: int('width'),
		height: int('height'),
		createdAt: created()
	},
	(t) => [index('upload_owner_idx').on(t.ownerId)]
);

// Option prices and availability per style, in minor units; the drafting engine decides what each option does.
export type StyleOptionPrices = Record<string, number>;

export const styles = mysqlTable('style', {
	id: int('id').autoincrement().primaryKey(),
	slug: varchar('slug', { length: 80 }).notNull().unique(),
	name: varchar('name', { length: 120 }).notNull(),
	kind: varchar('kind', { length: 40 }).$type<StyleId>().notNull(),
	description: text('description').notNull(),
	makingPrice: int('making_price').notNull(),
	optionPrices: json('option_prices').$type<StyleOptionPrices>().notNull(),
	leadDays: int('lead_days').notNull(),
	sortOrder: int('sort_order').notNull().default(0),
	retiredAt: timestamp('retired_at', { fsp: 3 }),
	createdAt: created(),
	updatedAt: updated()
});

export const fabrics = mysqlTable(
	'fabric',
	{
		id: int('id').autoincrement().primaryKey(),
		slug: varchar('slug', { length: 80 }).notNull().unique(),
		name: varchar('name', { length: 120 }).notNull(),
		colour: varchar('colour', { length: 60 }).notNull(),
		swatchHex: varchar('swatch_hex', { length: 7 }).notNull(),
		// Shown before purchase: EU Regulation 1007/2011 wants the fibre content on the product page.
		fibreContent: varchar('fibre_content', { length: 255 }).notNull(),
		careText: text('care_text').notNull(),
		widthCm: cm('width_cm', 5).notNull(),
		pricePerMetre: int('price_per_metre').notNull(),
		stockCm: cm('stock_cm', 8).notNull(),
		nap: boolean('nap').notNull().default(false),
		stretch: boolean('stretch').notNull().default(false),
		shrinkagePct: decimal('shrinkage_pct', { precision: 4, scale: 1, mode: 'number' }).notNull().default(0),
		// Shrinkage across the width when it differs from along the length; null: the one value applies to both.
		shrinkageAcrossPct: decimal('shrinkage_across_pct', { precision: 4, scale: 1, mode: 'number' }),
		imageUploadId: int('image_upload_id').references(() => uploads.id, { onDelete: 'set null' }),
		retiredAt: timestamp('retired_at', { fsp: 3 }),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [index('fabric_image_idx').on(t.imageUploadId)]
);

// Every change of the drafting defaults is a new version; orders point at the version they were drafted with.
export const houseRules = mysqlTable('house_rules', {
	id: int('id').autoincrement().primaryKey(),
	rules: json('rules').$type<HouseRulesInput>().notNull(),
	note: varchar('note', { length: 255 }).notNull().default(''),
	createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
	createdAt: created()
});

export const shopSettings = mysqlTable('shop_setting', {
	key: varchar('key', { length: 80 }).primaryKey(),
	value: json('value').notNull(),
	updatedAt: updated()
});

export type ShippingAddress = {
	name: string;
	line1: string;
	line2?: string;
	city: string;
	postcode: string;
	country: string;
};

export const ORDER_KINDS = ['order', 'remake'] as const;

export const orders = mysqlTable(
	'order',
	{
		id: int('id').autoincrement().primaryKey(),
		number: varchar('number', { length: 20 }).notNull().unique(),
		userId: varchar('user_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		email: varchar('email', { length: 255 }).notNull(),
		shopperName: varchar('shopper_name', { length: 120 }).notNull(),
		status: mysqlEnum('status', ORDER_STAGES).notNull().default('awaiting_payment'),
		currency: varchar('currency', { length: 3 }).notNull().default('EUR'),
		subtotal: int('subtotal').notNull(),
		shipping: int('shipping').notNull(),
		total: int('total').notNull(),
		refundedTotal: int('refunded_total').notNull().default(0),
		promisedDate: date('promised_date', { mode: 'string' }).notNull(),
		shippingAddress: json('shipping_address').$type<ShippingAddress>().notNull(),
		carrier: varchar('carrier', { length: 60 }),
		trackingNumber: varchar('tracking_number', { length: 80 }),
		// Sent by the checkout form; a second submit of the same form (double click, retry) finds this order
		// instead of placing another.
		checkoutKey: varchar('checkout_key', { length: 64 }).unique(),
		houseRulesId: int('house_rules_id')
			.notNull()
			.references(() => houseRules.id),
		// A remake is a new order for the same skirt, cut again after a fit report: no payment, never takings.
		kind: mysqlEnum('kind', ORDER_KINDS).notNull().default('order'),
		remakeOfId: int('remake_of_id'),
		paidAt: timestamp('paid_at', { fsp: 3 }),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [
		index('order_status_idx').on(t.status, t.promisedDate),
		index('order_remake_of_idx').on(t.remakeOfId),
		index('order_user_idx').on(t.userId),
		index('order_created_idx').on(t.createdAt),
		index('order_rules_idx').on(t.houseRulesId)
	]
);

export const orderLines = mysqlTable(
	'order_line',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		styleId: int('style_id')
			.notNull()
			.references(() => styles.id),
		fabricId: int('fabric_id')
			.notNull()
			.references(() => fabrics.id),
		options: json('options').$type<StoredChoice>().notNull(),
		// What the shopper gave, in cm, exactly as drafted; the figures are the engine's output for them.
		measurements: json('measurements').$type<StoredMeasurements | Erased>().notNull(),
		// The fit adjustments drafted into this line, snapshotted like the measurements.
		adjustments: json('adjustments').$type<FitAdjustments>(),
		figuresSource: mysqlEnum('figures_source', FIGURE_SOURCES).notNull().default('measured'),
		figures: json('figures').$type<Figures | Erased>().notNull(),
		fabricCm: cm('fabric_cm', 6).notNull(),
		pricing: json('pricing').$type<LinePricing>().notNull(),
		// The cutter's lay, searched in the background after payment (a few seconds, not in a request), with
		// the cloth facts it was laid for: a later change of the cloth makes it stale and it is laid again.
		cutterLay: json('cutter_lay').$type<StoredCutterLay>(),
		lineTotal: int('line_total').notNull(),
		createdAt: created()
	},
	(t) => [
		index('order_line_order_idx').on(t.orderId),
		index('order_line_style_idx').on(t.styleId),
		index('order_line_fabric_idx').on(t.fabricId)
	]
);

/** A cutter's lay as stored with its order line (the Layout the ticket draws, cm). */
export type StoredCutterLay = {
	length: number;
	need: number;
	utilisation: number;
	evaluations: number;
	seconds: number;
	layout: Layout;
	cloth: { width: number; nap: boolean; shrinkage: number; shrinkageAcross: number };
};

/** Per order line of a combined lay: its order and what it would take cut on its own (cm). */
export type CombinedLayLine = { lineId: number; orderId: number; number: string; group: number; aloneCm: number };

// A combined lay: several paid orders of one cloth laid together, kept so it can be reopened, drawn at
// full scale, and marked cut once (the stock taken off is `length_cm`, the whole lay's).
export const combinedLays = mysqlTable(
	'combined_lay',
	{
		id: int('id').autoincrement().primaryKey(),
		fabricId: int('fabric_id')
			.notNull()
			.references(() => fabrics.id),
		status: mysqlEnum('status', ['open', 'cut']).notNull().default('open'),
		lengthCm: cm('length_cm', 7).notNull(),
		layCm: cm('lay_cm', 7).notNull(),
		savedCm: cm('saved_cm', 7).notNull(),
		utilisation: decimal('utilisation', { precision: 5, scale: 4, mode: 'number' }).notNull(),
		layout: json('layout').$type<Layout>().notNull(),
		lines: json('lines').$type<CombinedLayLine[]>().notNull(),
		createdBy: varchar('created_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		createdByLabel: varchar('created_by_label', { length: 120 }).notNull(),
		cutBy: varchar('cut_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		cutByLabel: varchar('cut_by_label', { length: 120 }),
		cutAt: timestamp('cut_at', { fsp: 3 }),
		createdAt: created()
	},
	(t) => [index('combined_lay_fabric_idx').on(t.fabricId, t.status)]
);

export const combinedLayOrders = mysqlTable(
	'combined_lay_order',
	{
		layId: int('lay_id')
			.notNull()
			.references(() => combinedLays.id, { onDelete: 'cascade' }),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' })
	},
	(t) => [primaryKey({ columns: [t.layId, t.orderId] }), index('combined_lay_order_order_idx').on(t.orderId)]
);

export const orderEvents = mysqlTable(
	'order_event',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		actorId: varchar('actor_id', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		actorLabel: varchar('actor_label', { length: 120 }).notNull(),
		kind: mysqlEnum('kind', ['stage', 'note', 'refund', 'mail', 'payment']).notNull().default('stage'),
		fromStatus: mysqlEnum('from_status', ORDER_STAGES),
		toStatus: mysqlEnum('to_status', ORDER_STAGES),
		note: text('note'),
		createdAt: created()
	},
	(t) => [index('order_event_order_idx').on(t.orderId, t.createdAt), index('order_event_actor_idx').on(t.actorId)]
);

export const payments = mysqlTable(
	'payment',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		provider: varchar('provider', { length: 20 }).notNull().default('stripe'),
		checkoutSessionId: varchar('checkout_session_id', { length: 255 }).notNull().unique(),
		paymentIntentId: varchar('payment_intent_id', { length: 255 }),
		amount: int('amount').notNull(),
		refundedAmount: int('refunded_amount').notNull().default(0),
		currency: varchar('currency', { length: 3 }).notNull(),
		state: mysqlEnum('state', ['open', 'paid', 'expired', 'failed', 'partially_refunded', 'refunded'])
			.notNull()
			.default('open'),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [index('payment_order_idx').on(t.orderId), index('payment_intent_idx').on(t.paymentIntentId)]
);

// Each provider event id once: a webhook delivered five times changes the order once.
export const webhookEvents = mysqlTable('webhook_event', {
	id: varchar('id', { length: 255 }).primaryKey(),
	type: varchar('type', { length: 80 }).notNull(),
	receivedAt: created()
});

// Mail waits here until the mail server takes it, so a mail outage never loses a message.
export const outbox = mysqlTable(
	'mail_outbox',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id').references(() => orders.id, { onDelete: 'set null' }),
		toAddress: varchar('to_address', { length: 255 }).notNull(),
		subject: varchar('subject', { length: 255 }).notNull(),
		text: text('text').notNull(),
		html: text('html').notNull(),
		attempts: int('attempts').notNull().default(0),
		lastError: varchar('last_error', { length: 500 }),
		nextAttemptAt: datetime('next_attempt_at', { fsp: 3 })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP(3)`),
		sentAt: timestamp('sent_at', { fsp: 3 }),
		createdAt: created()
	},
	(t) => [index('mail_outbox_due_idx').on(t.sentAt, t.nextAttemptAt), index('mail_outbox_order_idx').on(t.orderId)]
);

// The paper each person last printed a full-size pattern on (and her roll width), offered first next
// time: a cutter with a plotter keeps choosing the roll, a home sewer A4 or Letter.
export const outputPreferences = mysqlTable('output_preference', {
	userId: varchar('user_id', { length: 255 })
		.primaryKey()
		.references(() => users.id, { onDelete: 'cascade' }),
	paper: mysqlEnum('paper', ['a4', 'letter', 'a0', 'roll', 'projector']).notNull(),
	rollWidthCm: cm('roll_width_cm', 4),
	updatedAt: updated()
});
// Files produced for many orders at once (a lay, a selection in the queue), made in the background by the
// worker in src/lib/server/outputs/jobs.ts and kept as one zip in the upload store.
export const OUTPUT_JOB_STATES = ['queued', 'running', 'done', 'failed'] as const;
export type OutputJobState = (typeof OUTPUT_JOB_STATES)[number];
/** An order the job could not produce, and why, in words for the cutter. */
export type OutputJobFailure = { orderId: number; number: string | null; kind: string; message: string };

export const outputJobs = mysqlTable(
	'output_job',
	{
		id: int('id').autoincrement().primaryKey(),
		// The outputs to make for each order, by producer kind ('ticket', 'dxf', ...).
		kinds: json('kinds').$type<string[]>().notNull(),
		requestedBy: varchar('requested_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		orderIds: json('order_ids').$type<number[]>().notNull(),
		status: mysqlEnum('status', OUTPUT_JOB_STATES).notNull().default('queued'),
		done: int('done').notNull().default(0),
		total: int('total').notNull(),
		failures: json('failures').$type<OutputJobFailure[]>().notNull(),
		// Why the whole job stopped (storage down...), beside the per-order failures.
		error: varchar('error', { length: 500 }),
		resultKey: varchar('result_key', { length: 64 }),
		resultBytes: int('result_bytes'),
		// Which worker holds it, and when it last said it was alive: a job whose worker died is queued again.
		claimedBy: varchar('claimed_by', { length: 64 }),
		attempts: int('attempts').notNull().default(0),
		heartbeatAt: timestamp('heartbeat_at', { fsp: 3 }),
		startedAt: timestamp('started_at', { fsp: 3 }),
		finishedAt: timestamp('finished_at', { fsp: 3 }),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [index('output_job_status_idx').on(t.status, t.id), index('output_job_requester_idx').on(t.requestedBy)]
);

// ---- The fit loop: her report on a delivered skirt, its photos, and the corrections on her measure card.

/** One correction the workroom decided: a measurement or an adjustment, with its change in cm. */
export type FitCorrection = { field: string; from: number | null; to: number | null };

export const fitReports = mysqlTable(
	'fit_report',
	{
		id: int('id').autoincrement().primaryKey(),
		orderId: int('order_id')
			.notNull()
			.references(() => orders.id, { onDelete: 'cascade' }),
		// One report per skirt: a second word on the same skirt goes to the atelier by mail.
		orderLineId: int('order_line_id')
			.notNull()
			.unique()
			.references(() => orderLines.id, { onDelete: 'cascade' }),
		answers: json('answers').$type<FitAnswers>().notNull(),
		// Where it pulls or gapes: ids of the zones she touched on the drawing of her skirt.
		marks: json('marks').$type<string[]>().notNull(),
		note: text('note'),
		units: mysqlEnum('units', ['cm', 'in']).notNull().default('cm'),
		wish: mysqlEnum('wish', ['alteration', 'remake']).notNull(),
		status: mysqlEnum('status', ['new', 'waiting', 'decided']).notNull().default('new'),
		decision: mysqlEnum('decision', ['alteration', 'remake', 'decline']),
		reason: text('reason'),
		corrections: json('corrections').$type<FitCorrection[]>(),
		decidedBy: varchar('decided_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		decidedAt: timestamp('decided_at', { fsp: 3 }),
		remakeOrderId: int('remake_order_id'),
		createdAt: created(),
		updatedAt: updated()
	},
	(t) => [index('fit_report_status_idx').on(t.status, t.createdAt), index('fit_report_order_idx').on(t.orderId)]
);

// Photos of a body are sensitive: never public. Each is served by its random id to her and the staff only,
// kept for the shop's retention days, and deleted (row and file) when she asks.
export const fitPhotos = mysqlTable(
	'fit_photo',
	{
		id: int('id').autoincrement().primaryKey(),
		publicId: varchar('public_id', { length: 43 }).notNull().unique(),
		reportId: int('report_id')
			.notNull()
			.references(() => fitReports.id, { onDelete: 'cascade' }),
		storageKey: varchar('storage_key', { length: 255 }).notNull().unique(),
		mime: varchar('mime', { length: 80 }).notNull(),
		bytes: int('bytes').notNull(),
		width: int('width').notNull(),
		height: int('height').notNull(),
		consentAt: timestamp('consent_at', { fsp: 3 }).notNull(),
		createdAt: created()
	},
	(t) => [index('fit_photo_report_idx').on(t.reportId), index('fit_photo_created_idx').on(t.createdAt)]
);

// Every correction the atelier makes to a measure card (or, for a guest, to the figures of her order),
// with its reason and the report it came from.
export const measureCardChanges = mysqlTable(
	'measure_card_change',
	{
		id: int('id').autoincrement().primaryKey(),
		profileId: int('profile_id').references(() => measurementProfiles.id, { onDelete: 'cascade' }),
		userId: varchar('user_id', { length: 255 }).references(() => users.id, { onDelete: 'cascade' }),
		field: varchar('field', { length: 40 }).notNull(),
		fromCm: cm('from_cm', 6),
		toCm: cm('to_cm', 6),
		reason: varchar('reason', { length: 500 }).notNull(),
		reportId: int('report_id').references(() => fitReports.id, { onDelete: 'set null' }),
		orderId: int('order_id').references(() => orders.id, { onDelete: 'set null' }),
		changedBy: varchar('changed_by', { length: 255 }).references(() => users.id, { onDelete: 'set null' }),
		createdAt: created()
	},
	(t) => [index('measure_card_change_profile_idx').on(t.profileId, t.createdAt), index('measure_card_change_user_idx').on(t.userId)]
);
