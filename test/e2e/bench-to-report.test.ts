/**
 * The walking skeleton in a real browser: an engineer registers a radio, builds a plan, enters
 * readings and sees the verdict computed as typed, the server stores it; a reviewer authorizes
 * and issues the signed report; it appears in the reports table; the client's contact gets the
 * e-mail; the public verification page says it is current. Asserts what is on screen, that no
 * request left 127.0.0.1 and that Roboto really loaded.
 */
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { seedDemo } from '../../server/demo/seed';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import { seriousAccessibilityViolations } from '../support/accessibility';
import { openBrowser, type Browser } from '../support/browser';
import { startNode, waitForHttp, type Started } from '../support/processes';
import { testDatabaseUrl } from '../support/test-app';
import type { Page } from 'playwright-core';

jest.setTimeout(180_000);

const PORT = 4710;
const BASE = `http://127.0.0.1:${PORT}`;
const SMTP_HTTP = 'http://127.0.0.1:4726';
const ENGINEER = 'tomasz.ellery@kestrelbay.example';
const REVIEWER = 'priya.castellanos@kestrelbay.example';
const CONTACT = 'delphine.okafor@halyard-radio.example';

let server: Started;
let fakes: Started;
let b: Browser;

beforeAll(async () => {
  const sequelize = createSequelize(testDatabaseUrl());
  initModels(sequelize);
  await seedDemo(sequelize);
  await sequelize.close();
  const env = {
    NODE_ENV: 'test',
    DATABASE_URL: testDatabaseUrl(),
    PORT: String(PORT),
    PUBLIC_URL: BASE,
    SMTP_PORT: '4725',
    SMTP_HTTP_PORT: '4726',
    PAYMENTS_PORT: '4727',
    PAYMENTS_SECRET_KEY: 'sk_test_sidecheck_local',
    PAYMENTS_WEBHOOK_SECRET: 'whsec_sidecheck_local',
    PAYMENTS_WEBHOOK_URL: `${BASE}/api/billing/webhook`,
    FAKES_DATA_DIR: `${process.cwd()}/.data/fakes-e2e-${Date.now()}`,
  };
  fakes = startNode('dist/server/fakes/main.js', env, 'fakes');
  server = startNode('dist/server/server/main.js', env, 'server');
  await waitForHttp(`${BASE}/api/health`, server);
  await waitForHttp(`${SMTP_HTTP}/api/messages`, fakes);
  b = await openBrowser();
});

afterAll(async () => {
  await b?.close();
  await server?.stop();
  await fakes?.stop();
});

async function signInAs(page: Page, email: string) {
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Account menu' }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
}

const accessibilityProblems: { screen: string; violations: string[] }[] = [];

/** A screenshot of the screen, then axe-core on it; problems are checked at the end, all screens at once. */
async function check(page: Page, name: string): Promise<void> {
  await b.screenshot(name);
  const violations = await seriousAccessibilityViolations(page);
  if (violations.length) accessibilityProblems.push({ screen: name, violations });
}

async function choose(page: Page, label: string, option: string | RegExp) {
  await page.getByRole('combobox', { name: label }).click();
  await page.getByRole('option', { name: option }).click();
}

