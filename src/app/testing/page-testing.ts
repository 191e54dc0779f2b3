import type { ComponentFixture } from '@angular/core/testing';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

/**
 * Small helpers for the client's page specs (jsdom): find by visible text, type into a named field,
 * and answer a request with a problem+json body (RFC 9457) the way server/http/problem.ts does.
 * Test support only: nothing in the product imports this file.
 */

/** The visible text of an element with runs of white space collapsed. */
export function textOf(el: Element | null | undefined): string {
  return (el?.textContent ?? '').replace(/\s+/g, ' ').trim();
}

/** The first button (or link styled as one) whose text contains `label`; throws when there is none. */
export function buttonNamed(root: ParentNode, label: string): HTMLButtonElement {
  const found = [...root.querySelectorAll<HTMLButtonElement>('button, a')].find((b) => textOf(b).includes(label) || b.getAttribute('aria-label') === label);
  if (!found) throw new Error(`No button named “${label}”`);
  return found;
}

/** Set an input, textarea or select found by CSS selector and tell Angular's forms. */
export function typeInto(root: ParentNode, selector: string, value: string): void {
  const input = root.querySelector<HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement>(selector);
  if (!input) throw new Error(`No field ${selector}`);
  input.value = value;
  input.dispatchEvent(new Event('input'));
  input.dispatchEvent(new Event('change'));
  input.dispatchEvent(new Event('blur'));
}

/** Submit the first form under root (or the one matching selector). */
export function submit(root: ParentNode, selector = 'form'): void {
  const form = root.querySelector<HTMLFormElement>(selector);
  if (!form) throw new Error(`No form ${selector}`);
  form.dispatchEvent(new Event('submit'));
}

/** The texts of the alerts on the page (error banners are role="alert"). */
export function alerts(root: ParentNode): string[] {
  return [...root.querySelectorAll('[role="alert"]')].map(textOf);
}

/** A problem+json body as server/http/problem.ts writes it, with the status options for flush(). */
export function problem(status: number, detail: string, errors?: { pointer: string; message: string }[]): [object, { status: number; statusText: string; headers: Record<string, string> }] {
  return [{ type: 'about:blank', title: 'Refused', status, detail, ...(errors ? { errors } : {}) }, { status, statusText: 'Refused', headers: { 'Content-Type': 'application/problem+json' } }];
}

/** Let pending promise chains (an awaited request, then navigation) run, then wait for Angular to render. */
export async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve, 0));
  await fixture.whenStable();
}

/** The text input (or textarea) of the form field labelled `label` (exact text or pattern). */
export async function inputLabelled(loader: HarnessLoader, label: string | RegExp): Promise<MatInputHarness> {
  const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const control = await field.getControl(MatInputHarness);
  if (!control) throw new Error(`The field “${label}” has no text input`);
  return control;
}

/** The error texts under the form field labelled `label`. */
export async function errorsOf(loader: HarnessLoader, label: string | RegExp): Promise<string[]> {
  return (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getTextErrors();
}
