/**
 * Hot paths (the run list, the run workspace, saving a reading, the tenant check of every request)
 * send their SQL straight to the transaction's node-postgres connection as named prepared
 * statements: PostgreSQL parses and plans each text once per connection instead of on every
 * request (after five executions PostgreSQL keeps the generic plan when it costs no more than
 * planning anew, as for lookups by primary key), and no model instances are built for rows that
 * are only read. A statement whose best plan depends on its values (the run list: a search
 * pattern, a rare or common state) goes `unnamed`: planned for its values each time, still with
 * parameters and without Sequelize. Everything else goes through Sequelize models. Errors are wrapped as Sequelize's DatabaseError, so the error handler
 * answers them exactly like the rest (503 when the database is restarting, 404 for a malformed id).
 */
import crypto from 'node:crypto';
import { DatabaseError, type Transaction } from 'sequelize';

interface PgConnection {
  query(config: { name?: string; text: string; values: unknown[] }): Promise<{ rows: Record<string, unknown>[] }>;
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

/** Rows of `text` ($1, $2 ... placeholders) run in `transaction`, as a named prepared statement unless `unnamed`. */
export async function preparedRows<T = Record<string, unknown>>(transaction: Transaction, text: string, values: unknown[], options: { unnamed?: boolean } = {}): Promise<T[]> {
  const connection = (transaction as unknown as { connection?: PgConnection }).connection;
  if (!connection) throw new Error('preparedRows needs a transaction with its connection');
  try {
    const result = await connection.query(options.unnamed ? { text, values } : { name: nameOf(text), text, values });
    return result.rows as T[];
  } catch (error) {
    const e = error as Error & { sql?: string; parameters?: unknown[] };
    e.sql = text;
    throw new DatabaseError(e as never);
  }
}
