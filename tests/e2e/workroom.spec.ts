import { expect, test, type Page } from '@playwright/test';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { paidOrder } from '../support/shop';

async function signIn(page: Page, role: 'cutter' | 'owner') {
	const account = DEMO_SIGN_INS.accounts.find((a) => a.role === role)!;
	await page.goto('/signin');
	await page.getByLabel('E-mail', { exact: true }).fill(account.email);
	await page.getByLabel('Password').fill(DEMO_SIGN_INS.password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(role === 'owner' ? /\/admin$/ : /\/workroom$/);
}

test('the cutter prints a ticket and takes an order to shipped; the owner sees it and refunds another', async ({ page, browser }) => {
	test.setTimeout(120_000);
	// Fabric 1 is the seed's first, Harbour wool twill, with plenty on the shelf.
	const other = await paidOrder(1);
	await signIn(page, 'cutter');
	const row = page.getByTestId('queue-row').first();
	const number = (await row.getByRole('link').textContent())!.trim();
	await row.getByRole('link').click();
	await expect(page.getByRole('heading', { level: 1 })).toHaveText(number);

	// The ticket is a PDF with the order number in it.
	const ticketHref = await page.getByRole('link', { name: 'Print cutting ticket' }).getAttribute('href');
	const pdf = await page.request.get(ticketHref!);
	expect(pdf.headers()['content-type']).toBe('application/pdf');
	expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');

	for (const [button, stage] of [['Mark cut', 'Cutting'], ['Mark sewn', 'Sewn'], ['Mark finished', 'Finished']] as const) {
		await page.getByRole('button', { name: button }).click();
		await expect(page.getByTestId('stage')).toHaveText(stage);
	}
	await page.getByLabel('Carrier').fill('Parcelkite');
	await page.getByLabel('Tracking number').fill('PK777123');
	await page.getByRole('button', { name: 'Mark shipped' }).click();
	await expect(page.getByTestId('stage')).toHaveText('Shipped');
	await expect(page.getByTestId('history')).toContainText('Tomasz Weller → Shipped');

	const ownerContext = await browser.newContext();
	const owner = await ownerContext.newPage();
	await signIn(owner, 'owner');
	await owner.getByRole('link', { name: 'Orders' }).click();
	await owner.getByLabel('Search').fill(number);
	await owner.getByRole('button', { name: 'Show' }).click();
	await expect(owner).toHaveURL(new RegExp(`q=${number}`));
	await expect(owner.getByTestId('order-count')).toHaveText('1 order');
	await expect(owner.getByTestId('orders-table')).toContainText('Shipped');

	// A refund on another order, paid through the payment fake, goes back through it.
	await owner.goto(`/admin/orders?q=${other.number}`);
	await owner.getByRole('link', { name: other.number }).click();
	owner.on('dialog', (d) => d.accept());
	await owner.getByLabel('Refund amount (€)').fill('15.00');
	await owner.getByRole('button', { name: 'Refund' }).click();
	await expect(owner.getByTestId('action-message')).toContainText('Refund of €15.00 sent');
	await expect.poll(async () => {
		await owner.reload();
		return owner.getByText(/refunded €15\.00/).count();
	}, { timeout: 15_000 }).toBeGreaterThan(0);
	await ownerContext.close();
});
