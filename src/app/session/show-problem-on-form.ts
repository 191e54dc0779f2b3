import { FormArray, FormGroup, type AbstractControl } from '@angular/forms';
import { problemFieldErrors, problemMessage } from './problem-message';

/** The error key a server's field message is stored under on a control; templates show `control.getError('server')`. */
export const SERVER_ERROR = 'server';

/**
 * Shows a refused save on the form itself: each field error of a 422 (problem+json `errors:
 * [{pointer, message}]`, RFC 9457, pointers per RFC 6901) is set on the form control it names as
 * `{ server: message }` (its first letter capitalised: the server writes `must …` after the pointer)
 * and the control is marked touched, so its mat-error shows the server's
 * words even when the value looked valid in the browser. A pointer is followed segment by segment
 * (array indices included) and, when it goes deeper than the form (`/addressLines/6` on a one-line
 * text control), the nearest control above it takes the message. Only single controls take one:
 * an error that names no control of this form, or only a group, stays for the banner.
 *
 * @param form the form (group) the request body was built from
 * @param error what the HTTP call failed with
 * @param renames body field names that the form calls otherwise, e.g. `{ addressLines: 'address' }`
 * @returns the banner text: the problem's own sentence when an error names no control of the form
 *   (or the problem has no field errors at all), else a short note pointing at the marked fields
 * @example showProblemOnForm(form, error, { addressLines: 'address' }) // sets form.controls.address's error
 */
export function showProblemOnForm(form: AbstractControl, error: unknown, renames: Record<string, string> = {}): string {
  const errors = Object.entries(problemFieldErrors(error));
  const marked = new Set<AbstractControl>();
  let unplaced = 0;
  for (const [pointer, message] of errors) {
    const control = controlAt(form, pointer, renames);
    if (!control) {
      unplaced++;
      continue;
    }
    // The first message for a control stays (two pointers below one text field, e.g. two address lines).
    if (!marked.has(control)) control.setErrors({ ...(control.errors ?? {}), [SERVER_ERROR]: message.charAt(0).toUpperCase() + message.slice(1) });
    control.markAsTouched();
    marked.add(control);
  }
  const shown = marked.size;
  if (shown === 0 || unplaced > 0) return problemMessage(error);
  return shown === 1 ? 'Correct the field marked below and try again.' : `Correct the ${shown} fields marked below and try again.`;
}

/**
 * Removes every server message set by showProblemOnForm, recomputing each control's own validators,
 * so a new attempt is judged afresh. Call it before checking the form on submit.
 */
export function clearServerErrors(form: AbstractControl): void {
  if (form instanceof FormGroup || form instanceof FormArray) {
    for (const child of Object.values(form.controls) as AbstractControl[]) clearServerErrors(child);
    return;
  }
  if (form.hasError(SERVER_ERROR)) form.updateValueAndValidity();
}

/** The single control a JSON pointer names (RFC 6901: `~1` is `/`, `~0` is `~`), or its nearest one above; null for none. */
function controlAt(form: AbstractControl, pointer: string, renames: Record<string, string>): AbstractControl | null {
  if (!pointer.startsWith('/')) return null;
  const path = pointer
    .slice(1)
    .split('/')
    .map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'))
    .map((s) => renames[s] ?? s)
    .map((s) => (/^\d+$/.test(s) ? Number(s) : s));
  for (let depth = path.length; depth > 0; depth--) {
    const found = form.get(path.slice(0, depth));
    if (found) return found instanceof FormGroup || found instanceof FormArray ? null : found;
  }
  return null;
}
