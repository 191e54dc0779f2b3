import { AuditEntry } from '../db/models';
import type { RouteContext } from '../http/route';

/** The bench-automation key a request came with (server/api-keys/identify-api-key.ts), or null. */
export function apiKeyIdOf(req: RouteContext['req'] | undefined): string | null {
  return (req as { apiKey?: { keyId: string } | null } | undefined)?.apiKey?.keyId ?? null;
}

/** Append one entry to the audit log, inside the caller's transaction (so it commits with the change). */
export async function audit(
  ctx: Pick<RouteContext, 'principal' | 'organizationId' | 'transaction'> & { req?: RouteContext['req'] },
  entry: { action: string; entity: string; entityId?: string | null; before?: unknown; after?: unknown },
): Promise<void> {
  await AuditEntry.create(
    {
      organizationId: ctx.organizationId,
      userId: ctx.principal?.userId ?? null,
      // A change made with a bench-automation key names the key (server/api-keys/identify-api-key.ts).
      apiKeyId: apiKeyIdOf(ctx.req),
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId ?? null,
      before: entry.before ?? null,
      after: entry.after ?? null,
    },
    { transaction: ctx.transaction ?? undefined },
  );
}
