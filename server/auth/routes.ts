import type { Sequelize } from 'sequelize';
import type { Request, Response } from 'express';
import { User } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { unauthorized } from '../http/problem';
import { signInSchema, type SignInBody } from '../../shared/schemas/auth';
import { asSystem } from '../tenancy/tenant-transaction';
import { AuditEntry } from '../db/models';
import { DUMMY_HASH, verifyPassword } from './password';
import { issueRefreshToken, loadPrincipal, revokeAllRefreshTokens, revokeRefreshToken, rotateRefreshToken, signAccessToken, writeRefreshToken, type TokenSettings } from './tokens';
import { clearAccountFailuresIn, recordSignInFailure, refuseThrottledSignIn } from '../accounts/sign-in-limiter';
import { allAnswered, preparedRows, writtenTogether } from '../db/prepared-query';
import type { Principal } from '../http/route';

export const REFRESH_COOKIE = 'sidecheck_refresh';

export interface AuthDeps {
  sequelize: Sequelize;
  tokens: TokenSettings;
  secureCookies: boolean;
}

/** What opening a session needs (sign-in, sign-up and invitation acceptance share it). */
export type SessionDeps = Pick<AuthDeps, 'tokens' | 'secureCookies'>;

function setRefreshCookie(res: Response, token: string, deps: SessionDeps): void {
  res.cookie(REFRESH_COOKIE, token, {
    httpOnly: true,
    secure: deps.secureCookies,
    sameSite: 'strict',
    path: '/api/auth',
    maxAge: deps.tokens.refreshTtlSeconds * 1000,
  });
}

function readRefreshCookie(req: Request): string | null {
  const value = (req.cookies as Record<string, string> | undefined)?.[REFRESH_COOKIE];
  return typeof value === 'string' && value.length > 0 && value.length < 200 ? value : null;
}

const AUDIT_SIGN_IN = `INSERT INTO audit_log (organization_id, user_id, action, entity, entity_id, after) VALUES (NULL, $1::uuid, 'sign-in', 'user', $1::text, $2::jsonb)`;

/** What sign-in, refresh and sign-up answer: the access token, its lifetime, the person. */
function sessionAnswer(principal: Principal, deps: SessionDeps) {
  return { accessToken: signAccessToken(principal, deps.tokens), expiresIn: deps.tokens.accessTtlSeconds, user: principal };
}

async function session(userId: string, deps: SessionDeps) {
  const principal = await loadPrincipal(userId);
  if (!principal) throw unauthorized();
  return sessionAnswer(principal, deps);
}

/** Set a new refresh cookie for the user and answer like sign-in: access token, lifetime, the person. */
export async function openSession(res: Response, userId: string, deps: SessionDeps) {
  setRefreshCookie(res, await issueRefreshToken(userId, deps.tokens), deps);
  return session(userId, deps);
}

export function authRoutes(deps: AuthDeps): RouteDef[] {
  return [
    route<SignInBody>({
      method: 'post',
      path: '/auth/sign-in',
      summary: 'Sign in with e-mail and password; sets the refresh cookie',
      access: { kind: 'public' },
      bodySchema: signInSchema,
      transaction: 'none',
      async handler(ctx) {
        const address = ctx.req.ip ?? 'unknown';
        await refuseThrottledSignIn(deps.sequelize, ctx.body.email, address);
        const user = await User.findOne({ where: deps.sequelize.where(deps.sequelize.fn('lower', deps.sequelize.col('email')), ctx.body.email.toLowerCase()) });
        const ok = await verifyPassword(user?.passwordHash ?? DUMMY_HASH, ctx.body.password);
        const audited = { email: ctx.body.email.slice(0, 254) };
        if (!user || !ok) {
          await asSystem(deps.sequelize, (t) =>
            AuditEntry.create({ organizationId: null, userId: user?.id ?? null, action: 'sign-in-failed', entity: 'user', entityId: user?.id ?? null, after: audited }, { transaction: t }),
          );
          await recordSignInFailure(deps.sequelize, ctx.body.email, address);
          throw unauthorized('The e-mail address or password is not right.');
        }
        // Signed in: the audit entry, the account's failures forgotten, a new refresh token and the
        // person with their organizations, in one transaction whose statements leave together
        // (pipeline mode, db/prepared-query.ts): one round trip after START, where there were eight.
        const { refreshToken, principal } = await asSystem(deps.sequelize, async (t) => {
          // Written in this order: the person's statement takes the COMMIT behind it, so it goes last.
          const [refresh, answers] = writtenTogether(t, () => {
            const audit = preparedRows(t, AUDIT_SIGN_IN, [user.id, JSON.stringify(audited)]);
            const cleared = clearAccountFailuresIn(t, ctx.body.email);
            const refresh = writeRefreshToken(t, user.id, deps.tokens);
            const person = loadPrincipal(user.id, t, { thenCommit: true });
            return [refresh, allAnswered([audit, cleared, refresh.written, person] as const)] as const;
          });
          return { refreshToken: refresh.token, principal: (await answers)[3] };
        });
        if (!principal) throw unauthorized();
        setRefreshCookie(ctx.res, refreshToken, deps);
        ctx.status(200);
        return sessionAnswer(principal, deps);
      },
    }),
    route({
      method: 'post',
      path: '/auth/refresh',
      summary: 'Exchange the refresh cookie for a new access token (rotates the cookie)',
      access: { kind: 'public' },
      transaction: 'none',
      async handler(ctx) {
        const token = readRefreshCookie(ctx.req);
        if (!token) throw unauthorized('Your session has ended. Sign in again.');
        const rotated = await rotateRefreshToken(deps.sequelize, token, deps.tokens);
        setRefreshCookie(ctx.res, rotated.refreshToken, deps);
        ctx.status(200);
        return session(rotated.userId, deps);
      },
    }),
    route({
      method: 'post',
      path: '/auth/sign-out',
      summary: 'End this session (revokes the refresh cookie)',
      access: { kind: 'public' },
      transaction: 'none',
      async handler(ctx) {
        const token = readRefreshCookie(ctx.req);
        if (token) await revokeRefreshToken(token);
        ctx.res.clearCookie(REFRESH_COOKIE, { path: '/api/auth' });
        ctx.status(204);
        return undefined;
      },
    }),
    route({
      method: 'post',
      path: '/auth/sign-out-everywhere',
      summary: 'End every session of the signed-in person',
      access: { kind: 'signed-in' },
      transaction: 'none',
      async handler(ctx) {
        const revoked = await revokeAllRefreshTokens(ctx.principal!.userId);
        ctx.res.clearCookie(REFRESH_COOKIE, { path: '/api/auth' });
        ctx.status(200);
        return { revokedSessions: revoked };
      },
    }),
    route({
      method: 'get',
      path: '/me',
      summary: 'The signed-in person and their organizations',
      access: { kind: 'signed-in' },
      transaction: 'none',
      async handler(ctx) {
        return loadPrincipal(ctx.principal!.userId);
      },
    }),
  ];
}
