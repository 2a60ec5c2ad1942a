// Her measure cards: read, changed and deleted only as hers (the user id is part of every condition, and
// the count of rows says whether there was such a card). What the atelier's corrections do to a card is
// fit/card.ts.
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { measurementProfiles } from '../db/schema';
import type { FitAdjustments } from '$lib/drafting/fit';

export type CardRow = typeof measurementProfiles.$inferSelect;
/** A card as the configure form saves it (cm), with the time she consented to its keeping. */
export type NewCard = Omit<typeof measurementProfiles.$inferInsert, 'id' | 'userId' | 'createdAt' | 'updatedAt'>;

const hers = (userId: string, id: number) => and(eq(measurementProfiles.id, id), eq(measurementProfiles.userId, userId));

/** Her cards, the one changed last first. */
export const cardsOf = (db: Db, userId: string) => db.select().from(measurementProfiles).where(eq(measurementProfiles.userId, userId)).orderBy(desc(measurementProfiles.updatedAt));

export async function cardOf(db: Db, userId: string, id: number): Promise<CardRow | undefined> {
	const [card] = await db.select().from(measurementProfiles).where(hers(userId, id));
	return card;
}

/** The knee length and the fit adjustments of one of her cards (checked by forms/card.ts first). */
export async function setCardFit(db: Db, userId: string, id: number, fit: { waistToKnee: number | null; adjustments: FitAdjustments | null }) {
	await db.update(measurementProfiles).set(fit).where(hers(userId, id));
}

/** False when she has no card of that number. */
export async function deleteCard(db: Db, userId: string, id: number): Promise<boolean> {
	const [{ affectedRows }] = await db.delete(measurementProfiles).where(hers(userId, id));
	return affectedRows > 0;
}

/** A new card, or over one of hers (`replaceId`); false when she has no card of that number. */
export async function saveCard(db: Db, userId: string, card: NewCard, replaceId = 0): Promise<boolean> {
	if (!replaceId) {
		await db.insert(measurementProfiles).values({ ...card, userId });
		return true;
	}
	const [{ affectedRows }] = await db.update(measurementProfiles).set(card).where(hers(userId, replaceId));
	return affectedRows > 0;
}
