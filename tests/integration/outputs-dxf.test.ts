// The open DXF route, its file read by two independent programs from Debian: ezdxf's audit (the
// python3-ezdxf package) and LibreCAD's dxf2pdf (the librecad package, headless under xvfb-run).
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { orders } from '../../src/lib/server/db/schema';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { testDb } from '../support/db';
import { testEnv } from '../support/env';
import { signInCookie } from '../support/session';
import { makeBadOrders } from './outputs.helpers';

const db = testDb();
// Asynchronous, so the event loop stays free while the programs run: a synchronous wait would keep the
// HTTP client from noticing the app closing an idle connection, and the next request would meet it closed.
const run = async (cmd: string, args: string[], options: { cwd?: string; timeout?: number } = {}) => (await promisify(execFile)(cmd, args, { encoding: 'utf8', ...options })).stdout;
const cookies: Record<'cutter' | 'owner' | 'shopper', string> = { cutter: '', owner: '', shopper: '' };
const dir = mkdtempSync(join(tmpdir(), 'ql-dxf-'));
// A straight skirt with pockets, six gores with lining and pockets, a full circle (the demo seed; not the
// delivered orders, whose measurements another test may erase at the shopper's request).
const SAMPLES = ['QL-1006', 'QL-1005', 'QL-1007'];
let ids: Record<string, number> = {};
let bad: Awaited<ReturnType<typeof makeBadOrders>>;

beforeAll(async () => {
	for (const role of ['cutter', 'owner', 'shopper'] as const)
		cookies[role] = await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === role)!.email, DEMO_SIGN_INS.password);
	const rows = await db.select({ id: orders.id, number: orders.number }).from(orders).where(inArray(orders.number, SAMPLES));
	ids = Object.fromEntries(rows.map((r) => [r.number, r.id]));
	bad = await makeBadOrders(db, '71');
});
afterAll(async () => bad?.remove());

const get = (path: string, cookie?: string) => fetch(`${testEnv.appUrl}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });

/** ezdxf (Debian's python3-ezdxf) reads the file, audits it and reports what it found, as JSON. */
async function ezdxfReport(file: string) {
	const script = `
import ezdxf, json, sys
doc = ezdxf.readfile(sys.argv[1])
audit = doc.audit()
msp = doc.modelspace()
inserts = [e.dxf.name for e in msp.query('INSERT')]
layers = {}
for name in inserts:
    for e in doc.blocks.get(name):
        layers.setdefault(e.dxf.layer, set()).add(e.dxftype())
print(json.dumps({
    'errors': [str(e.message) for e in audit.errors], 'insunits': doc.header.get('$INSUNITS'),
    'inserts': inserts, 'layers': {k: sorted(v) for k, v in layers.items()},
    'blocks': [b.name for b in doc.blocks if not b.name.startswith('*')]
}))`;
	// Debian's python3 by its full path: another python3 earlier on PATH would not see Debian's modules.
	return JSON.parse(await run('/usr/bin/python3', ['-c', script, file])) as {
		errors: string[];
		insunits: number;
		inserts: string[];
		layers: Record<string, string[]>;
		blocks: string[];
	};
}

describe('the open DXF of an order', () => {
	for (const number of SAMPLES) {
		it(`${number}: ezdxf audits it clean and LibreCAD turns it into a PDF`, async () => {
			const res = await get(`/workroom/orders/${ids[number]}/pattern.dxf`, cookies.cutter);
			expect(res.status, res.status === 200 ? '' : await res.clone().text()).toBe(200);
			expect(res.headers.get('content-type')).toBe('application/dxf');
			expect(res.headers.get('content-disposition')).toBe(`attachment; filename="${number}-pattern.dxf"`);
			expect(res.headers.get('cache-control')).toContain('no-store');
			const file = join(dir, `${number}.dxf`);
			writeFileSync(file, Buffer.from(await res.arrayBuffer()));

			const report = await ezdxfReport(file);
			expect(report.errors).toEqual([]);
			expect(report.insunits).toBe(4); // millimetres
			// One block per piece, each inserted once.
			expect(report.inserts.length).toBeGreaterThanOrEqual(2);
			expect([...report.inserts].sort()).toEqual([...report.blocks].sort());
			expect(new Set(report.inserts).size).toBe(report.inserts.length);
			// The layers of ASTM D6673 (numbers from memory, see src/lib/drafting/drawing/dxf.ts), each with
			// the entities it is for.
			expect(report.layers['1']).toEqual(['LWPOLYLINE', 'TEXT']);
			expect(report.layers['14']).toEqual(['LWPOLYLINE']);
			expect(report.layers['7']).toEqual(['LINE']);
			expect(report.layers['4']).toEqual(['LINE']);
			expect(report.layers['15']).toEqual(['TEXT']);
			expect(report.layers['2']).toEqual(['POINT']);

			// LibreCAD (Debian) converts it to PDF headless; poppler reads that PDF.
			const pdf = join(dir, `${number}.pdf`);
			await run('xvfb-run', ['-a', 'librecad', 'dxf2pdf', '-o', pdf, file], { cwd: dir, timeout: 60_000 });
			expect(existsSync(pdf)).toBe(true);
			expect(statSync(pdf).size).toBeGreaterThan(1000);
			const info = await run('pdfinfo', [pdf]);
			expect(info).toMatch(/Pages:\s+1/);
			await run('pdftotext', [pdf, '-']);
		}, 90_000);
	}

	it('is for the workroom and the owner only', async () => {
		const path = `/workroom/orders/${ids['QL-1006']}/pattern.dxf`;
		const owner = await get(path, cookies.owner);
		expect(owner.status, owner.status === 200 ? '' : await owner.clone().text()).toBe(200);
		expect((await get(path, cookies.shopper)).status).toBe(403);
		const anonymous = await get(path);
		expect(anonymous.status).toBe(303);
		expect(anonymous.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(path)}`);
	});

	it('says clearly why there is no file: no order, no draft, a retired style, figures that no longer draft', async () => {
		const cases: [number, number, RegExp][] = [
			[99999999, 404, /no order 99999999/],
			[bad.ids.noDraft, 404, new RegExp(`${bad.numbers.noDraft} has no skirt to draft`)],
			[bad.ids.retired, 404, /a style the atelier has retired/],
			[bad.ids.undraftable, 422, /cannot be drafted again/]
		];
		for (const [id, status, message] of cases) {
			const res = await get(`/workroom/orders/${id}/pattern.dxf`, cookies.cutter);
			expect(res.status, String(id)).toBe(status);
			expect(res.headers.get('content-type')).toContain('application/json');
			expect((await res.json()).message).toMatch(message);
		}
	});
});
