/**
 * The lab's home page in one request: how many runs are in each state, what waits for my review,
 * which instruments need calibrating, and what happened last. The SQL and why it stays fast at
 * 100,000 runs per lab are in home-queries.ts.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { route, type RouteDef } from '../http/route';
import { RUN_STATES, type RunState } from '../../shared/runs/run-state';
import { addDaysIso, CALIBRATION_DUE_SOON_DAYS, calibrationStatus, todayIso } from '../instruments/calibration-status';
import { AWAITING_REVIEW, CALIBRATION_DUE, RECENT_ACTIVITY, RUNS_BY_STATE } from './home-queries';

const LAB = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
/** How many runs and instruments the home page lists; the full lists live on their own pages. */
const LIST_LIMIT = 20;

export function homeRoutes(sequelize: Sequelize): RouteDef[] {
  const select = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return [
    route({
      method: 'get',
      path: '/home',
      summary: 'The lab’s home: runs by state, runs awaiting my review, calibration due, recent activity',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        const org = ctx.organizationId!;
        const me = ctx.principal!.userId;
        const today = todayIso();
        // One transaction, one connection: the four queries run one after the other.
        const counts = await select<{ state: RunState; n: number }>(RUNS_BY_STATE, { org });
        const awaiting = await select<Record<string, unknown> & { updatedAt: Date }>(AWAITING_REVIEW, { org, me, limit: LIST_LIMIT });
        const due = await select<{ calibrationDue: string } & Record<string, unknown>>(CALIBRATION_DUE, { org, soon: addDaysIso(today, CALIBRATION_DUE_SOON_DAYS), limit: LIST_LIMIT });
        const activity = await select<{ id: string; action: string; entity: string; entityId: string | null; at: Date; userId: string | null; displayName: string | null }>(RECENT_ACTIVITY, { org });
        const runsByState = Object.fromEntries(RUN_STATES.map((s) => [s, 0])) as Record<RunState, number>;
        for (const c of counts) runsByState[c.state] = c.n;
        return {
          runsByState,
          awaitingMyReview: awaiting.map((r) => ({ ...r, updatedAt: r.updatedAt.toISOString() })),
          calibrationDue: due.map((i) => ({ ...i, calibrationStatus: calibrationStatus(i.calibrationDue, today) })),
          recentActivity: activity.map((a) => ({
            id: String(a.id),
            at: a.at.toISOString(),
            who: a.userId ? { userId: a.userId, displayName: a.displayName } : null,
            action: a.action,
            entity: a.entity,
            entityId: a.entityId,
          })),
        };
      },
    }),
  ];
}
