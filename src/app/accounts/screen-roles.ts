import type { Role } from '../../../shared/access/roles';

/**
 * Which roles may open each screen, in one table that both the route guards and the shell's
 * navigation read, so a link is shown exactly when its screen would let the person in. The
 * server's route access rules (server/access/route-access.spec.ts) stay the authority; these
 * only keep people away from screens that would answer 403.
 */
export const SCREEN_ROLES = {
  /** The lab home and the runs work queue: every lab role. */
  home: ['lab-admin', 'engineer', 'reviewer', 'billing'],
  /** Reading the registers (clients, equipment, rule sets): every lab role. */
  labRecords: ['lab-admin', 'engineer', 'reviewer', 'billing'],
  /** Adding and changing clients, devices, instruments and rule sets. */
  labRecordsWrite: ['lab-admin', 'engineer'],
  /** Members and invitations of the active organization. */
  people: ['lab-admin', 'manufacturer-admin'],
  /** API keys, lab details and auditor grants. */
  labAdmin: ['lab-admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Screen = keyof typeof SCREEN_ROLES;
