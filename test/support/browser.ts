/** Debian's Chromium through playwright-core, with a guard that fails on any request beyond 127.0.0.1. */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { ROOT } from './processes';

export const SCREENSHOT_DIR = path.join(ROOT, 'artifacts', 'screenshots');

export interface Browser {
  context: BrowserContext;
  page: Page;
  outsideRequests: string[];
  consoleErrors: string[];
  screenshot(name: string): Promise<void>;
  close(): Promise<void>;
}

export async function openBrowser(): Promise<Browser> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-chromium-'));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    acceptDownloads: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const outsideRequests: string[] = [];
  const consoleErrors: string[] = [];
  context.on('request', (req) => {
    const url = new URL(req.url());
    if (!['data:', 'blob:', 'about:'].includes(url.protocol) && url.hostname !== '127.0.0.1') outsideRequests.push(req.url());
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.on('console', (msg) => msg.type() === 'error' && consoleErrors.push(msg.text()));
  return {
    context,
    page,
    outsideRequests,
    consoleErrors,
    screenshot: async (name) => {
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: false });
    },
    close: async () => {
      await context.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
