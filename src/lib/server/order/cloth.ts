// A fabric row as the lay engine sees it, and whether a stored cutter's lay still fits it.
import type { fabrics, StoredCutterLay } from '../db/schema';
import type { FabricOptions } from '$lib/drafting';

type ClothFacts = Pick<typeof fabrics.$inferSelect, 'widthCm' | 'nap' | 'shrinkagePct' | 'shrinkageAcrossPct'>;

/** The cloth facts the engine lays on. */
export function clothOf(f: ClothFacts): FabricOptions {
	return {
		width: f.widthCm,
		nap: f.nap,
		shrinkage: f.shrinkagePct,
		...(f.shrinkageAcrossPct === null ? {} : { shrinkageAcross: f.shrinkageAcrossPct })
	};
}

/** A stored cutter's lay still fits the cloth as it is now (a changed width or shrinkage makes it stale). */
export function cutterLayFits(stored: StoredCutterLay | null | undefined, f: ClothFacts): stored is StoredCutterLay {
	if (!stored) return false;
	const c = stored.cloth;
	return c.width === f.widthCm && c.nap === f.nap && c.shrinkage === f.shrinkagePct && c.shrinkageAcross === (f.shrinkageAcrossPct ?? f.shrinkagePct);
}

