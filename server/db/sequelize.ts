import { Sequelize } from 'sequelize';
import { requestScope } from './request-scope';

let clsInstalled = false;

/**
 * One Sequelize instance per process, joined to the request scope so queries find their
 * transaction. `statementTimeoutMs` bounds every statement (30 s by default, so a runaway query cannot hold a
 * connection); migrations pass 0, no limit, since rewriting a large table may take longer.
 */
export function createSequelize(databaseUrl: string, options: { poolMax?: number; logging?: boolean; statementTimeoutMs?: number } = {}): Sequelize {
  if (!clsInstalled) {
    Sequelize.useCLS(requestScope as never);
    clsInstalled = true;
  }
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    logging: options.logging ? (sql) => console.log(sql) : false,
    pool: { max: options.poolMax ?? 20, min: 0, idle: 10_000, acquire: 10_000 },
    define: { underscored: true, timestamps: true },
    dialectOptions: { application_name: 'sidecheck', statement_timeout: options.statementTimeoutMs ?? 30_000 },
    retry: { max: 0 },
    // Pipeline mode (node-postgres 8.23): a statement is written at once, without waiting for the
    // answer to the one before. Sequelize still awaits each query, so nothing changes for it; the
    // tenant transaction writes its START TRANSACTION and first statement together, and a hot path
    // its last statement and the COMMIT (db/prepared-query.ts): two round trips fewer a request.
    hooks: {
      afterConnect(connection) {
        (connection as { pipeline?: boolean }).pipeline = true;
      },
    },
  });
}
