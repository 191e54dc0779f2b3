/** Who receives a lab's notices: the members of an organization holding one of some roles. */
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Role } from '../../shared/access/roles';

export interface Recipient {
  userId: string;
  email: string;
  displayName: string;
}

/**
 * Each person with at least one of `roles` in `organizationId`, once, ordered by name.
 * Memberships and users carry no row-level security, so this works inside any transaction.
 * @example await peopleWithRole(sequelize, labId, ['reviewer'], t) // [{ userId, email, displayName }]
 */
export async function peopleWithRole(sequelize: Sequelize, organizationId: string, roles: readonly Role[], transaction: Transaction | null): Promise<Recipient[]> {
  return sequelize.query<Recipient>(
    `SELECT DISTINCT u.id AS "userId", u.email, u.display_name AS "displayName"
       FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.organization_id = :organizationId AND m.role IN (:roles)
      ORDER BY u.display_name, u.email`,
    { replacements: { organizationId, roles: [...roles] }, type: QueryTypes.SELECT, transaction: transaction ?? undefined },
  );
}
