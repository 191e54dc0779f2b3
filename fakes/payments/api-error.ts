import type { Json, JsonObject } from './api-objects';

/** Error types of the API's error object (`error.type`), as the SDK switches on them. */
export type ApiErrorType =
  'api_error' | 'card_error' | 'idempotency_error' | 'invalid_request_error';

/**
 * An expected API failure: HTTP status plus the body `{ error: { type, message, code, param,
 * decline_code, … } }`. Absent members are left out of the body, as the real API does.
 * The SDK maps by status: 400/404 → StripeInvalidRequestError (400 idempotency_error →
 * StripeIdempotencyError), 401 → StripeAuthenticationError, 402 → StripeCardError.
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly details: {
      code?: string;
      param?: string;
      decline_code?: string;
      extra?: JsonObject;
    } = {},
  ) {
    super(message);
  }

  /** The JSON body to send. */
  toBody(): { error: JsonObject } {
    const error: JsonObject = { type: this.type, message: this.message };
    const { code, param, decline_code: declineCode, extra } = this.details;
    if (code !== undefined) error['code'] = code;
    if (param !== undefined) error['param'] = param;
    if (declineCode !== undefined) error['decline_code'] = declineCode;
    for (const [key, value] of Object.entries(extra ?? {})) error[key] = value as Json;
    return { error };
  }
}

/** 400 for a malformed or inconsistent parameter. @example invalidParam('amount', 'Invalid integer: x') */
export function invalidParam(param: string, message: string, code?: string): ApiError {
  return new ApiError(400, 'invalid_request_error', message, { param, code });
}

/** 400 "Missing required param: x." (wording from memory). */
export function missingParam(param: string): ApiError {
  return new ApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, {
    param,
    code: 'parameter_missing',
  });
}

/**
 * "No such customer: 'cus_x'" with code resource_missing: 404 when the id is in the URL, 400 when
 * it came in a parameter (the real API's split, from memory).
 */
export function noSuch(kind: string, id: string, options: { param?: string } = {}): ApiError {
  return new ApiError(
    options.param ? 400 : 404,
    'invalid_request_error',
    `No such ${kind}: '${id}'`,
    {
      code: 'resource_missing',
      param: options.param ?? 'id',
    },
  );
}

/** 401 with the message the API gives for a bad key; the key is masked but for its end. */
export function authenticationFailed(presentedKey: string | null): ApiError {
  const message =
    presentedKey === null
      ? "You did not provide an API key. Send it in the Authorization header as 'Bearer <secret key>'."
      : `Invalid API Key provided: ${presentedKey.slice(0, 8)}${'*'.repeat(Math.max(0, presentedKey.length - 12))}${presentedKey.slice(-4)}`;
  return new ApiError(401, 'invalid_request_error', message);
}

/** 400 idempotency_error: a key reused with different parameters. */
export function idempotencyMismatch(key: string): ApiError {
  return new ApiError(
    400,
    'idempotency_error',
    `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
  );
}
