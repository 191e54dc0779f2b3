import type { Sequelize } from 'sequelize';
import { route, type RouteDef } from '../http/route';
import { ENGINE_VERSION } from '../../shared/engine-version';

export function healthRoutes(sequelize: Sequelize): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/health',
      summary: 'Service and database status',
      access: { kind: 'public' },
      transaction: 'none',
      async handler(ctx) {
        const started = Date.now();
        try {
          await sequelize.query('SELECT 1');
          return { status: 'ok', database: { status: 'up', latencyMs: Date.now() - started }, engineVersion: ENGINE_VERSION };
        } catch (error) {
          ctx.status(503);
          return { status: 'degraded', database: { status: 'down', error: (error as Error).message.slice(0, 200) }, engineVersion: ENGINE_VERSION };
        }
      },
    }),
  ];
}
