/**
 * Access tokens: short-lived HS256 JWTs carrying the user's memberships. Refresh tokens: random,
 * stored as SHA-256 hashes, rotated on every use; presenting a rotated token again revokes its
 * whole family (the usual defence against a stolen refresh token).
 */
import crypto from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Sequelize, Transaction } from 'sequelize';
import { Op, QueryTypes } from 'sequelize';
import { RefreshToken, User } from '../db/models';
import { preparedRows } from '../db/prepared-query';
import type { Principal } from '../http/route';
import { ROLES } from '../../shared/access/roles';
import { unauthorized } from '../http/problem';

export interface TokenSettings {
  secret: string;
  accessTtlSeconds: number;
  refreshTtlSeconds: number;
}

export const JWT_ISSUER = 'sidecheck';
export const JWT_AUDIENCE = 'sidecheck-api';

/**
 * The person with each organization they belong to (by name) and their roles there (in the order
 * of ROLES), in one statement: users, memberships and organizations have no row-level security.
 */
const PRINCIPAL = `
SELECT u.id, u.email, u.display_name AS "displayName",
       coalesce((SELECT json_agg(json_build_object('organizationId', o.id, 'organizationName', o.name, 'kind', o.kind,
                                                   'roles', (SELECT json_agg(m.role) FROM memberships m WHERE m.user_id = u.id AND m.organization_id = o.id)))
                   FROM organizations o WHERE o.id IN (SELECT organization_id FROM memberships WHERE user_id = u.id)), '[]'::json) AS memberships
  FROM users u WHERE u.id = $1::uuid`;

type PrincipalRow = { id: string; email: string; displayName: string; memberships: (Principal['memberships'][number] & { organizationName: string })[] };

function principalOf(row: PrincipalRow | undefined): Principal | null {
  if (!row) return null;
  return {
    userId: row.id,
    email: row.email,
    displayName: row.displayName,
    memberships: row.memberships
      // The name lets the client's organization switcher show names instead of ids.
      .sort((a, b) => a.organizationName.localeCompare(b.organizationName))
      .map((m) => ({ ...m, roles: m.roles.slice().sort((a, b) => ROLES.indexOf(a) - ROLES.indexOf(b)) })),
  };
}

/**
 * The person with their organizations and roles, or null. In `transaction` when given (as a
 * prepared statement, written at once: `thenCommit` makes it the transaction's last, see
 * db/prepared-query.ts), else on its own.
 */
export async function loadPrincipal(userId: string, transaction?: Transaction, options: { thenCommit?: boolean } = {}): Promise<Principal | null> {
  const rows = transaction
    ? await preparedRows<PrincipalRow>(transaction, PRINCIPAL, [userId], options)
    : await User.sequelize!.query<PrincipalRow>(PRINCIPAL, { bind: [userId], type: QueryTypes.SELECT });
  return principalOf(rows[0]);
}

/**
 * The HS256 key as a KeyObject, made once per secret, for signing here and verifying in
 * auth/passport.ts: given a string, jsonwebtoken first tries to parse it as a private or public
 * key on every call and throws (about 0.7 ms a signature, 1 ms a verification under load).
 */
const secretKeys = new Map<string, crypto.KeyObject>();
export function secretKeyOf(secret: string): crypto.KeyObject {
  let key = secretKeys.get(secret);
  if (!key) secretKeys.set(secret, (key = crypto.createSecretKey(Buffer.from(secret, 'utf8'))));
  return key;
}

export function signAccessToken(principal: Principal, settings: TokenSettings): string {
  return jwt.sign(
    { name: principal.displayName, email: principal.email, orgs: principal.memberships },
    secretKeyOf(settings.secret),
    { algorithm: 'HS256', subject: principal.userId, expiresIn: settings.accessTtlSeconds, issuer: JWT_ISSUER, audience: JWT_AUDIENCE },
  );
}

function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}

/** A new refresh token: what the client keeps, and the row that keeps its hash. */
function newRefreshToken(userId: string, settings: TokenSettings, familyId: string = crypto.randomUUID()) {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, row: { userId, familyId, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + settings.refreshTtlSeconds * 1000) } };
}

export async function issueRefreshToken(userId: string, settings: TokenSettings, familyId?: string, transaction?: Transaction): Promise<string> {
  const { token, row } = newRefreshToken(userId, settings, familyId);
  await RefreshToken.create(row, { transaction });
  return token;
}

/** issueRefreshToken as one statement written in `transaction` now: the token, and the promise of its row. */
export function writeRefreshToken(transaction: Transaction, userId: string, settings: TokenSettings): { token: string; written: Promise<unknown> } {
  const { token, row } = newRefreshToken(userId, settings);
  const written = preparedRows(transaction, 'INSERT INTO refresh_tokens (user_id, family_id, token_hash, expires_at) VALUES ($1::uuid, $2::uuid, $3::text, $4::timestamptz)', [
    row.userId,
    row.familyId,
    row.tokenHash,
    row.expiresAt,
  ]);
  return { token, written };
}

/** Exchange a refresh token for a new one; reuse of a rotated token revokes the family. */
export async function rotateRefreshToken(sequelize: Sequelize, token: string, settings: TokenSettings): Promise<{ userId: string; refreshToken: string }> {
  // The outcome is decided inside the transaction but thrown after it commits, so that revoking a
  // family on reuse is kept rather than rolled back with the error.
  const outcome = await sequelize.transaction(async (transaction) => {
    const row = await RefreshToken.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
    const now = new Date();
    if (!row || row.revokedAt || row.expiresAt < now) return { kind: 'ended' as const };
    if (row.rotatedAt) {
      await RefreshToken.update({ revokedAt: now }, { where: { familyId: row.familyId, revokedAt: { [Op.is]: null } }, transaction });
      return { kind: 'reused' as const };
    }
    await row.update({ rotatedAt: now }, { transaction });
    const refreshToken = await issueRefreshToken(row.userId, settings, row.familyId, transaction);
    return { kind: 'rotated' as const, userId: row.userId, refreshToken };
  });
  if (outcome.kind === 'ended') throw unauthorized('Your session has ended. Sign in again.');
  if (outcome.kind === 'reused') throw unauthorized('This sign-in was used twice, so every session from it has been closed. Sign in again.');
  return { userId: outcome.userId, refreshToken: outcome.refreshToken };
}

export async function revokeAllRefreshTokens(userId: string, transaction?: Transaction): Promise<number> {
  const [count] = await RefreshToken.update({ revokedAt: new Date() }, { where: { userId, revokedAt: { [Op.is]: null } }, transaction });
  return count;
}

export async function revokeRefreshToken(token: string): Promise<void> {
  await RefreshToken.update({ revokedAt: new Date() }, { where: { tokenHash: hashToken(token), revokedAt: { [Op.is]: null } } });
}
