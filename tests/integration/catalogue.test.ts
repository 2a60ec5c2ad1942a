import { beforeAll, describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { styles } from '../../src/lib/server/db/schema';
import { testDb } from '../support/db';
import { fabricFields, fabricNamed, get, postForm, postMultipart, run, signIn } from './catalogue.helpers';

const db = testDb();
let owner = '';
let cutter = '';
let shopper = '';

beforeAll(async () => {
	[owner, cutter, shopper] = await Promise.all([signIn('owner'), signIn('cutter'), signIn('shopper')]);
});

const styleFields = (over: Record<string, string> = {}) => ({
	name: `Test wrap ${run}`,
	slug: `test-wrap-${run}`,
	kind: 'a-line',
	description: 'A test style with a gentle flare from the hip, made for checking the catalogue.',
	makingPrice: '104.50',
	priceLining: '18',
	pricePockets: '12,00',
	priceBand: '0',
	priceFacing: '2.5',
	priceInvisibleZip: '4',
	leadDays: '9',
	sortOrder: '50',
	...over
});

describe('the owner keeps the fabrics', () => {
	let id = 0;

	it('adds a fabric, reading euros into cents and metres into centimetres', async () => {
		const res = await postMultipart('/admin/catalogue/fabrics/new?/save', fabricFields(), owner);
		expect(res.status).toBe(303);
		const row = await fabricNamed(db, `Test crepe ${run}`);
		expect(res.headers.get('location')).toBe(`/admin/catalogue/fabrics/${row.id}?added`);
		id = row.id;
		expect(row).toMatchObject({
			colour: 'Heather',
			swatchHex: '#7a6c8f',
			pricePerMetre: 2450,
			stockCm: 1234.5,
			widthCm: 140.5,
			shrinkagePct: 4.5,
			nap: true,
			stretch: false,
			retiredAt: null,
			imageUploadId: null
		});
		expect(row.slug).toBe(`heather-test-crepe-${run}`);
	});

	it('shows the new fabric on a style page of the shop', async () => {
		const html = await (await get('/styles/rue-straight')).text();
		expect(html).toContain(`Test crepe ${run}, Heather`);
		expect(html).toContain('98 % cotton, 2 % elastane');
	});

	it('edits it', async () => {
		// An unticked box is not posted at all, as in a browser.
		const { nap: _, ...fields } = fabricFields({ pricePerMetre: '26', stockMetres: '3' });
		const res = await postMultipart(`/admin/catalogue/fabrics/${id}?/save`, fields, owner);
		expect(res.status).toBe(200);
		expect(await res.text()).toContain('Saved. The shop shows');
		expect(await fabricNamed(db, `Test crepe ${run}`)).toMatchObject({ pricePerMetre: 2600, stockCm: 300, nap: false });
		const page = await (await get(`/admin/catalogue/fabrics/${id}`, owner)).text();
		expect(page).toContain('value="26"');
	});

	it('retires it: the shop stops showing it, the catalogue lists it apart; and brings it back', async () => {
		const res = await postForm(`/admin/catalogue/fabrics/${id}?/retire`, {}, owner);
		expect(res.status).toBe(200);
		expect((await fabricNamed(db, `Test crepe ${run}`)).retiredAt).toBeInstanceOf(Date);
		expect(await (await get('/styles/rue-straight')).text()).not.toContain(`Test crepe ${run}`);
		const list = await (await get('/admin/catalogue', owner)).text();
		const retiredPart = list.slice(list.indexOf('data-testid="retired-list"'));
		expect(list.indexOf('data-testid="retired-list"')).toBeGreaterThan(0);
		expect(retiredPart).toContain(`Test crepe ${run}, Heather`);

		expect((await postForm(`/admin/catalogue/fabrics/${id}?/restore`, {}, owner)).status).toBe(200);
		expect((await fabricNamed(db, `Test crepe ${run}`)).retiredAt).toBeNull();
		expect(await (await get('/styles/rue-straight')).text()).toContain(`Test crepe ${run}, Heather`);
	});

	it('refuses bad input with 400, says why beside each field, and writes nothing', async () => {
		const name = `Refused cloth ${run}`;
		const res = await postMultipart(
			'/admin/catalogue/fabrics/new?/save',
			fabricFields({
				name,
				fibreContent: '100 % cotton, 2 % elastane',
				widthCm: 'wide',
				pricePerMetre: '12.345',
				careText: '',
				swatchHex: 'navy'
			}),
			owner
		);
		expect(res.status).toBe(400);
		const html = await res.text();
		// EU Regulation 1007/2011, Art. 7: "100 %" only for a product of one fibre.
		expect(html).toContain('are only for cloth of one fibre alone (EU Regulation 1007/2011)');
		expect(html).toContain('Write the width as a number with at most 1 decimal, such as 150.');
		expect(html).toContain('Write the price a metre as a number with at most 2 decimals');
		expect(html).toContain('Write the care in words');
		expect(html).toContain('six hexadecimal digits');
		expect(await fabricNamed(db, name)).toBeUndefined();

		const shares = await postMultipart(
			'/admin/catalogue/fabrics/new?/save',
			fabricFields({ name, fibreContent: '90 % wool, 5 % silk' }),
			owner
		);
		expect(shares.status).toBe(400);
		expect(await shares.text()).toContain('The shares add up to 95 %: they must make 100 %.');
		expect(await fabricNamed(db, name)).toBeUndefined();
	});

	it('answers 404 for a fabric that is not there, not 500', async () => {
		expect((await get('/admin/catalogue/fabrics/999999', owner)).status).toBe(404);
		expect((await get('/admin/catalogue/fabrics/not-a-number', owner)).status).toBe(404);
		expect((await postForm('/admin/catalogue/fabrics/999999?/retire', {}, owner)).status).toBe(404);
	});
});

describe('the owner keeps the styles', () => {
	let id = 0;
	const slug = `test-wrap-${run}`;

	it('adds a style with its prices in cents', async () => {
		const res = await postForm('/admin/catalogue/styles/new?/save', styleFields(), owner);
		expect(res.status).toBe(303);
		const [row] = await db.select().from(styles).where(eq(styles.slug, slug));
		id = row.id;
		expect(res.headers.get('location')).toBe(`/admin/catalogue/styles/${id}?added`);
		expect(row).toMatchObject({
			name: `Test wrap ${run}`,
			kind: 'a-line',
			makingPrice: 10450,
			leadDays: 9,
			sortOrder: 50,
			retiredAt: null
		});
		expect(row.optionPrices).toEqual({ lining: 1800, pockets: 1200, band: 0, facing: 250, 'invisible-zip': 400 });
		const page = await get(`/styles/${slug}`);
		expect(page.status).toBe(200);
		expect(await page.text()).toContain(`Test wrap ${run}`);
	});

	it('edits it', async () => {
		const res = await postForm(
			`/admin/catalogue/styles/${id}?/save`,
			styleFields({ makingPrice: '110', description: 'Changed: a softer flare from the hip, for a test.' }),
			owner
		);
		expect(res.status).toBe(200);
		const [row] = await db.select().from(styles).where(eq(styles.id, id));
		expect(row.makingPrice).toBe(11000);
		expect(await (await get(`/styles/${slug}`)).text()).toContain('Changed: a softer flare from the hip');
	});

	it('refuses a taken address, an unknown cut and bad figures with 400, writing nothing', async () => {
		const taken = await postForm(
			'/admin/catalogue/styles/new?/save',
			styleFields({ name: `Dup ${run}`, slug: 'rue-straight' }),
			owner
		);
		expect(taken.status).toBe(400);
		expect(await taken.text()).toContain('Another style has this address already');
		const bad = await postForm(
			'/admin/catalogue/styles/new?/save',
			styleFields({
				name: `Dup ${run}`,
				slug: `dup-${run}`,
				kind: 'spiral',
				makingPrice: '-5',
				leadDays: '7.5',
				priceLining: ''
			}),
			owner
		);
		expect(bad.status).toBe(400);
		const html = await bad.text();
		expect(html).toContain('Choose the cut the workroom drafts for this style.');
		expect(html).toContain('Write the making price as a number with at most 2 decimals');
		expect(html).toContain('Write the lead time as a whole number, such as 7.');
		expect(html).toContain('Enter the price of a lining.');
		expect(
			await db
				.select()
				.from(styles)
				.where(eq(styles.name, `Dup ${run}`))
		).toHaveLength(0);
		// An edit that fails leaves the row as it was.
		expect(
			(await postForm(`/admin/catalogue/styles/${id}?/save`, styleFields({ makingPrice: 'lots' }), owner)).status
		).toBe(400);
		expect((await db.select().from(styles).where(eq(styles.id, id)))[0].makingPrice).toBe(11000);
	});

	it('retires it (its shop page answers 404) and brings it back', async () => {
		expect((await postForm(`/admin/catalogue/styles/${id}?/retire`, {}, owner)).status).toBe(200);
		expect((await db.select().from(styles).where(eq(styles.id, id)))[0].retiredAt).toBeInstanceOf(Date);
		expect((await get(`/styles/${slug}`)).status).toBe(404);
		expect(await (await get('/', owner)).text()).not.toContain(`Test wrap ${run}`);
		expect((await postForm(`/admin/catalogue/styles/${id}?/restore`, {}, owner)).status).toBe(200);
		expect((await get(`/styles/${slug}`)).status).toBe(200);
	});
});

describe('who may open the catalogue', () => {
	const pages = [
		'/admin/catalogue',
		'/admin/catalogue/styles/new',
		'/admin/catalogue/styles/1',
		'/admin/catalogue/fabrics/new',
		'/admin/catalogue/fabrics/1'
	];
	const actions = [
		'/admin/catalogue/styles/new?/save',
		'/admin/catalogue/styles/1?/save',
		'/admin/catalogue/styles/1?/retire',
		'/admin/catalogue/styles/1?/restore',
		'/admin/catalogue/fabrics/new?/save',
		'/admin/catalogue/fabrics/1?/save',
		'/admin/catalogue/fabrics/1?/retire',
		'/admin/catalogue/fabrics/1?/restore'
	];

	it('gives a cutter and a shopper 403 on every page and action, and sends a stranger to sign in', async () => {
		const [rows] = await db.select({ n: count() }).from(styles);
		for (const path of pages) {
			expect((await get(path, cutter)).status, `cutter GET ${path}`).toBe(403);
			expect((await get(path, shopper)).status, `shopper GET ${path}`).toBe(403);
			const anon = await get(path);
			expect(anon.status, `anonymous GET ${path}`).toBe(303);
			expect(anon.headers.get('location')).toContain('/signin?next=');
		}
		for (const path of actions) {
			const cut = await postForm(
				path,
				{ ...styleFields({ name: 'Cutter was here', slug: 'cutter-was-here' }) },
				cutter
			);
			expect(cut.status, `cutter POST ${path}`).toBe(403);
			expect((await postForm(path, {}, shopper)).status, `shopper POST ${path}`).toBe(403);
		}
		expect((await db.select({ n: count() }).from(styles))[0].n).toBe(rows.n);
		expect((await db.select().from(styles).where(eq(styles.id, 1)))[0].retiredAt).toBeNull();
	});

	it('lets the owner open every page', async () => {
		for (const path of pages) expect((await get(path, owner)).status, path).toBe(200);
	});
});
