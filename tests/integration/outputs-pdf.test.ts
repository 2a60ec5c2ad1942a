// The full-size pattern files as a cutter downloads them, read back by independent programs (poppler's
// pdftoppm and pdftotext): the test square measured in pixels, one piece put back together from its
// printed pages and measured against the engine's bounds, the words a cutter needs, and the refusals.
import { and, eq, inArray } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { fabrics, houseRules, orderLines, orders, outputPreferences, styles, users } from '../../src/lib/server/db/schema';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { loadTickets } from '../../src/lib/server/outputs/ticket-load';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { largestPieceOnSheet } from '../support/tiles';
import { pageCount, pdfText, px, renderPages, squareIn } from '../support/pixels';
import { signInCookie } from '../support/session';

const db = testDb();
let cutter = '';
let shopper = '';
// Seeded orders (src/lib/server/seed/orders.ts): a straight, a six-gore, a full-circle and a pencil skirt
// (its pieces, with facings, fit one A0 sheet).
const ids: Record<'straight' | 'gored' | 'circle' | 'pencil', number> = { straight: 0, gored: 0, circle: 0, pencil: 0 };
const NUMBERS = { straight: 'QL-1008', gored: 'QL-1005', circle: 'QL-1007', pencil: 'QL-1004' } as const;

beforeAll(async () => {
	const find = (role: string, email?: string) => DEMO_SIGN_INS.accounts.find((a) => a.role === role && (!email || a.email === email))!;
	cutter = await signInCookie(find('cutter', 'ines@ondine.example').email, DEMO_SIGN_INS.password);
	shopper = await signInCookie(find('shopper').email, DEMO_SIGN_INS.password);
	const rows = await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.number, Object.values(NUMBERS)));
	for (const k of Object.keys(NUMBERS) as (keyof typeof NUMBERS)[]) ids[k] = rows.find((r) => r.number === NUMBERS[k])!.id;
});

// Pixel checks take seconds between requests: a kept-alive socket the server has just closed fails
// the next fetch ("other side closed"), so a request is tried once more on a fresh one.
async function get(path: string, cookie = cutter, accept = 'application/pdf'): Promise<Response> {
	const go = () => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: { cookie, accept } });
	try {
		return await go();
	} catch {
		return go();
	}
}

async function pdfOf(path: string): Promise<Uint8Array> {
	const res = await get(path);
	expect(res.status, await res.clone().text().then((t) => t.slice(0, 200))).toBe(200);
	expect(res.headers.get('content-type')).toBe('application/pdf');
	return new Uint8Array(await res.arrayBuffer());
}

const dark = (c: readonly number[]) => Math.max(c[0], c[1], c[2]) < 140;
const light = (c: readonly number[]) => Math.min(c[0], c[1], c[2]) > 200;
/** 10 cm at a resolution, in pixels: 10 / 2.54 inches (ISO 216 sizes are metric; 25.4 mm to the inch). */
const tenCm = (dpi: number) => (10 / 2.54) * dpi;

