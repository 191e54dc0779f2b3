/**
 * Hot paths (the run list, the run workspace, saving a reading, the tenant check of every request)
 * send their SQL straight to the transaction's node-postgres connection as named prepared
 * statements: PostgreSQL parses and plans each text once per connection instead of on every
 * request (after five executions PostgreSQL keeps the generic plan when it costs no more than
 * planning anew, as for lookups by primary key), and no model instances are built for rows that
 * are only read. A statement whose best plan depends on its values (a run list with a search
 * pattern or several states) goes `unnamed`: planned for its values each time, still with
 * parameters and without Sequelize. Everything else goes through Sequelize models. Errors are wrapped as Sequelize's DatabaseError, so the error handler
 * answers them exactly like the rest (503 when the database is restarting, 404 for a malformed id).
 */
import crypto from 'node:crypto';
import { DatabaseError, type Transaction } from 'sequelize';

interface PgConnection {
  query(config: { name?: string; text: string; values?: unknown[] }): Promise<{ rows: Record<string, unknown>[] }>;
  /** node-postgres' wire connection; its socket can hold writes back (cork) and send them at once. */
  connection?: { stream?: { cork?(): void; uncork?(): void } };
}

/** The parts of Sequelize's Transaction used to finish it here (see `thenCommit`). */
interface OpenTransaction {
  connection?: PgConnection;
  finished?: string;
  _afterCommitHooks: ((t: Transaction) => unknown)[];
  cleanup(): void;
  forceCleanup(): Promise<void>;
}

const names = new Map<string, string>();

/** A statement name per SQL text (the same text always gets the same name). */
function nameOf(text: string): string {
  let name = names.get(text);
  if (!name) {
    name = `sc_${crypto.createHash('sha1').update(text).digest('hex').slice(0, 20)}`;
    names.set(text, name);
  }
  return name;
}

/** Until the end of the transaction, a named statement runs on its generic plan (preparedRows' `genericPlan`). */
const FORCE_GENERIC_PLAN = "SELECT set_config('plan_cache_mode', 'force_generic_plan', true)";

/** Transactions whose COMMIT is already written (thenCommit): a statement written after it would run outside them. */
const commitWritten = new WeakSet<Transaction>();

function connectionOf(transaction: Transaction): PgConnection {
  const connection = (transaction as unknown as OpenTransaction).connection;
  if (!connection) throw new Error('preparedRows needs a transaction with its connection');
  if (commitWritten.has(transaction)) throw new Error('a statement was written after its transaction\'s COMMIT (thenCommit must be the last)');
  return connection;
}

function asDatabaseError(error: unknown, text: string): DatabaseError {
  const e = error as Error & { sql?: string; parameters?: unknown[] };
  e.sql = text;
  return new DatabaseError(e as never);
}

/** Rows of a query already written, or its error as Sequelize's DatabaseError. */
async function rowsOf<T>(query: Promise<{ rows: Record<string, unknown>[] }>, text: string): Promise<T[]> {
  try {
    return (await query).rows as T[];
  } catch (error) {
    throw asDatabaseError(error, text);
  }
}

/**
 * Rows of `text` ($1, $2 ... placeholders) run in `transaction`, as a named prepared statement unless `unnamed`.
 * `thenCommit`: the statement is the transaction's last. Its COMMIT is written right behind it
 * (the connection is in pipeline mode, db/sequelize.ts): one round trip for both, and the
 * transaction ends here, committed (or rolled back, when the statement failed: PostgreSQL
 * answers the COMMIT of a failed transaction with a ROLLBACK). tenancy/tenant-transaction.ts then
 * has nothing left to commit.
 * `genericPlan` (a named statement with `thenCommit` only): PostgreSQL runs it on its generic plan
 * from the first execution, where it would otherwise plan it for its values at least five times
 * and then keep doing so whenever it guesses the generic plan costlier. The setting is written
 * with the statement, for the rest of the transaction: nothing follows but the COMMIT.
 */
export async function preparedRows<T = Record<string, unknown>>(transaction: Transaction, text: string, values: unknown[], options: { unnamed?: boolean; thenCommit?: boolean; genericPlan?: boolean } = {}): Promise<T[]> {
  const connection = connectionOf(transaction);
  if (options.genericPlan && (options.unnamed || !options.thenCommit)) throw new Error('genericPlan is for a named statement that is its transaction\'s last (thenCommit)');
  const written = () => rowsOf<T>(connection.query(options.unnamed ? { text, values } : { name: nameOf(text), text, values }), text);
  if (!options.thenCommit) return written();
  const open = transaction as unknown as OpenTransaction;
  const [rows, committed] = writtenTogether(transaction, () => {
    const forced = options.genericPlan ? rowsOf(connection.query({ name: nameOf(FORCE_GENERIC_PLAN), text: FORCE_GENERIC_PLAN }), FORCE_GENERIC_PLAN) : null;
    const statement = written();
    return [forced ? allAnswered([forced, statement] as const).then(([, r]) => r) : statement, rowsOf(connection.query({ text: 'COMMIT' }), 'COMMIT')] as const;
  });
  commitWritten.add(transaction);
  const [statement, commit] = await Promise.allSettled([rows, committed]);
  if (commit.status === 'rejected') {
    // The connection's state is unknown: destroyed rather than returned to the pool (as Sequelize does).
    open.finished = 'commit';
    await open.forceCleanup();
    throw statement.status === 'rejected' ? statement.reason : commit.reason;
  }
  open.finished = statement.status === 'fulfilled' ? 'commit' : 'rollback';
  open.cleanup();
  if (statement.status === 'rejected') throw statement.reason;
  for (const hook of open._afterCommitHooks) await hook(transaction);
  return statement.value;
}

/**
 * Runs `write`, whose statements node-postgres writes at once (pipeline mode), with the
 * connection's socket corked: they leave in one write (one system call, and PostgreSQL wakes once
 * to read them) rather than one each. Corking nests, so each statement's own cork inside
 * node-postgres no longer sends it alone.
 */
export function writtenTogether<R>(transaction: Transaction, write: () => R): R {
  const socket = connectionOf(transaction).connection?.stream;
  socket?.cork?.();
  try {
    return write();
  } finally {
    socket?.uncork?.();
  }
}

/**
 * The answers of statements written together, once every one has come (so none is still pending
 * when the transaction is left); the first failure, if any, is thrown.
 */
export async function allAnswered<T extends readonly unknown[]>(answers: T): Promise<{ -readonly [K in keyof T]: Awaited<T[K]> }> {
  const settled = await Promise.allSettled(answers);
  const failed = settled.find((r): r is PromiseRejectedResult => r.status === 'rejected');
  if (failed) throw failed.reason;
  return settled.map((r) => (r as PromiseFulfilledResult<unknown>).value) as { -readonly [K in keyof T]: Awaited<T[K]> };
}

/** Writes `text` (no parameters) on the transaction's connection now; the promise settles with its answer. */
export function sendStatement(transaction: Transaction, text: string): Promise<unknown> {
  return rowsOf(connectionOf(transaction).query({ text }), text);
}
