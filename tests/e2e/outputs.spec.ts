import { expect, test } from '@playwright/test';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';

// The download choices on the workroom's order page: the paper, a roll's width shown only for a roll,
// the file it gives, and the choice offered first next time. QL_SHOT_DIR keeps screenshots to look at.
test('the owner chooses the roll in the workroom, downloads the pattern and finds the roll offered first next time', async ({ page }) => {
	test.setTimeout(120_000);
	const account = DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!;
	await page.goto('/signin');
	await page.getByLabel('E-mail', { exact: true }).fill(account.email);
	await page.getByLabel('Password').fill(DEMO_SIGN_INS.password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/admin$/);
	// QL-1007, the seed's full-circle skirt: found in the owner's order list, opened in the workroom.
	await page.goto('/admin/orders?q=QL-1007');
	const href = await page.getByRole('link', { name: 'QL-1007' }).first().getAttribute('href');
	const id = /\/(\d+)$/.exec(href ?? '')![1];
	await page.goto(`/workroom/orders/${id}`);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('QL-1007');
	const paper = page.getByLabel('Pattern on');
	await expect(page.getByLabel('Roll width (cm)')).toHaveCount(0);
	await paper.selectOption('roll');
	await expect(page.getByLabel('Roll width (cm)')).toHaveValue(/^\d+(\.\d)?$/);
	await page.getByLabel('Roll width (cm)').fill('100');
	const shots = process.env.QL_SHOT_DIR;
	const files = page.getByRole('region', { name: 'Full-size files' });
	if (shots) {
		await files.scrollIntoViewIfNeeded();
		await page.screenshot({ path: `${shots}/download-choices-desktop.png`, fullPage: true });
	}
	// The form asks for the file the way the browser would send it.
	const action = await page.locator('form[action$="pattern.pdf"]').getAttribute('action');
	const pdf = await page.request.get(`${action}?paper=roll&width=100`);
	expect(pdf.status()).toBe(200);
	expect(pdf.headers()['content-type']).toBe('application/pdf');
	expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
	await page.reload();
	await expect(page.getByLabel('Pattern on')).toHaveValue('roll');
	await expect(page.getByLabel('Roll width (cm)')).toHaveValue('100');
	await expect(page.getByRole('link', { name: /lay at full size/ })).toHaveAttribute('href', /lay\.pdf$/);
	if (shots) {
		await page.setViewportSize({ width: 390, height: 844 });
		await files.scrollIntoViewIfNeeded();
		await files.screenshot({ path: `${shots}/download-choices-phone.png` });
	}
});