describe('tiled print', () => {
	it('A4: the test square on page 1 measures 10 cm at 300 dpi (1181 px ± 2), with its words, the map and the page count', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=a4`);
		const [page] = renderPages(pdf, 300, 1);
		// The square sits above the sheet's map: look in the top half of the page only.
		const sq = squareIn(page, dark, 1000, { x0: 0, y0: 0, x1: page.w, y1: Math.round(page.h * 0.5) });
		expect(Math.abs(sq.width - tenCm(300))).toBeLessThanOrEqual(2);
		expect(Math.abs(sq.height - tenCm(300))).toBeLessThanOrEqual(2);
		const first = pdfText(pdf, 1);
		expect(first).toContain('print at 100 %, no scaling; measure this');
		expect(first).toContain('Map of the sheet');
		const pages = pageCount(pdf);
		expect(first).toContain(`${pages} pages`);
		// Every page of the pattern is on the map with its number.
		for (let n = 2; n <= pages; n++) expect(first).toMatch(new RegExp(`\\b${n}\\b`));
	});

	it('Letter: the test square is 4 inches (1200 px at 300 dpi ± 2), with a 2 in bar', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=letter`);
		const [page] = renderPages(pdf, 300, 1);
		const sq = squareIn(page, dark, 1000, { x0: 0, y0: 0, x1: page.w, y1: Math.round(page.h * 0.5) });
		expect(Math.abs(sq.width - 1200)).toBeLessThanOrEqual(2);
		expect(Math.abs(sq.height - 1200)).toBeLessThanOrEqual(2);
		expect(pdfText(pdf, 1)).toContain('2 in');
	});

	it('every page says its row letter and column number, the order and the scale; the pieces carry name, cut and order', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=a4`);
		const [ticket] = (await loadTickets(db, [ids.straight]))[0]!.tickets;
		const pages = pageCount(pdf);
		for (let n = 2; n <= pages; n++) {
			const t = pdfText(pdf, n);
			expect(t).toMatch(new RegExp(`page ${n} of ${pages} · cell [A-Z]+\\d+ · ${NUMBERS.straight}`));
			expect(t).toContain('1:1, cm');
		}
		const all = pdfText(pdf);
		for (const p of ticket.draft.pieces) {
			expect(all).toContain(p.name);
			expect(all).toContain(p.cutText);
		}
		expect(all).toContain('Cut 1 on the fold');
		expect(all).toContain('Cut 2 (a pair)');
		expect(all).toContain(`Order ${NUMBERS.straight}`);
	});

	it('the largest piece put back together from its printed pages, by their trim lines, is the engine’s size within 1 mm', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=a4`);
		const dpi = 150;
		const found = largestPieceOnSheet(pdf, dpi);
		expect(found.pages).toBe(pageCount(pdf) - 1);
		const [ticket] = (await loadTickets(db, [ids.straight]))[0]!.tickets;
		const engine = ticket.draft.pieces
			.map((p) => [p.bounds.maxX - p.bounds.minX, p.bounds.maxY - p.bounds.minY].sort((a, b) => a - b))
			.sort((a, b) => b[0] * b[1] - a[0] * a[1])[0];
		// Within 1 mm: the printed line's own width (0.9 pt, 0.3 mm) is part of what is measured.
		expect(Math.abs(found.cm[0] - engine[0])).toBeLessThanOrEqual(0.1);
		expect(Math.abs(found.cm[1] - engine[1])).toBeLessThanOrEqual(0.1);
		// Rendering and reading some thirty pages of pixels takes a while on a shared machine.
	}, 240_000);
});

