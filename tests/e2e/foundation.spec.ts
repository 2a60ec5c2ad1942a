import { expect, test } from '@playwright/test';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { DEMO_STYLES } from '../../src/lib/server/seed/catalogue';

test('the home page shows the seeded styles and asks nothing of other hosts', async ({ page }) => {
	const offMachine: string[] = [];
	page.on('request', (req) => {
		const url = new URL(req.url());
		if (!['127.0.0.1', 'localhost'].includes(url.hostname) && url.protocol !== 'data:') offMachine.push(req.url());
	});
	await page.goto('/');
	await expect(page.getByRole('heading', { level: 1 })).toContainText('drafted from your own measurements');
	// The catalogue tests may add styles of their own: every seeded one must be there.
	await expect(page.getByTestId('style-card').first()).toBeVisible();
	expect(await page.getByTestId('style-card').count()).toBeGreaterThanOrEqual(DEMO_STYLES.length);
	for (const s of DEMO_STYLES) await expect(page.getByRole('heading', { name: s.name })).toBeVisible();
	await page.waitForLoadState('networkidle');
	expect(offMachine).toEqual([]);
	// Lora ships with the app: the heading is set in it.
	const family = await page.getByRole('heading', { level: 1 }).evaluate((el) => getComputedStyle(el).fontFamily);
	expect(family).toContain('Lora');
});

const landing = { owner: { path: '/admin', heading: 'Pipeline' }, cutter: { path: '/workroom', heading: 'Workroom' }, shopper: { path: '/account', heading: 'Hello,' } } as const;

for (const role of ['owner', 'cutter', 'shopper'] as const) {
	test(`the demo ${role} signs in and lands on her own page`, async ({ page }) => {
		const account = DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
		await page.goto('/signin');
		await page.getByLabel('E-mail', { exact: true }).fill(account.email);
		await page.getByLabel('Password').fill(DEMO_SIGN_INS.password);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect(page).toHaveURL(new RegExp(`${landing[role].path}$`));
		await expect(page.getByRole('heading', { level: 1 })).toContainText(landing[role].heading);
		await expect(page.getByRole('navigation', { name: 'Main' })).toContainText(account.name);
		if (role !== 'shopper') {
			// Real figures from the database: the page shows what the workroom API counts.
			const summary = await (await page.request.get('/api/workroom/summary')).json();
			await expect(page.locator('[data-stage="paid"]')).toHaveText(String(summary.stages.paid));
			expect(summary.stages.paid).toBeGreaterThan(0);
		}
		await page.getByRole('button', { name: 'Sign out' }).click();
		await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
	});
}

test('a wrong password shows a message on the form', async ({ page }) => {
	await page.goto('/signin');
	await page.getByLabel('E-mail', { exact: true }).fill('margit@ondine.example');
	await page.getByLabel('Password').fill('wrong-password');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page.getByRole('alert')).toContainText('do not match an account');
	await expect(page).toHaveURL(/\/signin/);
});
