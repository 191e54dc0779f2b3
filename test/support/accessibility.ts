/** axe-core in the page under test: the serious and critical WCAG 2.x A/AA violations of the screen. */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { ROOT } from './processes';

const AXE_SOURCE = fs.readFileSync(path.join(ROOT, 'node_modules', 'axe-core', 'axe.min.js'), 'utf8');

interface AxeResult {
  violations: { id: string; impact: string | null; nodes: { target: string[] }[] }[];
}

/**
 * Runs axe-core (WCAG 2.0/2.1 A and AA rules and axe's best practices) on the page and lists each serious or critical
 * violation as "rule: selectors". The app's CSP refuses inline scripts, so axe is evaluated
 * through the DevTools protocol, which the CSP does not govern.
 */
export async function seriousAccessibilityViolations(page: Page): Promise<string[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(`${AXE_SOURCE}\n;true`);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<AxeResult> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'best-practice'] } });
    return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  });
}
