/** Roles a person can hold in an organization. A lab has the first four; a manufacturer the last two. */
export const LAB_ROLES = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
export const MANUFACTURER_ROLES = ['manufacturer-admin', 'manufacturer-viewer'] as const;
export const ROLES = [...LAB_ROLES, ...MANUFACTURER_ROLES] as const;

export type LabRole = (typeof LAB_ROLES)[number];
export type ManufacturerRole = (typeof MANUFACTURER_ROLES)[number];
export type Role = (typeof ROLES)[number];
export type OrganizationKind = 'lab' | 'manufacturer';

/** How each role is named on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  'lab-admin': 'Lab administrator',
  engineer: 'Test engineer',
  reviewer: 'Technical reviewer',
  billing: 'Billing',
  'manufacturer-admin': 'Manufacturer administrator',
  'manufacturer-viewer': 'Manufacturer viewer',
};

export function isLabRole(role: string): role is LabRole {
  return (LAB_ROLES as readonly string[]).includes(role);
}
