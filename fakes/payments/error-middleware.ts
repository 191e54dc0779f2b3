import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ApiError } from './api-error';

/**
 * Answers unknown /v1 paths the way the API does: 404 invalid_request_error "Unrecognized
 * request URL (GET: /v1/x)." (wording from memory).
 */
export const unknownApiRoute: RequestHandler = (request) => {
  throw new ApiError(
    404,
    'invalid_request_error',
    `Unrecognized request URL (${request.method}: ${request.originalUrl.split('?')[0]}).`,
  );
};

/**
 * Turns errors into the API's error body. ApiError → its status and body; a body the parser
 * rejected → 400; anything else is logged and answered 500 api_error with
 * `Stripe-Should-Retry: false` (a stand-in bug does not go away on retry, so the SDK must not
 * repeat the request).
 */
export const apiErrorMiddleware: ErrorRequestHandler = (
  error: unknown,
  request,
  response,
  _next,
) => {
  if (error instanceof ApiError) {
    response.status(error.status).json(error.toBody());
    return;
  }
  const status = (error as { status?: number }).status;
  if (status !== undefined && status >= 400 && status < 500) {
    const message = error instanceof Error ? error.message : 'Invalid request';
    response.status(400).json(new ApiError(400, 'invalid_request_error', message).toBody());
    return;
  }
  console.error(`[payments stand-in] ${request.method} ${request.originalUrl} failed`, error);
  response
    .status(500)
    .set('Stripe-Should-Retry', 'false')
    .json(
      new ApiError(
        500,
        'api_error',
        'An unexpected error occurred in the payments stand-in.',
      ).toBody(),
    );
};
