// What the owner learns from the fit reports: remake and alteration rates by style, fabric, cutter and
// whether the waist-to-hip depth was measured, the corrections each style needs most, and a house-rule
// change where one correction keeps coming back.
import { sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { suggestRules, type FitAnswers, FIELD_LABEL } from '$lib/fit/report';
import type { FitCorrection } from '../db/schema';

type Rows<T> = [T[], unknown];
type LineRow = { lineId: number; style: string; fabric: string; depth: number | null; cutter: string | null; decision: string | null; answers: string | FitAnswers | null; corrections: string | FitCorrection[] | null };

export type Rate = { key: string; skirts: number; remakes: number; alterations: number; rate: number };

const parse = <T>(v: string | T | null): T | null => (typeof v === 'string' ? (JSON.parse(v) as T) : v);

function rates(rows: LineRow[], keyOf: (r: LineRow) => string): Rate[] {
	const by = new Map<string, Rate>();
	for (const r of rows) {
		const key = keyOf(r);
		const x = by.get(key) ?? { key, skirts: 0, remakes: 0, alterations: 0, rate: 0 };
		x.skirts++;
		if (r.decision === 'remake') x.remakes++;
		if (r.decision === 'alteration') x.alterations++;
		by.set(key, x);
	}
	return [...by.values()].map((x) => ({ ...x, rate: x.skirts ? Math.round(((x.remakes + x.alterations) / x.skirts) * 1000) / 10 : 0 })).sort((a, b) => b.rate - a.rate || a.key.localeCompare(b.key));
}

export async function fitInsights(db: Db) {
	// Every skirt delivered on a first order (remakes are the outcome, not the sample), with its report.
	const [rows] = (await db.execute(sql`
		SELECT l.id AS lineId, s.name AS style, f.name AS fabric,
		       JSON_VALUE(l.measurements, '$.waistToHip') AS depth,
		       (SELECT e.actor_label FROM order_event e WHERE e.order_id = o.id AND e.to_status = 'cutting' ORDER BY e.created_at LIMIT 1) AS cutter,
		       r.decision, r.answers, r.corrections
		FROM order_line l
		JOIN \`order\` o ON o.id = l.order_id
		JOIN style s ON s.id = l.style_id
		JOIN fabric f ON f.id = l.fabric_id
		LEFT JOIN fit_report r ON r.order_line_id = l.id
		WHERE o.kind = 'order' AND EXISTS (SELECT 1 FROM order_event d WHERE d.order_id = o.id AND d.to_status = 'delivered')`)) as unknown as Rows<LineRow>;

	const answersByStyle = new Map<string, FitAnswers[]>();
	const corrections = new Map<string, Map<string, number>>();
	for (const r of rows) {
		const a = parse<FitAnswers>(r.answers);
		if (a) answersByStyle.set(r.style, [...(answersByStyle.get(r.style) ?? []), a]);
		for (const c of parse<FitCorrection[]>(r.corrections) ?? []) {
			if (c.to === null) continue;
			const dir = (c.to ?? 0) - (c.from ?? 0);
			const label = `${FIELD_LABEL[c.field] ?? c.field} ${dir > 0 ? 'more' : 'less'}`;
			const m = corrections.get(r.style) ?? new Map<string, number>();
			m.set(label, (m.get(label) ?? 0) + 1);
			corrections.set(r.style, m);
		}
	}
	return {
		skirts: rows.length,
		reports: rows.filter((r) => r.answers !== null).length,
		byStyle: rates(rows, (r) => r.style),
		byFabric: rates(rows, (r) => r.fabric),
		byCutter: rates(rows, (r) => r.cutter ?? 'not recorded'),
		byDepth: rates(rows, (r) => (r.depth === null || r.depth === undefined || String(r.depth) === 'null' ? 'Waist-to-hip assumed' : 'Waist-to-hip measured')),
		commonCorrections: [...corrections].map(([style, m]) => ({ style, items: [...m].sort((a, b) => b[1] - a[1]).slice(0, 5).map(([label, n]) => ({ label, n })) })),
		suggestions: suggestRules(answersByStyle)
	};
}

