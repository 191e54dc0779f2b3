/**
 * The lab's records and accounts in a real browser: the lab administrator signs in to the lab
 * home, adds an instrument to the register, copies a sample rule set and edits a mask vertex (the
 * uPlot canvas redraws), invites an engineer (the e-mail arrives through the SMTP stand-in), makes
 * an API key that is shown once; the invitee accepts and signs in; a new lab signs up; a password
 * reset e-mail arrives and the reset works. Asserts what is on screen, runs axe-core on every
 * screen touched (no serious or critical violation) and takes a 1280x800 screenshot of each.
 */
import fs from 'node:fs';
import path from 'node:path';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { seedDemo } from '../../server/demo/seed';
import { DEMO_PASSWORD } from '../../server/demo/demo-scenario';
import { seriousAccessibilityViolations } from '../support/accessibility';
import { openBrowser, type Browser } from '../support/browser';
import { ROOT, startNode, waitForHttp, type Started } from '../support/processes';
import { testDatabaseUrl } from '../support/test-app';
import type { Page } from 'playwright-core';

jest.setTimeout(300_000);

const PORT = 4810;
const BASE = `http://127.0.0.1:${PORT}`;
const SMTP_HTTP = 'http://127.0.0.1:4826';
const ADMIN = 'imogen.varga@kestrelbay.example';
const LAB_NAME = 'Kestrel Bay Radio Test Laboratory';
const RUN = Date.now().toString(36);
const INVITEE = `nadia.brennan.${RUN}@kestrelbay.example`;
const INVITEE_PASSWORD = 'bench seven 4 calibrated';
const NEW_PASSWORD = 'harbour light 9 reset';

const accessibilityProblems: { screen: string; violations: string[] }[] = [];

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
    SMTP_PORT: '4825',
    SMTP_HTTP_PORT: '4826',
    PAYMENTS_PORT: '4827',
    PAYMENTS_SECRET_KEY: 'sk_test_sidecheck_local',
    PAYMENTS_WEBHOOK_SECRET: 'whsec_sidecheck_local',
    PAYMENTS_WEBHOOK_URL: `${BASE}/api/billing/webhook`,
    FAKES_DATA_DIR: `${process.cwd()}/.data/fakes-lab-admin-${Date.now()}`,
  };
  fakes = startNode('dist/server/fakes/main.js', env, 'fakes');
  server = startNode('dist/server/server/main.js', env, 'server');
  await waitForHttp(`${BASE}/api/health`, server);
  await waitForHttp(`${SMTP_HTTP}/api/messages`, fakes);
  b = await openBrowser();
});

afterAll(async () => {
  // Where the browser was at the end: after a failure, this shows the screen that did not come.
  await b?.screenshot('lab-99-last').catch(() => undefined);
  await b?.close();
  await server?.stop();
  await fakes?.stop();
});

/** Screenshot the screen, then run axe-core on it: no serious or critical violation (WCAG 2.x A/AA rules). */
async function check(page: Page, name: string): Promise<void> {
  await page.waitForLoadState('networkidle');
  await b.screenshot(`lab-${name}`);
  const violations = await seriousAccessibilityViolations(page);
  // Collected and checked at the end, so one run reports every screen's violations at once.
  if (violations.length) accessibilityProblems.push({ screen: name, violations });
}

async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Account menu' }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
}

/** The newest message to `to` whose subject matches, through the SMTP stand-in's JSON API. */
async function mailTo(to: string, subject: RegExp): Promise<{ subject: string; text: string }> {
  for (let i = 0; i < 60; i++) {
    const list = (await (await fetch(`${SMTP_HTTP}/api/messages?to=${encodeURIComponent(to)}`)).json()) as { subject: string; text: string | null }[];
    const found = list.find((m) => subject.test(m.subject));
    if (found) return { subject: found.subject, text: found.text ?? '' };
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`no message to ${to} matching ${subject}`);
}

/** The first value of `read()` that satisfies `ok`, trying for up to 10 s (screens update asynchronously). */
async function until<T>(read: () => Promise<T>, ok: (value: T) => boolean): Promise<T> {
  let value = await read();
  for (let i = 0; i < 50 && !ok(value); i++) {
    await new Promise((r) => setTimeout(r, 200));
    value = await read();
  }
  return value;
}

const isoDay = (daysFromToday: number) => new Date(Date.now() + daysFromToday * 86_400_000).toISOString().slice(0, 10);

