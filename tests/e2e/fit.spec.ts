import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_SIGN_INS } from '../../src/lib/server/seed/demo-accounts.js';
import { createDb } from '../../src/lib/server/db/client';
import { deliveredOrder } from '../support/fit';
import { eventually, mailsTo } from '../support/shop';
import { pdfText } from '../support/pixels';

// The fit loop end to end: she says "waist too tight by 2 cm" with a photo; the owner approves a remake
// with 2 cm more at the waist; the remake is in the queue with the changed figures on its ticket page;
// her measure card shows the change and why; the mails arrive. QL_SHOTS=dir also keeps a screenshot of
// each step on a phone's window (390 × 844) and a desktop's (1280 × 900).
const SHOTS = process.env.QL_SHOTS;
async function shot(page: Page, name: string) {
	if (!SHOTS) return;
	mkdirSync(SHOTS, { recursive: true });
	const size = page.viewportSize()!;
	for (const [label, width, height] of [['phone', 390, 844], ['desktop', 1280, 900]] as const) {
		await page.setViewportSize({ width, height });
		await page.screenshot({ path: join(SHOTS, `${name}-${label}.png`), fullPage: true });
	}
	await page.setViewportSize(size);
}

async function signIn(page: Page, email: string) {
	await page.goto('/signin');
	await page.getByLabel('E-mail', { exact: true }).fill(email);
	await page.getByLabel('Password').fill(DEMO_SIGN_INS.password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
}

test('a tight waist comes back as a remake drafted 2 cm larger, and her card learns it', async ({ page, browser }) => {
	test.setTimeout(120_000);
	const shopper = DEMO_SIGN_INS.accounts.filter((a) => a.role === 'shopper')[1];
	const { db, pool } = createDb(process.env.DATABASE_URL!, 2);
	const order = await deliveredOrder(db, { account: shopper.email, card: `Fit test ${Date.now().toString(36)}` });
	await pool.end();

	// Her side: from the order page to the report.
	await signIn(page, shopper.email);
	await page.goto(`/orders/${order.number}`);
	await shot(page, '1-order-page');
	await page.getByRole('link', { name: 'Tell us how it fits' }).click();
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Tell us how it fits');
	const waist = page.getByTestId('area-waist');
	await waist.getByLabel('A little tight').check();
	await waist.getByLabel(/By how much/).fill('2');
	await page.getByTestId('zones-back').locator('[data-zone="back-waist"]').click();
	await expect(page.getByLabel('Back waist', { exact: true })).toBeChecked();
	const photo = await sharp({ create: { width: 600, height: 800, channels: 3, background: '#7b6a5c' } }).jpeg().toBuffer();
	await page.locator('input[name="photo"]').setInputFiles({ name: 'back.jpg', mimeType: 'image/jpeg', buffer: photo });
	await page.getByLabel(/I agree that the atelier keeps my photos/).check();
	await page.getByLabel(/A remake: you cut it again/).check();
	await shot(page, '2-fit-form');
	if (SHOTS) {
		// The photo consent, on its own: what she agrees to and for how long.
		for (const [label, width, height] of [['phone', 390, 844], ['desktop', 1280, 900]] as const) {
			await page.setViewportSize({ width, height });
			await page.getByRole('group', { name: 'Photos (optional)' }).screenshot({ path: join(SHOTS, `2b-photo-consent-${label}.png`) });
		}
	}
	await page.getByRole('button', { name: 'Send my fit report' }).click();
	await expect(page.getByTestId('fit-sent')).toBeVisible();
	await expect(page.getByTestId('fit-report')).toContainText('Waist: a little tight, by 2 cm');
	await expect(page.getByTestId('fit-report').locator('img')).toHaveCount(1);
	await shot(page, '3-report-sent');

	// The owner's side: the report beside the first draft, a remake with 2 cm more at the waist.
	const ownerContext = await browser.newContext();
	const owner = await ownerContext.newPage();
	await signIn(owner, DEMO_SIGN_INS.accounts.find((a) => a.role === 'owner')!.email);
	await owner.goto('/workroom/fit-reports');
	await shot(owner, '4-fit-reports');
	await owner.getByTestId('fit-reports-new').getByRole('link', { name: order.number }).click();
	await expect(owner.getByTestId('answers')).toContainText('Waist: a little tight, by 2 cm');
	await expect(owner.getByTestId('photos').locator('img')).toHaveCount(1);
	await expect(owner.getByTestId('figures')).toBeVisible();
	await expect(owner.getByLabel('Waist change in cm')).toHaveValue('+2');
	await expect(owner.getByLabel(/Remake: a new order/)).toBeChecked();
	await owner.getByLabel(/A word for her/).fill('We cut it again with 2 cm more at the waist.');
	await shot(owner, '5-decide');
	await owner.getByRole('button', { name: 'Order the remake' }).click();
	await expect(owner.getByTestId('decided')).toContainText('The remake is order');
	await owner.getByTestId('decided').getByRole('link').click();
	await expect(owner.getByTestId('remake-changes')).toContainText(`Remake of ${order.number}`);
	await expect(owner.getByTestId('remake-changes')).toContainText('Waist 72 cm → 74 cm');
	await shot(owner, '6-remake-ticket');
	const remakeNumber = (await owner.getByRole('heading', { level: 1 }).textContent())!.trim();
	// The printed ticket the cutter works from says what changed against the first cut, old and new,
	// why, and the report it came from (read back with poppler's pdftotext).
	const remakeId = new URL(owner.url()).pathname.split('/').pop();
	const ticket = await owner.request.get(`/workroom/orders/${remakeId}/ticket.pdf`);
	expect(ticket.status()).toBe(200);
	const text = pdfText(await ticket.body(), 1, 1).replace(/\s+/g, ' ');
	expect(text).toContain(`Remake of order ${order.number} — changes against the first cut`);
	expect(text).toContain('Waist: first cut 72 cm, now 74 cm');
	expect(text).toMatch(/From fit report \d+ of \d+ \w+ \d{4}\. Why: We cut it again with 2 cm more at the waist\./);
	await owner.goto('/workroom');
	const row = owner.getByTestId('queue-row').filter({ hasText: remakeNumber });
	await expect(row.getByTestId('remake-mark')).toHaveText('Remake');
	await shot(owner, '7-queue');
	await owner.goto('/admin/fit');
	await shot(owner, '8-owner-fit-page');
	await owner.goto('/admin/settings');
	await expect(owner.getByTestId('promise-preview')).toContainText('within 30 days of delivery');
	await shot(owner, '10-settings');
	await ownerContext.close();

	// Her card holds the correction, with its reason; the decision is on her report.
	await page.goto('/account');
	await expect(page.getByTestId('card-history').first()).toContainText('Waist 72 cm → 74 cm');
	await expect(page.getByTestId('card-history').first()).toContainText('We cut it again with 2 cm more at the waist.');
	await shot(page, '9-account-card');
	await page.goto(`/orders/${order.number}/fit`);
	await expect(page.getByTestId('fit-status')).toHaveText('Remake');

	const subjects = await eventually(async () => {
		const s = (await mailsTo(shopper.email)).map((m) => m.subject);
		return s.includes(`We are making your skirt again (order ${order.number})`) ? s : null;
	});
	expect(subjects).toContain(`We have your fit report for order ${order.number}`);
	const decision = (await mailsTo(shopper.email)).find((m) => m.subject === `We are making your skirt again (order ${order.number})`)!;
	expect(decision.text).toContain(`as order ${remakeNumber}, at no charge`);
	expect(decision.text).toContain('Waist 72 cm → 74 cm');
	expect(decision.text).toContain(`/orders/${order.number}/fit?t=`);
});
