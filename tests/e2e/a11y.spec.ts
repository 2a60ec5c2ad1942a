import { expect, test, type Browser, type BrowserContext, type Page } from '@playwright/test';
import AxeBuilder from '@axe-core/playwright';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { findRoutes, pathFor } from '../support/routes';
import { signInCookie } from '../support/session';

// axe-core on every page of every audience (the shop as a guest, the account as a shopper, the workroom
// as a cutter, the back office and any order as the owner): no serious or critical finding. The routes
// are read from the file tree, so a page added tomorrow is checked too. One page load each, one sign-in
// per audience for the whole file. The inbox and payment fakes are not the product and are left out.
type Audience = 'guest' | 'shopper' | 'cutter' | 'owner';
const audienceOf = (path: string): Audience =>
	path.startsWith('/admin') || path.startsWith('/workroom/fit-reports') ? 'owner' : path.startsWith('/workroom') ? 'cutter' : path.startsWith('/account') ? 'shopper' : path.startsWith('/orders/') ? 'owner' : 'guest';

const contexts = new Map<Audience, BrowserContext>();
let samples: Record<string, string> = {};

async function contextFor(browser: Browser, who: Audience) {
	let c = contexts.get(who);
	if (!c) {
		c = await browser.newContext();
		if (who !== 'guest') {
			const [name, value] = (await signInCookie(DEMO_SIGN_INS.accounts.find((a) => a.role === who)!.email, DEMO_SIGN_INS.password)).split(/=(.*)/s);
			await c.addCookies([{ name, value, url: process.env.APP_URL ?? 'http://127.0.0.1:3000' }]);
		}
		contexts.set(who, c);
	}
	return c;
}

async function seriousFindings(page: Page) {
	// The WCAG 2.1 A and AA rules (what the law of most places asks); best-practice rules are left out
	// to keep one page's scan short on a busy machine.
	const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
	return results.violations
		.filter((v) => v.impact === 'serious' || v.impact === 'critical')
		.map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

test.beforeAll(async ({ browser }) => {
	// Real records to open: the seed's first order, fabric and style, and a member of staff.
	const owner = await (await contextFor(browser, 'owner')).newPage();
	await owner.goto('/admin/staff');
	const staffHref = await owner.locator('a[href^="/admin/staff/"]').first().getAttribute('href');
	await owner.close();
	samples = { 'id=id': '1', 'id=uuid': staffHref!.split('/').pop()!, 'number=number': 'QL-1001', 'slug=slug': 'rue-straight' };
	// A lay and a files job of its own, made as a cutter would, so the walk does not lean on other test files.
	const cutter = await (await contextFor(browser, 'cutter')).newPage();
	await cutter.goto('/workroom/lays');
	await cutter.getByRole('button', { name: 'Lay the ticked orders together' }).first().click();
	await cutter.waitForURL(/\/workroom\/lays\/\d+$/, { timeout: 30_000 });
	own['/workroom/lays/[id=id]'] = cutter.url().split('/').pop()!;
	await cutter.goto('/workroom/lays');
	await cutter.getByRole('button', { name: 'Prepare files for the ticked orders' }).first().click();
	await cutter.waitForURL(/\/workroom\/jobs\/\d+$/);
	own['/workroom/jobs/[id=id]'] = cutter.url().split('/').pop()!;
	await cutter.close();
});

/** Pages of records this walk made itself, by route id: their own id. */
const own: Record<string, string> = {};

test.afterAll(async () => {
	for (const c of contexts.values()) await c.close();
});

const PAGES = findRoutes().filter((r) => r.page);

test('the walk finds the pages of every audience', () => {
	expect(PAGES.length).toBeGreaterThan(20);
	for (const area of ['/admin', '/workroom', '/account', '/styles']) expect(PAGES.some((r) => r.id.replace(/\/\([^/]+\)/g, '').startsWith(area)), area).toBe(true);
});

for (const r of PAGES) {
	test(`axe: ${r.id}`, async ({ browser }) => {
		const path = pathFor(r.id, own[r.id.replace(/\/\([^/]+\)/g, '')] ? { ...samples, 'id=id': own[r.id.replace(/\/\([^/]+\)/g, '')] } : samples);
		const who = audienceOf(path);
		const page = await (await contextFor(browser, who)).newPage();
		const res = await page.goto(path);
		expect(res?.status(), `${path} as ${who}`).toBeLessThan(400);
		expect(await seriousFindings(page), `${path} as ${who}`).toEqual([]);
		await page.close();
	});
}

test('the measuring steps, the no-tape ways in and the configure page work from the keyboard, and pass axe open', async ({ browser }) => {
	test.setTimeout(120_000);
	const page = await (await contextFor(browser, 'guest')).newPage();
	await page.goto('/styles/rue-straight/make');
	// The ways in without a tape: a disclosure button, then tabs moved by the arrow keys.
	await page.getByRole('button', { name: /No tape measure/ }).focus();
	await page.keyboard.press('Enter');
	await expect(page.getByRole('tab', { name: 'My usual size' })).toBeVisible();
	await page.getByRole('tab', { name: 'My usual size' }).focus();
	await page.keyboard.press('End');
	await expect(page.getByRole('tab', { name: 'A skirt that fits me' })).toBeFocused();
	await expect(page.getByRole('tab', { name: 'A skirt that fits me' })).toHaveAttribute('aria-selected', 'true');
	expect(await seriousFindings(page)).toEqual([]);
	await page.keyboard.press('Home');
	await expect(page.getByRole('tab', { name: 'My usual size' })).toHaveAttribute('aria-selected', 'true');

	// Four measurements, typed and confirmed with Enter on "Next".
	for (const [label, value] of [['Waist', '70'], ['Hip', '96'], ['Waist to hip', '21'], ['Waist to knee', ''], ['Skirt length', '62']]) {
		const field = page.getByLabel(label, { exact: true });
		await field.focus();
		await page.keyboard.type(value);
		await page.getByRole('button', { name: 'Next' }).locator('visible=true').focus();
		await page.keyboard.press('Enter');
	}
	await expect(page.getByRole('heading', { name: 'Make it yours' })).toBeVisible();
	// A cloth chosen from the keyboard: focus the first radio, Space checks it.
	const cloth = page.getByRole('radio', { name: /Harbour wool twill/ });
	await cloth.focus();
	await page.keyboard.press('Space');
	await expect(cloth).toBeChecked();
	await expect(page.getByTestId('total')).toContainText('€');
	expect(await seriousFindings(page)).toEqual([]);
	await page.close();
});
