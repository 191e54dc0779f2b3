import express, { type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import type { Role } from '../../shared/access/roles';
import { inTenant } from '../tenancy/tenant-transaction';
import { forbidden, notFound, unauthorized } from './problem';
import { isFileAnswer, type Principal, type RouteContext, type RouteDef } from './route';
import { validate } from './validation';
import { Membership } from '../db/models';
import { isUuid } from '../accounts/is-uuid';

export interface ApiKeyPrincipal {
  organizationId: string;
  keyId: string;
}

type AuthedRequest = Request & { principal?: Principal | null; tokenRejected?: boolean; apiKey?: ApiKeyPrincipal | null };

/** Work out who is calling and in which organization, or throw the problem that explains why not. */
export function resolveAccess(def: RouteDef, req: AuthedRequest): { organizationId: string | null; roles: Role[] } {
  const access = def.access;
  if (access.kind === 'public') return { organizationId: null, roles: [] };
  if (access.kind === 'member-or-api-key' && req.apiKey) return { organizationId: req.apiKey.organizationId, roles: [] };
  if (req.apiKey && !req.principal) throw forbidden('An API key can only save readings and upload files. Sign in for anything else.');
  const principal = req.principal;
  if (!principal) throw unauthorized(req.tokenRejected ? 'Your sign-in has expired or is not valid. Sign in again.' : 'Sign in to continue.');
  if (access.kind === 'signed-in') return { organizationId: null, roles: [] };
  const organizationId = req.header('x-organization-id') ?? principal.memberships[0]?.organizationId ?? null;
  const membership = principal.memberships.find((m) => m.organizationId === organizationId);
  // Someone else's organization answers exactly like one that does not exist.
  if (!membership) throw notFound('The organization');
  const allowed = membership.roles.filter((r) => access.roles.includes(r));
  if (allowed.length === 0) throw forbidden('Your role in this organization does not allow this action.');
  return { organizationId: membership.organizationId, roles: membership.roles };
}

/** Whether the route's access rule is a membership that the database must confirm (below). */
function needsMembership(def: RouteDef, req: AuthedRequest, organizationId: string | null): boolean {
  return (def.access.kind === 'member' || def.access.kind === 'member-or-api-key') && !!req.principal && !!organizationId;
}

/** The roles held now, from the database; throws the problem when they no longer allow the route. */
function confirmRoles(def: RouteDef, held: Role[] | null, claimed: Role[]): Role[] {
  if (held === null) return claimed;
  if (held.length === 0) throw notFound('The organization');
  const access = def.access as { roles: readonly Role[] };
  if (!held.some((r) => access.roles.includes(r))) throw forbidden('Your role in this organization does not allow this action.');
  return held;
}

/**
 * The token's memberships decide quickly; the database has the last word, so a member removed or
 * given other roles loses access at once rather than when the access token expires. For a route
 * in a tenant transaction the check is the transaction's first statement, together with the
 * tenant setting (server/tenancy/tenant-transaction.ts); for the others it is a query of its own.
 */
async function rolesOutsideTransaction(def: RouteDef, req: AuthedRequest, claimed: { organizationId: string | null; roles: Role[] }): Promise<Role[]> {
  if (!needsMembership(def, req, claimed.organizationId)) return claimed.roles;
  const rows = await Membership.findAll({ where: { userId: req.principal!.userId, organizationId: claimed.organizationId! }, attributes: ['role'] });
  return confirmRoles(def, rows.map((r) => r.role as Role), claimed.roles);
}

function send(res: Response, value: unknown, status: number): void {
  if (isFileAnswer(value)) {
    res
      .status(status)
      .type(value.contentType)
      .set('Content-Disposition', `${value.disposition ?? 'attachment'}; filename="${value.filename.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
      .send(value.body);
    return;
  }
  if (value === undefined) {
    res.status(status === 200 ? 204 : status).end();
    return;
  }
  res.status(status).json(value);
}

/**
 * A record's id in the path (`:id`, `:caseId`, `:userId` ...) that is not a UUID names no record:
 * 404 before any query, as PostgreSQL's refusal of a malformed uuid was answered (and a NUL byte,
 * which PostgreSQL refuses in any text, never reaches it).
 */
function refuseMalformedIds(params: Record<string, string>): void {
  for (const [name, value] of Object.entries(params)) {
    if ((name === 'id' || name.endsWith('Id')) && !isUuid(value)) throw notFound('The requested record');
  }
}

/** Mount route definitions: access check, schema, one tenant transaction, answer after commit. */
export function buildRouter(sequelize: Sequelize, routes: RouteDef[]): express.Router {
  const router = express.Router();
  for (const def of routes) {
    router[def.method](def.path, async (req: AuthedRequest, res: Response) => {
      const claimed = resolveAccess(def, req);
      refuseMalformedIds(req.params as Record<string, string>);
      const { organizationId } = claimed;
      let status = def.method === 'post' ? 201 : 200;
      const context = (transaction: RouteContext['transaction'], roles: Role[], body: unknown): RouteContext => ({
        req,
        res,
        principal: req.principal ?? null,
        organizationId,
        roles,
        transaction,
        params: req.params as Record<string, string>,
        query: req.query as Record<string, unknown>,
        body,
        status: (code: number) => {
          status = code;
        },
      });
      const readBody = () => (def.bodySchema ? validate(def.bodySchema, req.body) : req.body);
      let value: unknown;
      if (def.transaction === 'none') {
        const roles = await rolesOutsideTransaction(def, req, claimed);
        value = await def.handler(context(null, roles, readBody()));
      } else {
        const memberId = needsMembership(def, req, organizationId) ? req.principal!.userId : null;
        value = await inTenant(sequelize, organizationId, (t, held) => def.handler(context(t, confirmRoles(def, held, claimed.roles), readBody())), memberId);
      }
      if (!res.headersSent) send(res, value, status);
    });
  }
  return router;
}
