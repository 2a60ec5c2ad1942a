// The paper a person last chose for a full-size pattern, remembered so the order page offers it first.
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { outputPreferences } from '../db/schema';
import type { PatternOptions, PatternPaper } from './index';

export interface PaperChoice {
	paper: PatternPaper;
	rollWidthCm: number | null;
}

export async function paperChoiceOf(db: Db, userId: string): Promise<PaperChoice | null> {
	const [row] = await db.select({ paper: outputPreferences.paper, rollWidthCm: outputPreferences.rollWidthCm }).from(outputPreferences).where(eq(outputPreferences.userId, userId));
	return row ?? null;
}

/** Keeps the choice of a file that was made (a refused choice is not remembered). A roll keeps its width;
 * another paper leaves the last roll width as it was. */
export async function rememberPaper(db: Db, userId: string, o: PatternOptions) {
	const width = o.paper === 'roll' && o.widthCm !== undefined ? Math.round(o.widthCm * 10) / 10 : undefined;
	await db
		.insert(outputPreferences)
		.values({ userId, paper: o.paper, rollWidthCm: width ?? null })
		.onDuplicateKeyUpdate({ set: { paper: o.paper, ...(width !== undefined ? { rollWidthCm: width } : {}) } });
}
