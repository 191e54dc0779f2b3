/**
 * Find the organization a presented API key belongs to. The key is the only thing the caller
 * presents, so the lookup has to cross organizations: it runs in the system scope (asSystem,
 * listed in DEVELOPERS.md) and reads nothing but the key's own row. lastUsedAt is written at most
 * once a minute per key, so a busy bench does not turn every reading into two writes.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { asSystem } from '../tenancy/tenant-transaction';
import type { ApiKeyPrincipal } from '../http/router';
import { API_KEY_PATTERN, hashApiKey } from './api-key-secret';

export async function authenticateApiKey(sequelize: Sequelize, key: string): Promise<ApiKeyPrincipal | null> {
  if (!API_KEY_PATTERN.test(key)) return null;
  return asSystem(sequelize, async (transaction) => {
    const [row] = await sequelize.query<{ id: string; organizationId: string }>(
      `SELECT id, organization_id AS "organizationId" FROM api_keys WHERE key_hash = :hash AND revoked_at IS NULL`,
      { replacements: { hash: hashApiKey(key) }, type: QueryTypes.SELECT, transaction },
    );
    if (!row) return null;
    await sequelize.query(
      `UPDATE api_keys SET last_used_at = now() WHERE id = :id AND (last_used_at IS NULL OR last_used_at < now() - interval '1 minute')`,
      { replacements: { id: row.id }, transaction },
    );
    return { organizationId: row.organizationId, keyId: row.id };
  });
}
