// The cutter's lay of each paid order line, searched in the background (a few seconds each, in slices that
// wait while requests are answered) and stored with the line, so the ticket draws it without searching. A line is
// laid again when its cloth's width, nap or shrinkage has changed since.
import { asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { db } from '../db';
import { fabrics, houseRules, orderLines, orders, type StoredCutterLay } from '../db/schema';
import { redraftLine } from '../outputs/ticket';
import { cutterLayInSlices, DraftInputError } from '$lib/drafting';
import { clothOf, cutterLayFits } from './cloth';
import { yieldToRequests } from '../hooks/busy';

/** Lines that would not draft or lay: not tried again until the server restarts. */
const refused = new Set<number>();

/** Lays the next paid or cutting line whose cutter's lay is missing or stale; false when none is left. */
export async function layNextLine(conn: Db, seconds = 3): Promise<boolean> {
	const rows = await conn
		.select({
			id: orderLines.id,
			measurements: orderLines.measurements,
			options: orderLines.options,
			cutterLay: orderLines.cutterLay,
			rules: houseRules.rules,
			fabric: { widthCm: fabrics.widthCm, nap: fabrics.nap, stretch: fabrics.stretch, shrinkagePct: fabrics.shrinkagePct, shrinkageAcrossPct: fabrics.shrinkageAcrossPct }
		})
		.from(orderLines)
		.innerJoin(orders, eq(orders.id, orderLines.orderId))
		.innerJoin(houseRules, eq(houseRules.id, orders.houseRulesId))
		.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
		.where(inArray(orders.status, ['paid', 'cutting']))
		.orderBy(asc(orders.promisedDate), asc(orderLines.id))
		.limit(200);
	const line = rows.find((r) => !refused.has(r.id) && !cutterLayFits(r.cutterLay, r.fabric));
	if (!line) return false;
	const cloth = clothOf(line.fabric);
	try {
		const started = performance.now();
		const draft = redraftLine({ rules: line.rules, line, fabric: line.fabric });
		// Between slices the search lets requests go first (hooks/busy.ts).
		const lay = await cutterLayInSlices(draft, cloth, { seconds, slice: 0.1 }, () => yieldToRequests());
		const stored: StoredCutterLay = {
			length: lay.length,
			need: lay.need,
			utilisation: Math.round(lay.utilisation * 1e4) / 1e4,
			evaluations: lay.evaluations,
			seconds: Math.round((performance.now() - started) / 100) / 10,
			layout: lay.layout,
			cloth: { width: line.fabric.widthCm, nap: line.fabric.nap, shrinkage: line.fabric.shrinkagePct, shrinkageAcross: line.fabric.shrinkageAcrossPct ?? line.fabric.shrinkagePct }
		};
		await conn.update(orderLines).set({ cutterLay: stored }).where(eq(orderLines.id, line.id));
	} catch (e) {
		if (!(e instanceof DraftInputError)) throw e;
		refused.add(line.id);
	}
	return true;
}

let timer: ReturnType<typeof setTimeout> | null = null;
let stopped = true;

/** Looks for lines to lay every `everyMs`; lays them one after another while there are any. */
export function startCutterLayWorker(everyMs: number, seconds: number) {
	if (!stopped) return;
	stopped = false;
	const tick = async () => {
		try {
			while (!stopped && (await layNextLine(db, seconds)));
		} catch {
			/* the database may be away for a moment; the next tick tries again */
		}
		if (!stopped) (timer = setTimeout(tick, everyMs)).unref();
	};
	(timer = setTimeout(tick, everyMs)).unref();
}

export function stopCutterLayWorker() {
	stopped = true;
	if (timer) clearTimeout(timer);
	timer = null;
}

