import type { Request } from 'express';

/**
 * The origin a client used to reach us, for absolute links in JSON.
 *
 * @param request - an Express request.
 * @returns e.g. 'http://127.0.0.1:1080' (the Host header as sent, 127.0.0.1 when missing).
 * @example requestOrigin(req) // 'http://127.0.0.1:41873'
 */
export function requestOrigin(request: Request): string {
  return `${request.protocol}://${request.get('host') ?? '127.0.0.1'}`;
}
