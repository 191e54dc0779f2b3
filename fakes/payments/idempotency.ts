import type { RequestHandler, Response } from 'express';
import { ApiError, idempotencyMismatch } from './api-error';
import type { JsonObject } from './api-objects';
import type { PaymentsStore } from './store';

/** The API keeps idempotent results for 24 hours (from memory). */
const RETENTION_MS = 24 * 60 * 60 * 1000;

/**
 * Idempotent POSTs, following the API's documented rules (from memory):
 * - same `Idempotency-Key` and same parameters → the first response is replayed, status and
 *   body, with `Idempotent-Replayed: true`, and nothing is executed twice;
 * - same key with different parameters or path → 400 idempotency_error;
 * - same key while the first request still runs → 409 idempotency_error (the SDK retries 409);
 * - results are saved only once the endpoint has executed: 2xx and 402 card errors are saved,
 *   validation (400/404) and authentication failures are not.
 * Results are persisted with the state, so an SDK retry across a restart is still recognised.
 *
 * @param store - where results are kept.
 * @returns middleware for the /v1 router, after authentication and body parsing.
 * @example router.use(idempotency(store))
 */
export function idempotency(store: PaymentsStore): RequestHandler {
  const inFlight = new Set<string>();
  return (request, response, next) => {
    const key = request.get('idempotency-key');
    if (request.method !== 'POST' || !key) {
      next();
      return;
    }
    const fingerprint = `${request.method} ${request.baseUrl}${request.path} ${canonicalJson(request.body)}`;
    const saved = store.state.idempotency[key];
    if (saved && Date.now() - saved.createdAt < RETENTION_MS) {
      if (saved.fingerprint !== fingerprint) throw idempotencyMismatch(key);
      response.status(saved.status).set('Idempotent-Replayed', 'true').json(saved.body);
      return;
    }
    if (inFlight.has(key)) {
      throw new ApiError(
        409,
        'idempotency_error',
        `There is currently another in-progress request using this Idempotent Key: ${key}.`,
      );
    }
    inFlight.add(key);
    response.on('close', () => inFlight.delete(key));
    captureJson(response, (status, body) => {
      inFlight.delete(key);
      if (status >= 400 && status !== 402) return;
      store.mutate((state) => {
        const now = Date.now();
        for (const [old, record] of Object.entries(state.idempotency)) {
          if (now - record.createdAt >= RETENTION_MS) delete state.idempotency[old];
        }
        state.idempotency[key] = { fingerprint, status, body, createdAt: now };
      });
    });
    next();
  };
}

/** Calls `onJson` with the status and body whenever the handler answers through `res.json`. */
function captureJson(response: Response, onJson: (status: number, body: JsonObject) => void): void {
  const send = response.json.bind(response);
  response.json = ((body: JsonObject) => {
    onJson(response.statusCode, body);
    return send(body);
  }) as Response['json'];
}

/** JSON with object keys sorted, so parameter order does not change the fingerprint. */
function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (typeof value === 'object' && value !== null) {
    const entries = Object.entries(value).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}
