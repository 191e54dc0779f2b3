/**
 * The lab's billing screen in a real browser: the demo billing person opens Sales, changes the
 * price of the one-credit pack and sees it saved (also after a reload), makes an adjustment with a
 * reason and sees the client's balance and statement change. Every screen gets a 1280x800
 * screenshot (artifacts/screenshots/billing-*.png) and an axe-core run: no serious or critical
 * violation. Ports 5050-5059 belong to this suite.
 */
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { seedDemo } from '../../server/demo/seed';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import { openBrowser, type Browser } from '../support/browser';
import { seriousAccessibilityViolations } from '../support/accessibility';
import { signedIn, startServer, type Api, type ProductServer } from '../support/product-server';
import { testDatabaseUrl } from '../support/test-app';
import type { Page } from 'playwright-core';

jest.setTimeout(180_000);

const PORT = 5050;
const BILLING = 'owen.achterberg@kestrelbay.example';
const CLIENT = 'Halyard Marine Radio Works';

interface PriceList {
  currency: string;
  packs: { credits: number; priceMinor: number }[];
  refundOnWithdrawWithinDays: number | null;
}

const accessibilityProblems: { screen: string; violations: string[] }[] = [];
let server: ProductServer;
let b: Browser;
let api: Api;
let original: PriceList;

beforeAll(async () => {
  const sequelize = createSequelize(testDatabaseUrl());
  initModels(sequelize);
  await seedDemo(sequelize);
  await sequelize.close();
  server = await startServer({ port: PORT, databaseUrl: testDatabaseUrl() }, 'lab-billing server');
  api = await signedIn(server.base, BILLING, DEMO_PASSWORD);
  original = (await api<PriceList>('GET', '/billing/price-list')).body;
  b = await openBrowser();
});

afterAll(async () => {
  await b?.screenshot('billing-99-last').catch(() => undefined);
  await b?.close();
  // Leave the demo's price list as it was for the other browser suites (they buy the 5-credit pack).
  if (api && original?.packs.length) {
    const { currency, packs, refundOnWithdrawWithinDays } = original;
    await api('PUT', '/billing/price-list', { currency, packs: packs.map((p) => ({ credits: p.credits, priceMinor: p.priceMinor })), ...(refundOnWithdrawWithinDays === null ? {} : { refundOnWithdrawWithinDays }) });
  }
  await server?.stop();
});

/** Screenshot the screen, then axe-core on it; violations are collected and checked at the end. */
async function check(page: Page, name: string): Promise<void> {
  await page.waitForLoadState('networkidle');
  await b.screenshot(`billing-${name}`);
  const violations = await seriousAccessibilityViolations(page);
  if (violations.length) accessibilityProblems.push({ screen: name, violations });
}

const clientRow = (page: Page) => page.getByRole('table', { name: 'Clients and their credit balances' }).getByRole('row').filter({ hasText: CLIENT });
const balanceOf = async (page: Page) => Number((await clientRow(page).locator('td.balance').textContent())!.trim());

test('the billing person changes the price list and adjusts a client’s credits with a reason', async () => {
  const page = b.page;
  await page.goto(`${server.base}/sign-in`);
  await page.getByLabel('E-mail').fill(BILLING);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sales' }).click();
  await page.getByRole('heading', { name: 'Sales and credits' }).waitFor();
  await clientRow(page).waitFor();
  const pricePack1 = page.getByRole('textbox', { name: 'Price (GBP), pack 1' });
  await pricePack1.waitFor();
  await check(page, '01-sales');

  // A price of the one-credit pack that differs from the demo's (GBP 180.00) on every run.
  const pence = 17_000 + (Date.now() % 900);
  const typed = `${Math.floor(pence / 100)}.${String(pence % 100).padStart(2, '0')}`;
  await pricePack1.fill(typed);
  await page.getByRole('button', { name: 'Save price list' }).click();
  await page.getByRole('status').filter({ hasText: 'Price list saved' }).waitFor();
  const stored = (await api<PriceList>('GET', '/billing/price-list')).body;
  expect(stored.packs.find((p) => p.credits === 1)?.priceMinor).toBe(pence);
  // Still there after a reload: it was saved, not just typed.
  await page.reload();
  await page.getByRole('heading', { name: 'Sales and credits' }).waitFor();
  await expect(page.getByRole('textbox', { name: 'Price (GBP), pack 1' }).inputValue()).resolves.toBe(typed);

  // An adjustment of +2 credits with a reason.
  await clientRow(page).waitFor();
  const before = await balanceOf(page);
  await page.getByRole('button', { name: `Adjust credits of ${CLIENT}` }).click();
  const dialog = page.getByRole('dialog', { name: `Adjust credits: ${CLIENT}` });
  await dialog.waitFor();
  const reason = `Goodwill credit for a late report (browser test ${Date.now().toString(36)})`;
  await dialog.getByLabel('Credits to add').fill('2');
  await dialog.getByLabel('Reason').fill(reason);
  await dialog.getByText(`Balance after: ${before + 2}`).waitFor();
  // Let the dialog's opening animation finish, so axe measures contrast at full opacity.
  await page.waitForTimeout(400);
  await check(page, '02-adjustment');
  await dialog.getByRole('button', { name: 'Save adjustment' }).click();
  await dialog.waitFor({ state: 'detached' });
  await page.getByRole('status').filter({ hasText: `Added 2 credits to ${CLIENT}; the balance is now ${before + 2}.` }).waitFor();
  await clientRow(page).locator('td.balance').filter({ hasText: String(before + 2) }).waitFor();
  expect(await balanceOf(page)).toBe(before + 2);
  const statement = page.getByRole('table', { name: `Credit statement of ${CLIENT}` });
  await statement.getByRole('row').filter({ hasText: reason }).waitFor();
  await expect(statement.getByRole('row').filter({ hasText: reason }).textContent()).resolves.toContain('+2');
  await check(page, '03-statement');

  expect(b.outsideRequests).toEqual([]);
  expect(accessibilityProblems).toEqual([]);
});
