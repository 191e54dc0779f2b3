/**
 * Request pipeline step beside identify() (server/auth/passport.ts): a request carrying
 * `Authorization: ApiKey <key>` or `X-Api-Key: <key>` gets `req.apiKey = { organizationId, keyId }`
 * when the key is valid and not revoked. The router honours it only on routes of access kind
 * 'member-or-api-key' and refuses it everywhere else. A key that is presented but not valid is
 * refused at once (401), so a bench script learns at the first call that its key is wrong.
 */
import type { RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { badRequest, unauthorized } from '../http/problem';
import type { ApiKeyPrincipal } from '../http/router';
import { authenticateApiKey } from './authenticate-api-key';

/** The key presented by the request, or null when it presents none. */
export function presentedApiKey(headers: { authorization?: string; 'x-api-key'?: string | string[] }): string | null {
  const scheme = /^ApiKey\s+(\S+)\s*$/i.exec(headers.authorization ?? '');
  if (scheme) return scheme[1];
  const header = headers['x-api-key'];
  return typeof header === 'string' && header.length > 0 ? header.trim() : null;
}

export function identifyApiKey(sequelize: Sequelize): RequestHandler {
  return async (req, _res, next) => {
    const key = presentedApiKey(req.headers);
    if (key === null) return next();
    // A key and a person's token at once would leave unclear who acted; refuse rather than guess.
    if (/^Bearer\s/i.test(req.headers.authorization ?? '')) return next(badRequest('Send either a sign-in token or an API key, not both.'));
    const found = await authenticateApiKey(sequelize, key);
    if (!found) return next(unauthorized('The API key is not valid or has been revoked. Ask a lab administrator for a new one.'));
    (req as typeof req & { apiKey?: ApiKeyPrincipal }).apiKey = found;
    next();
  };
}
