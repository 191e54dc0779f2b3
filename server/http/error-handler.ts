import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError, ConnectionError, DatabaseError } from 'sequelize';
import { Problem, badRequest, notFound, payloadTooLarge, serviceUnavailable } from './problem';

// EPIPE: a statement written to a connection the server has just closed (pipeline mode writes at once).
const PG_CONNECTION_CODES = new Set(['57P01', '57P02', '57P03', '08000', '08003', '08006', '08001', '08004', 'ECONNREFUSED', 'ECONNRESET', 'EPIPE']);
/**
 * What node-postgres says, without an SQLSTATE, when the server closed the connection under a
 * query (PostgreSQL shutting down or restarting): the request can be retried like a refused connection.
 */
const PG_CONNECTION_LOST = /^(Connection terminated|Client has encountered a connection error|Client was closed and is not queryable)/;

/** Map what can go wrong to problem+json; anything unexpected is logged with context and answered with a generic 500. */
export function toProblem(error: unknown): Problem | null {
  if (error instanceof Problem) return error;
  const e = error as { type?: string; status?: number; code?: string; original?: { code?: string } };
  if (e?.type === 'entity.too.large') return payloadTooLarge('The request body is larger than the server accepts.');
  if (e?.type === 'entity.parse.failed') return badRequest('The request body is not valid JSON.');
  if (e?.type === 'encoding.unsupported' || e?.type === 'charset.unsupported') return badRequest('Unsupported body encoding.');
  if (error instanceof ConnectionError) return serviceUnavailable('The database is not reachable right now. Try again in a few seconds.');
  if (error instanceof BaseError) {
    const code = (error as DatabaseError).original && ((error as DatabaseError).original as { code?: string }).code;
    if (code && PG_CONNECTION_CODES.has(code)) return serviceUnavailable('The database is restarting. Try again in a few seconds.');
    const lost = (error as DatabaseError).original?.message ?? error.message;
    if (!code && PG_CONNECTION_LOST.test(lost)) return serviceUnavailable('The connection to the database was lost. Try again in a few seconds.');
    if (code === '22P02') return notFound('The requested record'); // malformed uuid in a path
    // A NUL byte or a broken UTF-8 sequence in a value PostgreSQL was asked to read.
    if (code === '22021') return badRequest('The request contains a character that cannot be stored (a NUL byte or broken UTF-8).');
  }
  if (e?.code && PG_CONNECTION_CODES.has(e.code)) return serviceUnavailable('The database is not reachable right now.');
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) return badRequest('The request could not be read.');
  return null;
}

export function errorHandler(log: (entry: Record<string, unknown>) => void): ErrorRequestHandler {
  return (error, req, res, _next) => {
    const problem = toProblem(error);
    if (problem) {
      if (problem.headers) res.set(problem.headers);
      res.status(problem.status).type('application/problem+json').send(JSON.stringify(problem.toJSON(req.originalUrl.split('?')[0])));
      return;
    }
    // Sequelize replaces a query error's stack with the caller's, which drops the message: log both.
    log({ level: 'error', msg: 'unhandled error', method: req.method, path: req.path, message: error instanceof Error ? error.message : undefined, error: error instanceof Error ? error.stack : String(error) });
    res.status(500).type('application/problem+json').send(
      JSON.stringify({ type: 'about:blank', title: 'Internal error', status: 500, code: 'internal', detail: 'Something went wrong on our side. It has been logged.' }),
    );
  };
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(notFound(`The API route ${req.method} ${req.path}`));
};
