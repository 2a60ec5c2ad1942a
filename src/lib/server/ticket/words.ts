// The ticket's words for the engine's values: options, edges, stages. Trade terms as the trade has them.
import type { Edge, Piece, ResolvedChoice } from '../../drafting';
import { STYLES, formatCm } from '../../drafting';

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
	rows.push(['Pockets', c.pockets ? 'In-seam, both sides' : 'No']);
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
