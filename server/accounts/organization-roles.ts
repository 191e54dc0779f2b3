/**
 * Which roles an organization can hold: lab roles only in labs, manufacturer roles only in
 * manufacturer organizations, and which one is the administrator.
 */
import { LAB_ROLES, MANUFACTURER_ROLES, type OrganizationKind, type Role } from '../../shared/access/roles';
import { validationFailed } from '../http/problem';

/** The role that manages members of an organization of this kind. */
export function adminRoleOf(kind: OrganizationKind): Role {
  return kind === 'lab' ? 'lab-admin' : 'manufacturer-admin';
}

/** The roles an organization of this kind can give. */
export function rolesOf(kind: OrganizationKind): readonly Role[] {
  return kind === 'lab' ? LAB_ROLES : MANUFACTURER_ROLES;
}

/** Throw a 422 naming `pointer` when a role does not belong to this kind of organization. */
export function requireRolesFit(kind: OrganizationKind, roles: readonly Role[], pointer: string): void {
  const allowed = rolesOf(kind);
  const wrong = roles.filter((r) => !allowed.includes(r));
  if (wrong.length === 0) return;
  const what = kind === 'lab' ? 'A lab' : 'A manufacturer organization';
  throw validationFailed(`${what} can only give the roles ${allowed.join(', ')}; "${wrong[0]}" is not one of them.`, [
    { pointer, message: `must be one of ${allowed.join(', ')}` },
  ]);
}
