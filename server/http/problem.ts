/**
 * One error vocabulary for the API: problem+json (RFC 9457) with a stable `code` the client can
 * switch on and a `detail` a person can act on.
 */
export interface FieldError {
  /** JSON pointer to the offending field, e.g. "/ratedPepW". */
  pointer: string;
  message: string;
}

export class Problem extends Error {
  readonly status: number;
  readonly code: string;
  readonly title: string;
  readonly errors?: FieldError[];
  readonly headers?: Record<string, string>;

  constructor(options: { status: number; code: string; title: string; detail: string; errors?: FieldError[]; headers?: Record<string, string> }) {
    super(options.detail);
    this.status = options.status;
    this.code = options.code;
    this.title = options.title;
    this.errors = options.errors;
    this.headers = options.headers;
  }

  toJSON(instance?: string) {
    return {
      type: `https://sidecheck.test/problems/${this.code}`,
      title: this.title,
      status: this.status,
      detail: this.message,
      code: this.code,
      ...(instance ? { instance } : {}),
      ...(this.errors ? { errors: this.errors } : {}),
    };
  }
}

export const notFound = (what: string) =>
  new Problem({ status: 404, code: 'not-found', title: 'Not found', detail: `${what} was not found.` });

export const validationFailed = (detail: string, errors?: FieldError[]) =>
  new Problem({ status: 422, code: 'validation-failed', title: 'Some values need attention', detail, errors });

export const badRequest = (detail: string) =>
  new Problem({ status: 400, code: 'bad-request', title: 'Bad request', detail });

export const unauthorized = (detail = 'Sign in to continue.') =>
  new Problem({ status: 401, code: 'unauthorized', title: 'Not signed in', detail, headers: { 'WWW-Authenticate': 'Bearer' } });

export const forbidden = (detail: string) =>
  new Problem({ status: 403, code: 'forbidden', title: 'Not allowed', detail });

export const conflict = (detail: string, options: { code?: string } = {}) =>
  new Problem({ status: 409, code: options.code ?? 'conflict', title: 'Conflict', detail });

export const payloadTooLarge = (detail: string) =>
  new Problem({ status: 413, code: 'payload-too-large', title: 'Too large', detail });

export const unsupportedMediaType = (detail: string) =>
  new Problem({ status: 415, code: 'unsupported-media-type', title: 'Unsupported file type', detail });

export const tooManyRequests = (detail: string, retryAfterSeconds: number) =>
  new Problem({ status: 429, code: 'too-many-requests', title: 'Too many attempts', detail, headers: { 'Retry-After': String(retryAfterSeconds) } });

export const serviceUnavailable = (detail: string) =>
  new Problem({ status: 503, code: 'service-unavailable', title: 'Temporarily unavailable', detail, headers: { 'Retry-After': '5' } });
