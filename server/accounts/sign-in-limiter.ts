/**
 * Sign-in throttling: at most 10 failed sign-ins per account and 50 per client address in any
 * 15 minutes (a sliding window); past that, sign-in answers 429 with Retry-After until enough
 * failures have aged out. The counts live in PostgreSQL (table sign_in_failures) so every API
 * process shares them. The limits follow common practice for online guessing defences (NIST SP
 * 800-63B 5.2.2 asks for rate limiting of failed attempts, at most 100 per account; from memory).
 *
 * An account that does not exist is counted like one that does, so the answer never tells which
 * e-mail addresses have accounts. A successful sign-in clears the account's count, not the
 * address's. Two attempts racing at the limit may both be counted; the window tolerates that.
 */
import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { preparedRows } from '../db/prepared-query';
import { tooManyRequests } from '../http/problem';

export const SIGN_IN_WINDOW_SECONDS = 15 * 60;
export const ACCOUNT_FAILURE_LIMIT = 10;
export const ADDRESS_FAILURE_LIMIT = 50;

const accountKey = (email: string) => `account:${email.trim().toLowerCase().slice(0, 254)}`;
const addressKey = (address: string) => `address:${address.slice(0, 100)}`;

/**
 * Seconds until the account and the address each drop below their limit of failures in the
 * window, or null when below already: for each, the limit-th most recent failure is the one that
 * must age out. Both in one statement.
 */
const SECONDS_LOCKED = `SELECT ${['account', 'address']
  .map(
    (who) => `(SELECT ceil(extract(epoch FROM (failed_at + make_interval(secs => :window)) - now()))
       FROM sign_in_failures WHERE key = :${who}Key AND failed_at > now() - make_interval(secs => :window)
      ORDER BY failed_at DESC OFFSET :${who}Offset LIMIT 1) AS ${who}`,
  )
  .join(',\n')}`;

const waitSeconds = (wait: string | null) => (wait === null ? 0 : Math.max(1, Number(wait)));

/** Throw 429 with Retry-After when the account or the address has failed too often recently. */
export async function refuseThrottledSignIn(sequelize: Sequelize, email: string, address: string): Promise<void> {
  const [locked] = await sequelize.query<{ account: string | null; address: string | null }>(SECONDS_LOCKED, {
    replacements: { window: SIGN_IN_WINDOW_SECONDS, accountKey: accountKey(email), accountOffset: ACCOUNT_FAILURE_LIMIT - 1, addressKey: addressKey(address), addressOffset: ADDRESS_FAILURE_LIMIT - 1 },
    type: QueryTypes.SELECT,
  });
  const account = waitSeconds(locked.account);
  const fromAddress = waitSeconds(locked.address);
  if (account > 0) {
    const minutes = Math.ceil(account / 60);
    throw tooManyRequests(`Too many failed sign-ins for this account. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, or reset your password.`, account);
  }
  if (fromAddress > 0) {
    const minutes = Math.ceil(fromAddress / 60);
    throw tooManyRequests(`Too many failed sign-ins from your network. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`, fromAddress);
  }
}

/** Count one failed sign-in against the account and the address. */
export async function recordSignInFailure(sequelize: Sequelize, email: string, address: string): Promise<void> {
  await sequelize.query(
    `INSERT INTO sign_in_failures (key) VALUES (:account), (:address);
     DELETE FROM sign_in_failures WHERE key IN (:account, :address) AND failed_at <= now() - make_interval(secs => :window);`,
    { replacements: { account: accountKey(email), address: addressKey(address), window: SIGN_IN_WINDOW_SECONDS } },
  );
  // Keys that never come back would stay forever; an occasional sweep keeps the table small.
  if (crypto.randomInt(100) === 0) {
    await sequelize.query('DELETE FROM sign_in_failures WHERE failed_at <= now() - make_interval(secs => :window)', { replacements: { window: SIGN_IN_WINDOW_SECONDS } });
  }
}

const CLEAR_ACCOUNT_FAILURES = 'DELETE FROM sign_in_failures WHERE key = $1';

/** Forget the account's failures after a successful sign-in or a password reset. */
export async function clearAccountFailures(sequelize: Sequelize, email: string): Promise<void> {
  await sequelize.query(CLEAR_ACCOUNT_FAILURES, { bind: [accountKey(email)] });
}

/** clearAccountFailures as a statement written in `transaction` now (pipelined with others, auth/routes.ts). */
export function clearAccountFailuresIn(transaction: Transaction, email: string): Promise<unknown> {
  return preparedRows(transaction, CLEAR_ACCOUNT_FAILURES, [accountKey(email)]);
}