describe('roll, A0 and projector', () => {
	it('a roll of the plotter width by default is one page 91.4 cm wide, its square 10 cm at 50 dpi (196.9 px ± 1)', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.circle}/pattern.pdf?paper=roll`);
		expect(pageCount(pdf)).toBe(1);
		const [page] = renderPages(pdf, 50, 1);
		expect(Math.abs(page.w - (91.4 / 2.54) * 50)).toBeLessThanOrEqual(1);
		// The square is in the band across the top (16 cm), where nothing else is as long.
		const sq = squareIn(page, dark, 150, { x0: 0, y0: 0, x1: page.w, y1: Math.round((16 / 2.54) * 50) });
		expect(Math.abs(sq.width - tenCm(50))).toBeLessThanOrEqual(1);
		expect(Math.abs(sq.height - tenCm(50))).toBeLessThanOrEqual(1);
		const text = pdfText(pdf);
		expect(text).toContain(NUMBERS.circle);
		expect(text).toContain('Cut 1 on the fold');
	});

	it('a roll of a chosen width is that wide', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=roll&width=120`);
		const [page] = renderPages(pdf, 20, 1);
		expect(Math.abs(page.w - (120 / 2.54) * 20)).toBeLessThanOrEqual(1);
	});

	it('A0 is one sheet of 841 × 1189 mm (ISO 216), upright or on its side, its title and square once', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.pencil}/pattern.pdf?paper=a0`);
		expect(pageCount(pdf)).toBe(1);
		const [page] = renderPages(pdf, 10, 1);
		const dims = [page.w, page.h].sort((a, b) => a - b);
		expect(Math.abs(dims[0] - (84.1 / 2.54) * 10)).toBeLessThanOrEqual(1);
		expect(Math.abs(dims[1] - (118.9 / 2.54) * 10)).toBeLessThanOrEqual(1);
		const text = pdfText(pdf);
		expect(text.match(/Full-size pattern on A0/g)).toHaveLength(1);
		expect(text.match(/print at 100 %, no scaling; measure this/g)).toHaveLength(1);
	});

	it('pieces that need more than one A0 sheet are refused with the way out, not printed on several sheets', async () => {
		const res = await get(`/workroom/orders/${ids.gored}/pattern.pdf?paper=a0`, cutter, 'application/json');
		expect(res.status).toBe(400);
		expect(((await res.json()) as { message: string }).message).toMatch(/do not all fit on one A0 sheet.*plotter roll.*tiled/);
		// The order page says so before anyone downloads: its A0 choice is there but cannot be chosen.
		const page = await (await get(`/workroom/orders/${ids.gored}`, cutter, 'text/html')).text();
		expect(page).toMatch(/<option value="a0" disabled[^>]*>A0 sheet: these pieces need more than one/);
		const fits = await (await get(`/workroom/orders/${ids.pencil}`, cutter, 'text/html')).text();
		expect(fits).toMatch(/<option value="a0"[^>]*>A0 sheet \(copy shop\)/);
		expect(fits).not.toMatch(/<option value="a0" disabled/);
	});

	it('the projector file is one page on a dark ground; its light square is 10 cm at 40 dpi (157.5 px ± 1)', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.circle}/pattern.pdf?paper=projector`);
		expect(pageCount(pdf)).toBe(1);
		const [page] = renderPages(pdf, 40, 1);
		// A dark ground: the page's corner pixel.
		expect(Math.max(...px(page, 2, Math.round(page.h / 2)))).toBeLessThan(60);
		const sq = squareIn(page, light, 120, { x0: 0, y0: 0, x1: page.w, y1: Math.round((16 / 2.54) * 40) });
		expect(Math.abs(sq.width - tenCm(40))).toBeLessThanOrEqual(1);
		expect(Math.abs(sq.height - tenCm(40))).toBeLessThanOrEqual(1);
		const text = pdfText(pdf);
		expect(text).toContain('Grid lines every 5 cm');
		// Grid lines numbered along the edges: 5, 10, 15 ... cm.
		for (const n of ['5', '10', '15', '50', '100']) expect(text).toMatch(new RegExp(`(^|\\s)${n}(\\s|$)`));
	});
});

describe('lay at full size', () => {
	it('is as wide as the cloth (or the folded cloth), says the lay length and names the edges, with a 10 cm square', async () => {
		const pdf = await pdfOf(`/workroom/orders/${ids.gored}/lay.pdf`);
		const text = pdfText(pdf);
		expect(text).toContain(NUMBERS.gored);
		expect(text).toMatch(/Lay length \d+(\.\d)? cm/);
		expect(text).toMatch(/selvedge/);
		const [page] = renderPages(pdf, 40, 1);
		const sq = squareIn(page, dark, 120, { x0: 0, y0: 0, x1: page.w, y1: Math.round((16 / 2.54) * 40) });
		expect(Math.abs(sq.width - tenCm(40))).toBeLessThanOrEqual(1);
		// The ruler: numbered every 10 cm down the edge.
		for (const n of ['10', '20', '30', '100']) expect(text).toMatch(new RegExp(`(^|\\s)${n}(\\s|$)`));
		const [fabric] = await db
			.select({ width: fabrics.widthCm })
			.from(orderLines)
			.innerJoin(fabrics, eq(fabrics.id, orderLines.fabricId))
			.where(eq(orderLines.orderId, ids.gored));
		// Page width: the cloth (or half of it, folded) plus 10 cm for the ruler and the edge names.
		const wcm = (page.w / 40) * 2.54;
		const folded = /folded lengthwise/.test(text);
		expect(Math.abs(wcm - ((folded ? fabric.width / 2 : fabric.width) + 10))).toBeLessThan(6);
	});
});

