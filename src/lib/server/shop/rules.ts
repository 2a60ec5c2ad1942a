import { desc, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { houseRules, shopSettings } from '../db/schema';
import { resolveRules, type HouseRules } from '../../drafting/rules';
import { DEFAULT_SHIPPING, type ShippingRule } from '../../pricing';

/** The newest version of the house drafting rules, merged over the engine's defaults. */
export async function currentRules(db: Db): Promise<{ id: number; rules: HouseRules }> {
	const [row] = await db.select().from(houseRules).orderBy(desc(houseRules.id)).limit(1);
	if (!row) throw new Error('No house rules: run the seed (npm start does).');
	return { id: row.id, rules: resolveRules(row.rules as Partial<HouseRules>) };
}

export type ShopSettings = { currency: string; paperSize: 'A4' | 'Letter'; units: 'cm' | 'in'; shipping: ShippingRule; ordersPerDay: number; remakePolicy: string };

const DEFAULTS: ShopSettings = {
	currency: 'EUR',
	paperSize: 'A4',
	units: 'cm',
	shipping: DEFAULT_SHIPPING,
	ordersPerDay: 4,
	remakePolicy: 'If your skirt does not fit as drafted, tell us within 30 days of delivery and we alter it or cut it again.'
};

export async function shopSettingsOf(db: Db): Promise<ShopSettings> {
	const rows = await db.select().from(shopSettings).where(inArray(shopSettings.key, Object.keys(DEFAULTS)));
	return { ...DEFAULTS, ...Object.fromEntries(rows.map((r) => [r.key, r.value])) } as ShopSettings;
}
