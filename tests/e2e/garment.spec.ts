// Her skirt as she types: the garment drawing appears with her first measurement and its waist, hip, hem
// and length follow the numbers she types. The drawn widths are checked against the server's own draft of
// the same figure (POST /api/quote), scaled as garment.ts says a girth is seen from the front.
import { expect, test, type Page } from '@playwright/test';
import { DRAPE, SEEN } from '../../src/lib/drafting/drawing/garment';

type Figures = {
	front: { hipWidth: number };
	back: { hipWidth: number };
	hemGirth: number;
	check: { waistSeam: { front: number; back: number } };
};

/** The widths the drawing should have for these figures (garment.ts: SEEN of the girth up to the fitted
 * hip, DRAPE / π of each cm beyond it). */
function expected(f: Figures) {
	const fitted = 2 * (f.front.hipWidth + f.back.hipWidth);
	const seen = (g: number) => SEEN * Math.min(g, fitted) + (DRAPE * Math.max(0, g - fitted)) / Math.PI;
	return { waist: seen(2 * (f.check.waistSeam.front + f.check.waistSeam.back)), hip: seen(fitted), hem: seen(f.hemGirth) };
}

async function serverFigures(page: Page, style: string, m: { waist: number; hip: number; length: number }): Promise<Figures> {
	const res = await page.request.post('/api/quote', { data: { style, measurements: m } });
	expect(res.status()).toBe(200);
	return (await res.json()).figures;
}

/** What the drawing on the page says of itself, and the drawn box of the front view's skirt. */
async function drawn(page: Page) {
	const svg = page.getByTestId('garment-drawing').locator('svg');
	await expect(svg).toBeVisible();
	return svg.evaluate((el) => {
		const num = (k: string) => Number(el.getAttribute(`data-${k}`));
		// The front view's group: the figure first, then the skirt's body filled with the cloth.
		const body = el.querySelector('g[aria-label="skirt, front"] > path:nth-of-type(2)') as SVGPathElement;
		const box = body.getBBox();
		return { waist: num('waist-width'), hip: num('hip-width'), hem: num('hem-width'), length: num('length'), box: { w: box.width, top: box.y, h: box.height } };
	});
}

async function settle(page: Page, what: (d: Awaited<ReturnType<typeof drawn>>) => boolean) {
	// The engine loads after first paint: on a busy machine that can take a while.
	await expect.poll(async () => what(await drawn(page)), { timeout: 30_000 }).toBe(true);
	return drawn(page);
}

test('her skirt is drawn from the first measurement and follows what she types', async ({ page }) => {
	await page.goto('/styles/meadow-a-line/make');
	await expect(page.getByText('Your skirt appears here as soon as you give your first measurement.')).toBeVisible();
	await page.getByLabel('Waist', { exact: true }).fill('72');

	// The first measurement alone draws her skirt: the usual figure's hip difference (26 cm) and length (60 cm).
	let d = await settle(page, (x) => x.length === 60);
	let want = expected(await serverFigures(page, 'meadow-a-line', { waist: 72, hip: 98, length: 60 }));
	expect(d.waist).toBeCloseTo(want.waist, 1);
	expect(d.hip).toBeCloseTo(want.hip, 1);
	expect(d.hem).toBeCloseTo(want.hem, 1);
	// The skirt drawn is as wide as its hem (an A-line flares) and starts at the waist line.
	expect(d.box.w).toBeCloseTo(Math.max(want.hip, want.hem), 0);
	expect(d.box.top).toBeCloseTo(0, 1);
	await expect(page.getByText(/usual hip and length until you give yours/)).toBeVisible();
	const first = d;

	await page.getByRole('button', { name: 'Next' }).click();
	await page.getByLabel('Hip', { exact: true }).fill('112');
	d = await settle(page, (x) => x.hip > first.hip + 4);
	want = expected(await serverFigures(page, 'meadow-a-line', { waist: 72, hip: 112, length: 60 }));
	expect(d.hip).toBeCloseTo(want.hip, 1);
	// 14 cm more hip is 14 cm more girth, seen at SEEN of it.
	expect(d.hip - first.hip).toBeCloseTo(SEEN * 14, 0);

	await page.getByRole('button', { name: 'Next' }).click();
	await page.getByLabel('I don’t know my waist-to-hip depth').check();
	await page.getByRole('button', { name: 'Next' }).click();
	await page.getByRole('button', { name: /^Skip: use/ }).click();
	await page.getByLabel('Skirt length', { exact: true }).fill('80');
	d = await settle(page, (x) => x.length === 80);
	want = expected(await serverFigures(page, 'meadow-a-line', { waist: 72, hip: 112, length: 80 }));
	// A longer A-line flares further: a wider hem, and the skirt drawn 20 cm longer.
	expect(d.hem).toBeCloseTo(want.hem, 1);
	expect(d.hem).toBeGreaterThan(first.hem);
	expect(d.box.h).toBeGreaterThan(80);
	expect(d.box.h).toBeLessThan(84);

	// Waist last: a wider waist, drawn wider.
	// Length, knee, depth, hip: four steps back to the waist.
	for (let i = 0; i < 4; i++) await page.getByRole('button', { name: 'Back' }).click();
	await page.getByLabel('Waist', { exact: true }).fill('84');
	d = await settle(page, (x) => x.waist > first.waist + 3);
	want = expected(await serverFigures(page, 'meadow-a-line', { waist: 84, hip: 112, length: 80 }));
	expect(d.waist).toBeCloseTo(want.waist, 1);

	// The pattern behind it is one tab away.
	await page.getByRole('tab', { name: 'The pattern behind it' }).click();
	await expect(page.getByTestId('pattern-drawing').locator('svg')).toBeVisible();
});

for (const size of [
	{ width: 390, height: 844 },
	{ width: 360, height: 740 }
]) {
	test(`on a ${size.width} × ${size.height} phone the summary stays in view while she picks a cloth`, async ({ page }) => {
		await page.setViewportSize(size);
		await page.goto('/styles/rue-straight/make');
		for (const [label, value] of [
			['Waist', '70'],
			['Hip', '96'],
			['Waist to hip', '21']
		] as const) {
			await page.getByLabel(label, { exact: true }).fill(value);
			await page.getByRole('button', { name: 'Next' }).click();
		}
		await page.getByRole('button', { name: /^Skip: use/ }).click();
		await page.getByLabel('Skirt length', { exact: true }).fill('62');
		await page.getByRole('button', { name: 'Next' }).click();
		const summary = page.getByTestId('phone-summary');
		await expect(summary.locator('svg')).toBeVisible();
		// A cloth far down the list: the summary is still on screen, and shows its metres and price.
		const cloth = page.getByRole('radio', { name: /Linen canvas/ });
		await cloth.scrollIntoViewIfNeeded();
		await cloth.check();
		await expect(summary.getByTestId('summary-total')).toContainText('€');
		await expect(summary.getByTestId('summary-metres')).toContainText(' m');
		await expect(summary).toBeInViewport({ ratio: 1 });
		// The chosen cloth itself is not hidden behind the summary.
		const [c, s] = [await cloth.boundingBox(), await summary.boundingBox()];
		expect(c!.y + c!.height).toBeLessThanOrEqual(s!.y);
		// The page does not scroll sideways.
		expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(size.width);
		await summary.getByRole('button', { name: 'Add to bag' }).click();
		await expect(page).toHaveURL(/\/bag$/);
		await expect(page.getByTestId('bag-drawing').locator('svg')).toBeVisible();
	});
}
