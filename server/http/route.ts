/**
 * Routes are declared as data: method, path, who may call it, the body schema, and a handler that
 * returns plain data. The router (router.ts) wraps every handler in the caller's tenant
 * transaction and sends the answer only after it commits, and the access test walks this same
 * table, so a route cannot be added without an access rule.
 */
import type { Request, Response } from 'express';
import type { Transaction } from 'sequelize';
import type { Role } from '../../shared/access/roles';

export type Access =
  | { kind: 'public' }
  /** Any signed-in person; no organization context. */
  | { kind: 'signed-in' }
  /** A member of the active organization holding one of these roles. */
  | { kind: 'member'; roles: readonly Role[] }
  /** A lab's bench-automation API key (readings and uploads only), or a member with these roles. */
  | { kind: 'member-or-api-key'; roles: readonly Role[] };

export interface Principal {
  userId: string;
  email: string;
  displayName: string;
  memberships: { organizationId: string; kind: 'lab' | 'manufacturer'; roles: Role[] }[];
}

export interface RouteContext<Body = unknown> {
  req: Request;
  res: Response;
  principal: Principal | null;
  /** The active organization (from X-Organization-Id), when the route runs in one. */
  organizationId: string | null;
  roles: Role[];
  transaction: Transaction | null;
  params: Record<string, string>;
  query: Record<string, unknown>;
  body: Body;
  status(code: number): void;
}

export interface FileAnswer {
  kind: 'file';
  contentType: string;
  filename: string;
  body: Buffer;
  disposition?: 'inline' | 'attachment';
}

export interface RouteDef<Body = unknown> {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  summary: string;
  access: Access;
  bodySchema?: object;
  /** Run without a tenant transaction (sign-in, webhooks): the handler manages its own. */
  transaction?: 'tenant' | 'none';
  handler(ctx: RouteContext<Body>): Promise<unknown>;
}

export function route<Body = unknown>(def: RouteDef<Body>): RouteDef<Body> {
  return def;
}

export function fileAnswer(options: Omit<FileAnswer, 'kind'>): FileAnswer {
  return { kind: 'file', ...options };
}

export function isFileAnswer(value: unknown): value is FileAnswer {
  return typeof value === 'object' && value !== null && (value as FileAnswer).kind === 'file';
}
