/**
 * Access tokens: short-lived HS256 JWTs carrying the user's memberships. Refresh tokens: random,
 * stored as SHA-256 hashes, rotated on every use; presenting a rotated token again revokes its
 * whole family (the usual defence against a stolen refresh token).
 */
import crypto from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Sequelize, Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { Membership, Organization, RefreshToken, User } from '../db/models';
import type { Principal } from '../http/route';
import type { Role } from '../../shared/access/roles';
import { unauthorized } from '../http/problem';

export interface TokenSettings {
  secret: string;
  accessTtlSeconds: number;
  refreshTtlSeconds: number;
}

export const JWT_ISSUER = 'sidecheck';
export const JWT_AUDIENCE = 'sidecheck-api';

export async function loadPrincipal(userId: string, transaction?: Transaction): Promise<Principal | null> {
  const user = await User.findByPk(userId, { transaction });
  if (!user) return null;
  const memberships = await Membership.findAll({ where: { userId }, transaction });
  const orgIds = [...new Set(memberships.map((m) => m.organizationId))];
  const orgs = await Organization.findAll({ where: { id: orgIds }, transaction });
  return {
    userId: user.id,
    email: user.email,
    displayName: user.displayName,
    memberships: orgs
      .sort((a, b) => a.name.localeCompare(b.name))
      .map((org) => ({
        organizationId: org.id,
        // The name lets the client's organization switcher show names instead of ids.
        organizationName: org.name,
        kind: org.kind,
        roles: memberships.filter((m) => m.organizationId === org.id).map((m) => m.role as Role),
      })),
  };
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

export async function issueRefreshToken(userId: string, settings: TokenSettings, familyId: string = crypto.randomUUID(), transaction?: Transaction): Promise<string> {
  const token = crypto.randomBytes(32).toString('base64url');
  await RefreshToken.create(
    { userId, familyId, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + settings.refreshTtlSeconds * 1000) },
    { transaction },
  );
  return token;
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
