import { HttpErrorResponse } from '@angular/common/http';

interface ProblemBody {
  title?: string;
  detail?: string;
  errors?: { pointer: string; message: string }[];
}

/** A sentence a person can act on, from a problem+json answer or a network failure. */
export function problemMessage(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    if (error.status === 0) return 'Sidecheck cannot be reached. Check your connection and try again.';
    const body = error.error as ProblemBody | null;
    if (body && typeof body === 'object' && body.detail) return body.detail;
    if (error.status >= 500) return 'Something went wrong on our side. Try again in a moment.';
    return error.message;
  }
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/** Field errors from a 422, keyed by JSON pointer, for showing beside form fields. */
export function problemFieldErrors(error: unknown): Record<string, string> {
  if (!(error instanceof HttpErrorResponse)) return {};
  const body = error.error as ProblemBody | null;
  return Object.fromEntries((body?.errors ?? []).map((e) => [e.pointer, e.message]));
}
