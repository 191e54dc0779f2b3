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
import { ruleSetRoutes } from './rule-sets/routes';
import { runRoutes } from './runs/routes';
import type { TokenSettings } from './auth/tokens';
import type { ReportDeps } from './reports/report-service';

export interface RouteTableDeps {
  sequelize: Sequelize;
  tokens: TokenSettings;
  secureCookies: boolean;
  reports: ReportDeps;
}

export function routeTable(deps: RouteTableDeps): RouteDef[] {
  const routes: RouteDef[] = [
    ...healthRoutes(deps.sequelize),
    ...authRoutes({ sequelize: deps.sequelize, tokens: deps.tokens, secureCookies: deps.secureCookies }),
    ...clientRoutes(),
    ...deviceRoutes(),
    ...ruleSetRoutes(),
    ...instrumentRoutes(),
    ...homeRoutes(deps.sequelize),
    ...planRoutes(),
    ...runRoutes(deps.sequelize),
    ...commentRoutes(),
    ...reportRoutes(deps.reports),
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
