/** Database failures reach the caller as 503 (retry later), never as a 500; other errors are not masked. */
import { ConnectionRefusedError, DatabaseError } from 'sequelize';
import { toProblem } from './error-handler';

/** A query error as Sequelize wraps what node-postgres threw. */
const queryError = (message: string, code?: string) => new DatabaseError(Object.assign(new Error(message), { code, sql: 'SELECT 1', parameters: [] }) as never);

describe('toProblem for database failures', () => {
  it.each([
    ['a refused connection', new ConnectionRefusedError(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' }))],
    // SQLSTATE 57P01 admin_shutdown, 57P03 cannot_connect_now (PostgreSQL error codes appendix).
    ['the server shutting down (57P01)', queryError('terminating connection due to administrator command', '57P01')],
    ['the server starting up (57P03)', queryError('the database system is starting up', '57P03')],
    // node-postgres' own words when the socket closes under a query (no SQLSTATE).
    ['the connection closed under a query', queryError('Connection terminated unexpectedly')],
    ['a query on a connection that already failed', queryError('Client has encountered a connection error and is not queryable')],
    // A statement written (pipeline mode) to a socket the server has just closed: Node's EPIPE.
    ['a statement written to a closed connection', queryError('write EPIPE', 'EPIPE')],
  ])('%s -> 503 with Retry-After', (_what, error) => {
    const problem = toProblem(error);
    expect(problem?.status).toBe(503);
    expect(problem?.headers?.['Retry-After']).toMatch(/^\d+$/);
  });

  it('leaves other database errors alone (a unique violation, 23505, is a bug to log)', () => {
    expect(toProblem(queryError('duplicate key value violates unique constraint "x"', '23505'))).toBeNull();
  });
});
