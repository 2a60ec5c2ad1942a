import { desc, eq, inArray, max } from 'drizzle-orm';
import type { Db } from '../db/client';
import { houseRules, shopSettings, users } from '../db/schema';
import { resolveRules, type HouseRules } from '$lib/drafting/rules';
import { DEFAULT_SHIPPING, type ShippingRule } from '$lib/pricing';

// Versions never change once written, so each is parsed and checked once per process; only the
// newest version's id is read on every call, so a saved change counts at once on every app server.
const parsedVersions = new Map<number, HouseRules>();

/** The newest version of the house drafting rules, merged over the engine's defaults. */
export async function currentRules(db: Db): Promise<{ id: number; rules: HouseRules }> {
	const [newest] = await db.select({ id: max(houseRules.id) }).from(houseRules);
	const id = newest?.id;
	if (!id) throw new Error('No house rules: run the seed (npm start does).');
	return { id, rules: await rulesVersion(db, id) };
}

/** A new version of the rules (already checked and resolved); placed orders keep the version they name. */
export async function saveRulesVersion(db: Db, rules: HouseRules, note: string, by: string): Promise<number> {
	const [{ id }] = await db.insert(houseRules).values({ rules, note, createdBy: by }).$returningId();
	return id;
}

/** The newest versions with their notes and who saved them, as the back office lists them. */
export const rulesVersions = (db: Db, limit = 20) =>
	db
		.select({ id: houseRules.id, note: houseRules.note, createdAt: houseRules.createdAt, by: users.name })
		.from(houseRules)
		.leftJoin(users, eq(users.id, houseRules.createdBy))
		.orderBy(desc(houseRules.id))
		.limit(limit);

/** One version of the rules, as an order that was drafted with it needs them. */
export async function rulesVersion(db: Pick<Db, 'select'>, id: number): Promise<HouseRules> {
	let rules = parsedVersions.get(id);
	if (!rules) {
		const [row] = await db.select().from(houseRules).where(eq(houseRules.id, id));
		if (!row) throw new Error(`No house rules version ${id}.`);
		rules = resolveRules(row.rules);
		parsedVersions.set(id, rules);
	}
	return rules;
}

export type ShopSettings = {
	currency: string;
	paperSize: 'A4' | 'Letter';
	units: 'cm' | 'in';
	shipping: ShippingRule;
	ordersPerDay: number;
	/** The workroom plotter's roll width (cm), the default width of a full-size pattern on a roll. */
	plotterWidthCm: number;
	/** Days after delivery within which she may report how it fits. The remake promise's words are built
	 * from this and freeRemakesPerOrder (fit/promise.ts), so the words and the rule cannot disagree. */
	remakeWindowDays: number;
	/** Days her fit photos are kept before they are deleted on their own. */
	photoRetentionDays: number;
	/** Remakes at no charge for one order. */
	freeRemakesPerOrder: number;
};

const DEFAULTS: ShopSettings = {
	currency: 'EUR',
	paperSize: 'A4',
	units: 'cm',
	shipping: DEFAULT_SHIPPING,
	ordersPerDay: 4,
	// A 36 in roll, the common plotter width (91.4 cm).
	plotterWidthCm: 91.4,
	remakeWindowDays: 30,
	photoRetentionDays: 90,
	freeRemakesPerOrder: 1
};

// Settings change rarely and nothing depends on seeing a change within seconds: each app server
// keeps them for a few seconds rather than asking on every quote.
const SETTINGS_TTL_MS = 5_000;
let cachedSettings: { at: number; value: ShopSettings } | null = null;

export async function shopSettingsOf(db: Pick<Db, 'select'>, fresh = false): Promise<ShopSettings> {
	if (!fresh && cachedSettings && Date.now() - cachedSettings.at < SETTINGS_TTL_MS) return cachedSettings.value;
	const rows = await db.select().from(shopSettings).where(inArray(shopSettings.key, Object.keys(DEFAULTS)));
	const value = { ...DEFAULTS, ...Object.fromEntries(rows.map((r) => [r.key, r.value])) } as ShopSettings;
	cachedSettings = { at: Date.now(), value };
	return value;
}

/** Writes settings (one row each, in one transaction) and drops this server's cached copy, so the next
 * page it serves reads them; other app servers see them within SETTINGS_TTL_MS. */
export async function saveShopSettings(db: Db, values: Partial<ShopSettings>) {
	await db.transaction(async (tx) => {
		for (const [key, value] of Object.entries(values)) {
			if (value === undefined) continue;
			await tx.insert(shopSettings).values({ key, value }).onDuplicateKeyUpdate({ set: { value } });
		}
	});
	cachedSettings = null;
}
