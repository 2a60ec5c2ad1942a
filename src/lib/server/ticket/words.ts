// The ticket's words for the engine's values: options, edges, stages. Trade terms as the trade has them.
import type { Draft, Edge, Piece, ResolvedChoice } from '$lib/drafting';
import { STYLES, fitWords, formatCm } from '$lib/drafting';

export const styleKindName = (id: string) => STYLES.find((s) => s.id === id)?.name ?? id;

const EDGE_WORDS: Partial<Record<Edge, string>> = {
	waist: 'waist',
	side: 'side',
	centre: 'centre seam',
	hem: 'hem',
	vent: 'vent',
	'vent-hem': 'vent hem',
	gore: 'panel seams',
	'band-edge': 'long edges',
	'band-end': 'ends',
	'facing-edge': 'lower edge',
	bag: 'bag edge',
	'bag-seam': 'seam edge'
};

/** "waist, side 1.5 · centre seam 2 · hem 4": each allowance with the edges that have it (a fold has none,
 * and a dart cap takes the waist's). */
export function allowanceWords(p: Piece): string {
	const byValue = new Map<number, string[]>();
	for (const [edge, v] of Object.entries(p.allowances) as [Edge, number][]) {
		const words = EDGE_WORDS[edge];
		if (!words || v === undefined) continue;
		const key = Math.round(v * 10) / 10;
		byValue.set(key, [...(byValue.get(key) ?? []), words]);
	}
	return [...byValue.entries()]
		.sort((a, b) => a[0] - b[0])
		.map(([v, edges]) => `${edges.join(', ')} ${formatCm(v).replace(' cm', '')}`)
		.join(' · ');
}

/** The options as the workroom reads them, label and value. */
export function optionRows(c: ResolvedChoice, waistbandWidth: number, facingDepth: number): [string, string][] {
	const rows: [string, string][] = [];
	rows.push([
		'Waist',
		c.waistband === 'band' ? `Waistband, ${formatCm(waistbandWidth)} finished` : `Facing, ${formatCm(facingDepth)} deep`
	]);
	rows.push([
		'Zip',
		`${c.closure.kind === 'invisible-zip' ? 'Invisible zip' : 'Zip'}, ${c.closure.position === 'side' ? 'left side seam' : 'centre back'}, ${formatCm(c.closure.length)}`
	]);
	const vent =
		c.vent === 'none' ? 'None' : `${c.vent === 'vent' ? 'Back vent' : 'Kick pleat'}, ${formatCm(c.ventLength)}`;
	rows.push(['Vent', vent]);
	rows.push(['Lining', c.lining ? 'Yes' : 'No']);
	// With the zip in the left side seam the pocket moves to the right one (the engine drafts one bag pair).
	rows.push(['Pockets', !c.pockets ? 'No' : c.closure.position === 'side' ? 'In-seam, right side only (zip in the left)' : 'In-seam, both sides']);
	rows.push(['Hem', `${formatCm(c.hemDepth)} turned up`]);
	rows.push(['Stretch fabric', c.stretch ? 'Yes' : 'No']);
	return rows;
}

/** The size of a piece as cut (its cutting line's extent), "28 × 66.8". */
export function cutSize(p: Piece): string {
	const w = formatCm(p.bounds.maxX - p.bounds.minX).replace(' cm', '');
	const h = formatCm(p.bounds.maxY - p.bounds.minY).replace(' cm', '');
	return `${w} × ${h}`;
}

/** The knee as drafted: her own, or the house default said so ("house default 58.5 cm"). */
export function kneeWords(d: Draft): string {
	return d.measurements.kneeAssumed ? `house default ${formatCm(d.measurements.kneeDepth)}` : formatCm(d.measurements.kneeDepth);
}

/** The fit adjustments drafted into the line, one sentence each (none: an empty list). */
export const adjustmentWords = (d: Draft): string[] => fitWords(d.measurements.fit, formatCm);

/** For a figure drafted in two halves: each half's block figures, back / front, in one line each. */
export function halvesWords(d: Draft): string[] {
	if (!d.left || !d.measurements.fit.oneHip) return [];
	const n = (v: number) => formatCm(v).replace(' cm', '');
	const half = (name: string, f: Draft['figures']) => {
		const darts = (p: { darts: { intake: number }[] }) => (p.darts.length ? p.darts.map((x) => n(x.intake)).join(' + ') : 'none');
		return `${name}: hip width ${n(f.back.hipWidth)} / ${n(f.front.hipWidth)} · waist seam ${n(f.check.waistSeam.back)} / ${n(f.check.waistSeam.front)} · side raise ${n(f.back.sideRaise)} / ${n(f.front.sideRaise)} · darts ${darts(f.back)} / ${darts(f.front)} cm`;
	};
	return ['Two halves drafted apart (back / front, cm):', half('Her right half', d.figures), half('Her left half', d.left.figures)];
}