describe('bad input', () => {
	const json = async (res: Response) => ({ status: res.status, type: res.headers.get('content-type'), body: (await res.json()) as { message: string } });

	it('unknown paper, a width too narrow, too wide or not a number: 400 with the reason, as JSON', async () => {
		const base = `/workroom/orders/${ids.circle}/pattern.pdf`;
		const cases: [string, RegExp][] = [
			['?paper=a3', /Unknown paper/],
			['?paper=roll&width=30', /needs a roll at least/],
			['?paper=roll&width=301', /at most 300 cm/],
			['?paper=roll&width=abc', /number of centimetres/],
			['?paper=a4&width=90', /only asked for with paper=roll/]
		];
		for (const [q, why] of cases) {
			const r = await json(await get(base + q, cutter, 'application/json'));
			expect(r.status, q).toBe(400);
			expect(r.type).toContain('application/json');
			expect(r.body.message).toMatch(why);
		}
	});

	it('a browser gets a short page with the reason, never an empty file', async () => {
		const res = await get(`/workroom/orders/${ids.circle}/pattern.pdf?paper=roll&width=20`, cutter, 'text/html');
		expect(res.status).toBe(400);
		expect(await res.text()).toMatch(/needs a roll at least/);
	});

	it('an order with no skirt drafted and an order of a retired style: 404 with the reason', async () => {
		const [order] = await db.select().from(orders).where(eq(orders.id, ids.straight));
		const [line] = await db.select().from(orderLines).where(eq(orderLines.orderId, ids.straight));
		const [rules] = await db.select({ id: houseRules.id }).from(houseRules).limit(1);
		const stamp = Date.now().toString(36);
		const make = async (n: string) => {
			const [o] = await db
				.insert(orders)
				.values({ ...order, id: undefined, number: `QL-T${n}${stamp}`.slice(0, 20), checkoutKey: null, houseRulesId: rules.id })
				.$returningId();
			return o.id;
		};
		const empty = await make('E');
		let r = await json(await get(`/workroom/orders/${empty}/pattern.pdf?paper=a4`, cutter, 'application/json'));
		expect(r.status).toBe(404);
		expect(r.body.message).toMatch(/no skirt drafted/);
		const [style] = await db.select().from(styles).where(eq(styles.id, line.styleId));
		const [retired] = await db
			.insert(styles)
			.values({ ...style, id: undefined, slug: `retired-${stamp}`, name: `Retired ${style.name}`, retiredAt: new Date() })
			.$returningId();
		const old = await make('R');
		await db.insert(orderLines).values({ ...line, id: undefined, orderId: old, styleId: retired.id });
		for (const path of [`pattern.pdf?paper=a4`, 'lay.pdf']) {
			r = await json(await get(`/workroom/orders/${old}/${path}`, cutter, 'application/json'));
			expect(r.status, path).toBe(404);
			expect(r.body.message).toMatch(/retired/);
		}
		r = await json(await get(`/workroom/orders/999999/pattern.pdf?paper=a4`, cutter, 'application/json'));
		expect(r.status).toBe(404);
		// Taken away again: other files count the queue's orders and the catalogue's styles.
		await db.delete(orderLines).where(inArray(orderLines.orderId, [empty, old]));
		await db.delete(orders).where(inArray(orders.id, [empty, old]));
		await db.delete(styles).where(eq(styles.id, retired.id));
	});

	it('a shopper cannot download a pattern', async () => {
		const res = await get(`/workroom/orders/${ids.straight}/pattern.pdf?paper=a4`, shopper);
		expect(res.status).not.toBe(200);
		expect(res.headers.get('content-type') ?? '').not.toContain('application/pdf');
	});
});

describe('the paper a person chose', () => {
	it('is remembered for her and offered first on the order page; a refused choice is not', async () => {
		const [me] = await db.select({ id: users.id }).from(users).where(eq(users.email, 'ines@ondine.example'));
		await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=roll&width=120`);
		let [row] = await db.select().from(outputPreferences).where(eq(outputPreferences.userId, me.id));
		expect(row).toMatchObject({ paper: 'roll', rollWidthCm: 120 });
		await pdfOf(`/workroom/orders/${ids.straight}/pattern.pdf?paper=letter`);
		await get(`/workroom/orders/${ids.straight}/pattern.pdf?paper=roll&width=5`);
		[row] = await db.select().from(outputPreferences).where(and(eq(outputPreferences.userId, me.id)));
		expect(row).toMatchObject({ paper: 'letter', rollWidthCm: 120 });
		const page = await (await get(`/workroom/orders/${ids.straight}`, cutter, 'text/html')).text();
		expect(page).toMatch(/<option value="letter"[^>]*selected/);
		expect(page).toContain('Download pattern (PDF)');
		expect(page).toContain(`/workroom/orders/${ids.straight}/lay.pdf`);
	});
});