/** The mask plot's canvas as a data URL: it changes exactly when uPlot redraws something different. */
const plotPixels = (page: Page) => page.locator('sc-mask-plot canvas').evaluate((c) => (c as HTMLCanvasElement).toDataURL());

test('lab administrator keeps the records and the accounts; invitee, new lab and password reset', async () => {
  const page = b.page;

  // The lab home: the work queue and the four panels from GET /api/home.
  await signInAs(page, ADMIN);
  await page.getByRole('heading', { name: 'Runs by stage' }).waitFor();
  await page.getByRole('heading', { name: 'Calibration due within 30 days' }).waitFor();
  await page.getByRole('heading', { name: 'Recent activity' }).waitFor();
  await page.getByRole('heading', { name: 'Work queue' }).waitFor();
  await expect(page.getByRole('table', { name: 'Test runs' }).isVisible()).resolves.toBe(true);
  // The organization is named, not numbered.
  await expect(page.locator('sc-organization-switcher').textContent()).resolves.toContain(LAB_NAME);
  const nav = page.getByRole('navigation', { name: 'Main' });
  for (const item of ['Clients', 'Equipment', 'Rule sets', 'Settings']) await nav.getByRole('link', { name: item }).waitFor();
  await check(page, '01-home');

  // The equipment register: add an instrument falling due in 20 days, with one contribution.
  await nav.getByRole('link', { name: 'Equipment' }).click();
  await page.getByRole('heading', { name: 'Equipment register' }).waitFor();
  await page.getByRole('table', { name: 'Instruments' }).waitFor();
  await check(page, '02-equipment');
  await page.getByRole('link', { name: 'Add an instrument' }).click();
  await page.getByRole('heading', { name: 'Add an instrument' }).waitFor();
  const serial = `PM-${RUN}`;
  await page.getByLabel('Instrument name').fill('Power meter, bench 3');
  await page.getByLabel('Model').fill('Kestrel PM-40 thermal sensor');
  await page.getByLabel('Serial number').fill(serial);
  await page.getByLabel('Calibrated on').fill(isoDay(-345));
  await page.getByLabel('Calibration due').fill(isoDay(20));
  await page.getByLabel('Certificate').fill(`CAL-${RUN}`);
  await page.getByLabel('Contribution', { exact: true }).fill('Power sensor calibration factor');
  await page.getByLabel('Half-width a').fill('0.2');
  // GUM §4.3.7: a rectangular half-width a = 0.2 dB gives u = a/√3 = 0.115 dB, shown as typed.
  await page.getByText('u = 0.115 dB').waitFor();
  await check(page, '03-instrument-form');
  await page.getByRole('button', { name: 'Add to the register' }).click();
  await page.getByRole('heading', { name: 'Equipment register' }).waitFor();
  const row = page.getByRole('row', { name: new RegExp(serial) });
  await row.waitFor();
  await expect(row.getByText('Due within 30 days').isVisible()).resolves.toBe(true);

  // Rule sets: the samples are marked; copy the maritime one and edit a mask vertex.
  await nav.getByRole('link', { name: 'Rule sets' }).click();
  await page.getByRole('heading', { name: 'Samples shipped with Sidecheck' }).waitFor();
  await page.getByText('Sample: verify against the current edition').first().waitFor();
  await check(page, '04-rule-sets');
  await page.getByRole('button', { name: /Copy Maritime HF radiotelephone.* to your lab/ }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Name of your rule set').fill(`Maritime J3E, our procedure ${RUN}`);
  await dialog.getByRole('button', { name: 'Make the copy' }).click();
  await page.getByText(/Copied as “Maritime J3E, our procedure .*”, version 1/).waitFor();
  await page.getByRole('heading', { name: /Maritime J3E, our procedure .* version 1/ }).waitFor();
  await page.locator('sc-mask-plot canvas').first().waitFor();
  const before = await plotPixels(page);
  const plot = page.locator('sc-mask-plot [role="img"]');
  await expect(plot.getAttribute('aria-label')).resolves.toContain('\u221228 dB at ±1.5 kHz');
  // 47 CFR 80.211(a): 25 dB instead of 28 dB for equipment installed before 1 Feb 1992.
  await page.getByLabel('Limit of vertex 2, dB').fill('-25');
  await page.getByLabel('Limit of vertex 3, dB').fill('-25');
  expect(await until(() => plotPixels(page), (p) => p !== before)).not.toBe(before);
  await expect(plot.getAttribute('aria-label')).resolves.toContain('\u221225 dB at ±1.5 kHz');
  // An offset going back is named beside its field, and the plot keeps the last valid mask.
  const drawn = await plotPixels(page);
  await page.getByLabel('Offset of vertex 4, Hz').fill('4000');
  await page.getByText('Must not be below the previous offset (4500 Hz).').waitFor();
  await page.getByText('Fix the marked rows: the plot shows the last valid mask.').waitFor();
  await expect(plotPixels(page)).resolves.toBe(drawn);
  await page.getByLabel('Offset of vertex 4, Hz').fill('4500');
  await page.evaluate(() => window.scrollTo(0, 0));
  await check(page, '05-rule-set-editor');
  await page.getByRole('heading', { name: 'Emission mask' }).evaluate((h) => h.scrollIntoView({ block: 'start' }));
  await page.evaluate(() => window.scrollBy(0, -70));
  await b.screenshot('lab-05b-mask-vertex-editor');
  await page.getByRole('button', { name: 'Save as a new version' }).click();
  await page.getByText('Saved as version 2. Version 1 stays as it was, and plans made from it keep it.').waitFor();
  await page.getByRole('heading', { name: /version 2/ }).waitFor();
  await expect(page.getByLabel('Limit of vertex 2, dB').inputValue()).resolves.toBe('-25');

  // Settings, people: invite an engineer; the e-mail arrives in the SMTP stand-in.
  await nav.getByRole('link', { name: 'Settings' }).click();
  await page.getByRole('heading', { name: 'Members' }).waitFor();
  await page.getByRole('cell', { name: /Imogen Varga \(you\)/ }).waitFor();
  await page.getByLabel('E-mail address').fill(INVITEE);
  await page.getByRole('combobox', { name: 'Role', exact: true }).click();
  await page.getByRole('option', { name: 'Test engineer' }).click();
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await page.getByText(`Invitation sent to ${INVITEE}. The link works for 7 days.`).waitFor();
  await page.getByRole('button', { name: `Withdraw the invitation to ${INVITEE}` }).waitFor();
  await check(page, '06-settings-people');
  const invitation = await mailTo(INVITEE, /invited to join Kestrel Bay/);
  const acceptUrl = invitation.text.match(/http:\/\/127\.0\.0\.1:\d+\/invitations\/[A-Za-z0-9_-]{43}/)![0];

  // API keys: shown once, with the warning, then only its prefix.
  await page.getByRole('tab', { name: 'API keys' }).click();
  await page.getByLabel('Name of the key').fill(`Bench 3 power meter script ${RUN}`);
  await page.getByRole('button', { name: 'Make the key' }).click();
  await page.getByText('Copy it now: you will not see it again.').waitFor();
  const key = (await page.getByLabel('The new API key').textContent())!.trim();
  expect(key).toMatch(/^sck_/);
  await page.getByRole('button', { name: 'Copy', exact: true }).waitFor();
  await check(page, '07-api-key-once');
  await page.getByRole('button', { name: 'I have stored it safely' }).click();
  expect(await until(() => page.getByText(key).count(), (n) => n === 0)).toBe(0);
  const keyRow = page.getByRole('row', { name: new RegExp(`Bench 3 power meter script ${RUN}`) });
  await keyRow.waitFor();
  // The list shows only the start of the key, never the key.
  const shownPrefix = (await keyRow.locator('code').textContent())!.replace('…', '');
  expect(key.startsWith(shownPrefix) && shownPrefix.length < key.length).toBe(true);

  // Lab details and auditor access: each screen loads and passes axe.
  await page.getByRole('tab', { name: 'Lab details' }).click();
  await page.getByRole('heading', { name: 'Printed on reports' }).waitFor();
  await check(page, '08-lab-details');
  await page.getByRole('tab', { name: 'Auditor access' }).click();
  await page.getByRole('heading', { name: 'Give an auditor read-only access' }).waitFor();
  await page.getByLabel("Auditor's e-mail").fill(`assessor.${RUN}@accreditation.example`);
  await page.getByRole('button', { name: 'Grant access' }).click();
  await page.getByText(/Access for assessor\..* an invitation is on its way\./).waitFor();
  await check(page, '09-auditor-access');

  // Clients and the device edit form.
  await nav.getByRole('link', { name: 'Clients' }).click();
  await page.getByRole('heading', { name: 'Clients', exact: true }).waitFor();
  await page.getByRole('cell', { name: /^Halyard Marine Radio Works/ }).waitFor();
  await check(page, '10-clients');
  await page.getByRole('link', { name: /^Change Halyard Marine Radio Works/ }).click();
  await page.getByRole('heading', { name: 'Change client' }).waitFor();
  expect(await until(() => page.getByLabel('Client name').inputValue(), (v) => v !== '')).toBe('Halyard Marine Radio Works');
  await check(page, '11-client-form');
  await nav.getByRole('link', { name: 'Devices' }).click();
  await page.getByRole('link', { name: /^Change / }).first().click();
  await page.getByRole('heading', { name: 'Change device' }).waitFor();
  expect(await until(() => page.getByLabel('Model').inputValue(), (v) => v !== '')).not.toBe('');
  await page.getByLabel('Firmware').fill(`2.4.${RUN}`);
  await check(page, '12-device-edit');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await page.getByRole('heading', { name: 'Devices under test' }).waitFor();
  await signOut(page);

  // The invitee accepts, lands on the bench board as an engineer, and signs in again later.
  await page.goto(acceptUrl);
  await page.getByText(`${LAB_NAME} invites ${INVITEE} to join as Test engineer.`).waitFor();
  await page.getByLabel('Your name').fill('Nadia Brennan');
  await page.getByLabel('Password').fill(INVITEE_PASSWORD);
  await check(page, '13-accept-invitation');
  await page.getByRole('button', { name: 'Accept the invitation' }).click();
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();
  await page.getByRole('button', { name: /Account menu: Nadia Brennan/ }).waitFor();
  // An engineer's navigation has no settings, and the settings route sends them home.
  await expect(nav.getByRole('link', { name: 'Settings' }).count()).resolves.toBe(0);
  await nav.getByRole('link', { name: 'Equipment' }).waitFor();
  await page.goto(`${BASE}/settings/api-keys`);
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();
  await signOut(page);
  await signInAs(page, INVITEE, INVITEE_PASSWORD);
  await page.getByRole('button', { name: /Account menu: Nadia Brennan/ }).waitFor();
  await signOut(page);

  // A password reset: the e-mail arrives, the link sets a new password, the old one stops working.
  await page.goto(`${BASE}/password-reset`);
  await page.getByLabel('E-mail').fill(INVITEE);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await page.getByText(/If an account uses this address, a link to reset its password is on its way/).waitFor();
  await check(page, '14-password-reset-request');
  const reset = await mailTo(INVITEE, /password/i);
  const resetUrl = reset.text.match(/http:\/\/127\.0\.0\.1:\d+\/password-reset\/[A-Za-z0-9_-]{43}/)![0];
  await page.goto(resetUrl);
  await page.getByLabel('New password', { exact: true }).fill(NEW_PASSWORD);
  await page.getByLabel('Repeat the new password').fill(NEW_PASSWORD);
  await check(page, '15-password-reset-complete');
  await page.getByRole('button', { name: 'Set the new password' }).click();
  await page.getByText(/Your password has been changed/).waitFor();
  await page.goto(`${BASE}/sign-in`);
  await page.getByLabel('E-mail').fill(INVITEE);
  await page.getByLabel('Password').fill(INVITEE_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByText('The e-mail address or password is not right.').waitFor();
  await signInAs(page, INVITEE, NEW_PASSWORD);
  await signOut(page);

  // A new lab signs up and is its own administrator at once.
  const labName = `Tidewater EMC Laboratory ${RUN}`;
  await page.goto(`${BASE}/sign-up`);
  await page.getByLabel('Lab name').fill(labName);
  await page.getByLabel('Postal address').fill('Unit 4, Slipway Yard\nFalmouth TR11 3XX\nUnited Kingdom');
  await page.getByLabel('Your name').fill('Rowan Achebe');
  await page.getByLabel('E-mail').fill(`rowan.${RUN}@tidewater-emc.example`);
  await page.getByLabel('Password').fill('slipway tide 42 falmouth');
  await check(page, '16-sign-up');
  await page.getByRole('button', { name: 'Create the lab' }).click();
  await page.getByRole('heading', { name: 'Bench board' }).waitFor();
  await expect(page.locator('sc-organization-switcher').textContent()).resolves.toContain(labName);
  await page.getByText('No runs yet.').waitFor();
  await nav.getByRole('link', { name: 'Settings' }).waitFor();

  expect(accessibilityProblems).toEqual([]);
  expect(b.outsideRequests).toEqual([]);
});
