/**
 * People and access: sign-up of a new lab, password reset, members and invitations. Every route
 * of this folder is listed here; server/route-table.ts mounts them.
 */
import { route, type RouteDef } from '../http/route';
import { openSession } from '../auth/routes';
import {
  passwordResetCompleteSchema,
  passwordResetRequestSchema,
  signUpSchema,
  type PasswordResetCompleteBody,
  type PasswordResetRequestBody,
  type SignUpBody,
} from '../../shared/schemas/accounts';
import type { AccountDeps } from './account-deps';
import { signUpLab } from './sign-up';
import { completePasswordReset, requestPasswordReset } from './password-reset';
import { memberRoutes } from './member-routes';
import { invitationRoutes } from './invitation-routes';

export function accountRoutes(deps: AccountDeps): RouteDef[] {
  return [
    route<SignUpBody>({
      method: 'post',
      path: '/auth/sign-up',
      summary: 'Sign up a new lab: the lab, its first administrator, signed in at once (sets the refresh cookie)',
      access: { kind: 'public' },
      bodySchema: signUpSchema,
      transaction: 'none',
      async handler(ctx) {
        const { userId, organizationId } = await signUpLab(deps.sequelize, ctx.body);
        ctx.status(201);
        return { ...(await openSession(ctx.res, userId, deps)), organizationId };
      },
    }),
    route<PasswordResetRequestBody>({
      method: 'post',
      path: '/auth/password-reset/request',
      summary: 'Ask for a password reset link by e-mail (always answers 202, whether or not the account exists)',
      access: { kind: 'public' },
      bodySchema: passwordResetRequestSchema,
      async handler(ctx) {
        await requestPasswordReset(deps, ctx.transaction, ctx.body.email);
        ctx.status(202);
        return { detail: 'If an account uses this address, a link to reset its password is on its way. It works for one hour.' };
      },
    }),
    route<PasswordResetCompleteBody>({
      method: 'post',
      path: '/auth/password-reset/complete',
      summary: 'Set a new password with a reset link; signs the account out everywhere',
      access: { kind: 'public' },
      bodySchema: passwordResetCompleteSchema,
      transaction: 'none',
      async handler(ctx) {
        await completePasswordReset(deps, ctx.body.token, ctx.body.password);
        ctx.status(204);
        return undefined;
      },
    }),
    ...memberRoutes(deps),
    ...invitationRoutes(deps),
  ];
}
