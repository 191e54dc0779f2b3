/**
 * Sign-up of a new lab: the organization, its first person and their lab-admin membership, in one
 * transaction with the audit entry. The password is hashed before the transaction opens (argon2
 * takes tens of milliseconds; no row is locked meanwhile).
 */
import { UniqueConstraintError, type Sequelize } from 'sequelize';
import { AuditEntry, Membership, Organization, User } from '../db/models';
import { conflict, validationFailed } from '../http/problem';
import { hashPassword, passwordProblems } from '../auth/password';
import type { SignUpBody } from '../../shared/schemas/accounts';
import { findUserByEmail } from './find-user-by-email';
import { uniqueOrganizationCode } from './organization-code';

const EMAIL_TAKEN = 'An account with this e-mail address already exists. Sign in, or reset your password if you have forgotten it.';

/** Create the lab and its administrator; returns the new user's id. Throws 422 / 409 problems. */
export async function signUpLab(sequelize: Sequelize, body: SignUpBody): Promise<{ userId: string; organizationId: string }> {
  const weak = passwordProblems(body.password);
  if (weak) throw validationFailed(`The password is too weak: ${weak}`, [{ pointer: '/password', message: weak }]);
  const passwordHash = await hashPassword(body.password);
  const chosenCode = body.labCode?.toUpperCase();
  try {
    return await sequelize.transaction(async (transaction) => {
      if (await findUserByEmail(body.email, transaction)) throw conflict(EMAIL_TAKEN, { code: 'email-taken' });
      if (chosenCode && (await Organization.findOne({ where: { code: chosenCode }, transaction }))) {
        throw conflict(`The lab code ${chosenCode} is already in use. Choose another, or leave it out to have one made for you.`, { code: 'lab-code-taken' });
      }
      const code = chosenCode ?? (await uniqueOrganizationCode(body.labName, transaction));
      const lab = await Organization.create({ kind: 'lab', name: body.labName.trim(), code, addressLines: body.address, email: null, phone: null, accreditation: null }, { transaction });
      const user = await User.create({ email: body.email.trim(), displayName: body.name.trim(), passwordHash }, { transaction });
      await Membership.create({ organizationId: lab.id, userId: user.id, role: 'lab-admin' }, { transaction });
      await AuditEntry.create(
        { organizationId: lab.id, userId: user.id, action: 'sign-up', entity: 'organization', entityId: lab.id, after: { kind: 'lab', name: lab.name, code, adminEmail: user.email } },
        { transaction },
      );
      return { userId: user.id, organizationId: lab.id };
    });
  } catch (error) {
    // Two sign-ups racing for the same address or code: the unique indexes decide.
    if (error instanceof UniqueConstraintError) {
      const onEmail = JSON.stringify(error.errors ?? []).includes('email') || String(error.parent?.message ?? '').includes('users_email_lower');
      throw onEmail ? conflict(EMAIL_TAKEN, { code: 'email-taken' }) : conflict('That lab code was taken a moment ago. Try again.', { code: 'lab-code-taken' });
    }
    throw error;
  }
}
