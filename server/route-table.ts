/** Every API route of the product, in one table: the router mounts it and the access test walks it. */
import type { Sequelize } from 'sequelize';
import { route, type RouteDef } from './http/route';
import { buildOpenApi } from './http/openapi';
import { ENGINE_VERSION } from '../shared/engine-version';
import { authRoutes } from './auth/routes';
import { clientRoutes } from './clients/routes';
import { commentRoutes } from './comments/routes';
import { deviceRoutes } from './devices/routes';
import { healthRoutes } from './health/routes';
import { homeRoutes } from './home/routes';
import { instrumentRoutes } from './instruments/routes';
import { planRoutes } from './plans/routes';
import { reportRoutes } from './reports/routes';
import { billingRoutes } from './billing/routes';
import type { BillingDeps } from './billing/billing-deps';
import { ruleSetRoutes } from './rule-sets/routes';
import { runRoutes } from './runs/routes';
import { uploadRoutes } from './uploads/routes';
import { uploadDepsFromEnv, type UploadDeps } from './uploads/upload-deps';
import type { TokenSettings } from './auth/tokens';
import type { ReportDeps } from './reports/report-service';
import { accountRoutes } from './accounts/routes';
import { apiKeyRoutes } from './api-keys/routes';
import { auditorRoutes } from './auditors/routes';
import { organizationRoutes } from './organizations/routes';
import type { MailSender } from './accounts/account-deps';

export interface RouteTableDeps {
  sequelize: Sequelize;
  tokens: TokenSettings;
  secureCookies: boolean;
  reports: ReportDeps;
  /** Outgoing mail of the people-and-access routes (invitations, password resets), enqueued in the request's transaction. */
  mail: MailSender;
  /** Base of links in e-mails, e.g. https://sidecheck.example. */
  publicUrl: string;
  /** Report credits: the payment client, webhook secret and mail (server/billing). */
  billing: BillingDeps;
  /** Uploads: file store and limits; by default local disk under SIDECHECK_DATA_DIR (server/uploads/upload-deps.ts). */
  uploads?: UploadDeps;
}

export function routeTable(deps: RouteTableDeps): RouteDef[] {
  const accountDeps = { sequelize: deps.sequelize, tokens: deps.tokens, secureCookies: deps.secureCookies, publicUrl: deps.publicUrl, mail: deps.mail };
  const routes: RouteDef[] = [
    ...healthRoutes(deps.sequelize),
    ...authRoutes({ sequelize: deps.sequelize, tokens: deps.tokens, secureCookies: deps.secureCookies }),
    ...accountRoutes(accountDeps),
    ...apiKeyRoutes(),
    ...auditorRoutes(accountDeps),
    ...organizationRoutes(),
    ...clientRoutes(),
    ...deviceRoutes(),
    ...ruleSetRoutes(),
    ...instrumentRoutes(),
    ...homeRoutes(deps.sequelize),
    ...planRoutes(),
    ...runRoutes(deps.sequelize, { publicUrl: deps.publicUrl, mail: deps.mail }),
    ...uploadRoutes(deps.uploads ?? uploadDepsFromEnv(deps.sequelize)),
    ...commentRoutes(),
    ...reportRoutes(deps.reports),
    ...billingRoutes(deps.billing),
  ] as RouteDef[];
  const openApi: RouteDef = route({
    method: 'get',
    path: '/openapi.json',
    summary: 'This document: the OpenAPI 3.1 description of the API',
    access: { kind: 'public' },
    transaction: 'none',
    handler: async (): Promise<unknown> => buildOpenApi([...routes, openApi], ENGINE_VERSION),
  });
  return [...routes, openApi];
}
