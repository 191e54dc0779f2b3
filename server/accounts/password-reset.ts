/**
 * Password reset by e-mail: a request always answers the same (so it never tells whether an
 * account exists) and mails a one-hour, single-use link only when it does; completing it sets the
 * new password, spends every open link of the person and signs them out everywhere.
 */
import { Op, type Transaction } from 'sequelize';
import { AuditEntry, PasswordReset, User } from '../db/models';
import { notFound, validationFailed } from '../http/problem';
import { hashPassword, passwordProblems } from '../auth/password';
import { revokeAllRefreshTokens } from '../auth/tokens';
import { passwordResetEmail } from '../../templates/email/password-reset';
import type { AccountDeps } from './account-deps';
import { findUserByEmail } from './find-user-by-email';
import { clearAccountFailures } from './sign-in-limiter';
import { createSingleUseToken, hashSingleUseToken, SINGLE_USE_TOKEN_PATTERN } from './single-use-token';
import { tokenGone } from './token-gone';

export const RESET_VALID_MINUTES = 60;
/** More requests than this per account and hour send no further mail (no mail-bombing a person). */
const MAX_RESET_MAILS_PER_HOUR = 5;

/** Mail a reset link when the account exists; silent otherwise. Runs in the caller's transaction. */
export async function requestPasswordReset(deps: AccountDeps, transaction: Transaction | null, email: string): Promise<void> {
  const user = await findUserByEmail(email, transaction);
  if (!user) return;
  const recent = await PasswordReset.count({ where: { userId: user.id, createdAt: { [Op.gt]: new Date(Date.now() - 3600_000) } }, transaction: transaction ?? undefined });
  if (recent >= MAX_RESET_MAILS_PER_HOUR) return;
  const { token, tokenHash } = createSingleUseToken();
  await PasswordReset.create({ userId: user.id, tokenHash, expiresAt: new Date(Date.now() + RESET_VALID_MINUTES * 60_000) }, { transaction: transaction ?? undefined });
  await AuditEntry.create({ organizationId: null, userId: user.id, action: 'password-reset-request', entity: 'user', entityId: user.id }, { transaction: transaction ?? undefined });
  const mail = passwordResetEmail({ name: user.displayName, resetUrl: `${deps.publicUrl}/password-reset/${token}`, validMinutes: RESET_VALID_MINUTES });
  await deps.mail.enqueue(transaction, { to: user.email, ...mail });
}

/** Set the new password from a reset link. Throws 422 (weak), 404 (unknown link), 410 (used, expired). */
export async function completePasswordReset(deps: AccountDeps, token: string, password: string): Promise<void> {
  const weak = passwordProblems(password);
  if (weak) throw validationFailed(`The password is too weak: ${weak}`, [{ pointer: '/password', message: weak }]);
  if (!SINGLE_USE_TOKEN_PATTERN.test(token)) throw notFound('This password reset link');
  const passwordHash = await hashPassword(password);
  const outcome = await deps.sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({ where: { tokenHash: hashSingleUseToken(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!reset) return { kind: 'unknown' as const };
    if (reset.usedAt) return { kind: 'used' as const };
    if (reset.expiresAt.getTime() <= Date.now()) return { kind: 'expired' as const };
    const user = (await User.findByPk(reset.userId, { transaction }))!;
    await user.update({ passwordHash }, { transaction });
    // Every open link of the person dies with this one.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction });
    const sessions = await revokeAllRefreshTokens(user.id, transaction);
    await AuditEntry.create({ organizationId: null, userId: user.id, action: 'password-reset', entity: 'user', entityId: user.id, after: { revokedSessions: sessions } }, { transaction });
    return { kind: 'done' as const, email: user.email };
  });
  if (outcome.kind === 'unknown') throw notFound('This password reset link');
  if (outcome.kind === 'used') throw tokenGone('This password reset link has already been used. Ask for a new one if you still need it.', 'reset-used');
  if (outcome.kind === 'expired') throw tokenGone(`This password reset link has expired (links work for ${RESET_VALID_MINUTES} minutes). Ask for a new one.`, 'reset-expired');
  await clearAccountFailures(deps.sequelize, outcome.email);
}