test('engineer measures, reviewer authorizes and issues, the client is told, anyone can verify', async () => {
  const page = b.page;
  await page.goto(`${BASE}/sign-in`);
  await check(page, '01-sign-in');
  await signInAs(page, ENGINEER);
  const roboto = await page.evaluate(async () => {
    await document.fonts.ready;
    return [...document.fonts].some((f) => f.family.replace(/["']/g, '') === 'Roboto' && f.status === 'loaded');
  });
  expect(roboto).toBe(true);
  await page.getByText('Tomasz Ellery').waitFor();
  await check(page, '02-bench-board');
  await page.getByRole('link', { name: 'Devices' }).first().click();
  await page.getByRole('heading', { name: 'Devices under test' }).waitFor();
  await check(page, '02b-devices');
  await page.getByRole('link', { name: 'Bench board' }).first().click();
  await page.getByText('Tomasz Ellery').waitFor();

  // Register a device.
  await page.getByRole('link', { name: 'Register a device' }).first().click();
  await page.getByRole('heading', { name: 'Register a device under test' }).waitFor();
  await page.getByLabel('Manufacturer').fill('Halyard Marine Radio Works');
  await page.getByLabel('Model').fill('Halyard HX-90 compact HF set');
  await page.getByLabel('Serial number').fill('HX90-E2E-001');
  await page.getByLabel('Rated PEP').fill('125');
  await check(page, '03-device-form');
  await page.getByRole('button', { name: 'Save and build a plan' }).click();

  // Build a plan with one carrier-suppression point; the maritime sample rule set is preselected.
  await page.getByRole('heading', { name: 'Build a test plan' }).waitFor();
  await page.getByText('Sample rule set shipped with Sidecheck').waitFor();
  await check(page, '04-plan-form');
  await page.getByRole('button', { name: 'Save plan and start a run' }).click();

  // The run workspace: type readings and see the verdict computed in the browser.
  await page.getByRole('heading', { name: /RUN-\d+ · Halyard HX-90/ }).waitFor();
  await page.getByText('RF safety.').waitFor();
  await page.getByLabel('PEP', { exact: true }).fill('51');
  await page.getByLabel('Carrier level').fill('8.2');
  // 51 - 8.2 = 42.8 dB below PEP against "at least 40 dB" (47 CFR 80.207(c)): a pass under simple acceptance.
  await page.getByText('42.80').waitFor();
  const panel = page.getByRole('region', { name: /Carrier suppression/ });
  await expect(panel.getByText('Pass', { exact: true }).first().isVisible()).resolves.toBe(true);
  await page.getByLabel('Carrier level').fill('12.5');
  await page.getByText('38.50').waitFor();
  await expect(panel.getByText('Fail', { exact: true }).first().isVisible()).resolves.toBe(true);
  await page.getByLabel('Carrier level').fill('8.2');
  await page.getByRole('button', { name: 'Save reading' }).click();
  await page.getByText(/Stored by the server \(engine \d+\.\d+\.\d+\): 42\.80 dB below PEP/).waitFor();
  await check(page, '05-run-workspace');
  const runHeading = await page.getByRole('heading', { name: /RUN-\d+/ }).textContent();
  const runNumber = runHeading!.match(/RUN-\d+/)![0];
  await page.getByRole('button', { name: 'Send for review' }).click();
  await page.getByText('Sent for technical review.').waitFor();
  await signOut(page);

  // The reviewer finds it in the review queue, authorizes and issues.
  await signInAs(page, REVIEWER);
  await page.getByRole('link', { name: runNumber }).click();
  await page.getByRole('button', { name: 'Authorize results' }).click();
  await page.getByText('Results authorized.').waitFor();
  await page.getByRole('button', { name: 'Issue signed report' }).click();
  await page.getByText('Report issued and signed.').waitFor({ timeout: 30_000 });
  await check(page, '06-issued');
  await page.getByRole('link', { name: 'See issued reports' }).click();
  const row = page.getByRole('row', { name: /Halyard HX-90/ });
  await row.waitFor();
  await expect(row.getByText('Current').isVisible()).resolves.toBe(true);
  const reportNumber = (await row.locator('strong').textContent())!.trim();
  expect(reportNumber).toMatch(/^KBRTL-\d{4}-\d{4}$/);
  await check(page, '07-reports');

  // The client's contact got the e-mail, through the queue and the SMTP stand-in.
  let message: { subject: string; text: string; attachments: { filename: string }[] } | undefined;
  for (let i = 0; i < 60 && !message; i++) {
    const list = (await (await fetch(`${SMTP_HTTP}/api/messages?to=${encodeURIComponent(CONTACT)}`)).json()) as { subject: string; text: string; attachments: { filename: string }[] }[] | { messages: never[] };
    const items = Array.isArray(list) ? list : (list as { messages: typeof message[] }).messages;
    message = items.find((m) => m?.subject.includes(reportNumber));
    if (!message) await new Promise((r) => setTimeout(r, 500));
  }
  expect(message).toBeDefined();
  expect(message!.text).toContain(`${BASE}/verify/`);
  expect(message!.attachments.map((a) => a.filename)).toContain(`${reportNumber}.pdf`);

  // The public verification page, signed out.
  const verifyUrl = message!.text.match(/http:\/\/127\.0\.0\.1:\d+\/verify\/[A-Za-z0-9_-]+/)![0];
  await signOut(page).catch(() => undefined);
  await page.goto(verifyUrl);
  await page.getByText('Authentic and current.').waitFor();
  await page.getByRole('heading', { name: new RegExp(reportNumber) }).waitFor();
  await check(page, '08-verify');

  expect(b.outsideRequests).toEqual([]);
});

test('no serious or critical accessibility violation on any screen of the path (axe-core)', () => {
  expect(accessibilityProblems).toEqual([]);
});
