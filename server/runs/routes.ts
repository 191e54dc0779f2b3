import { QueryTypes, type Sequelize } from 'sequelize';
import { route, type RouteDef } from '../http/route';
import { readListQuery, page } from '../http/list-query';
import { badRequest } from '../http/problem';
import { createRunSchema, reasonSchema, saveReadingSchema, type SaveReadingBody } from '../../shared/schemas/records';
import { RUN_STATES, type RunAction } from '../../shared/runs/run-state';
import { createRun, loadRun, runDetail, saveReading, transition } from './run-service';
import { runInstrumentsSchema, type RunInstrumentsBody } from '../../shared/schemas/instruments';
import { setRunInstruments } from '../instruments/run-instruments';
import { mailReturnedForRework, mailReviewRequested, type RunMailDeps } from './run-mail';

const LAB = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
const SORT_COLUMNS: Record<string, string> = { number: 'r.number', state: 'r.state', updatedAt: 'r.updated_at', createdAt: 'r.created_at', model: 'd.model', client: 'c.name' };
/** Sorts on the run's own columns: the page can be taken from test_runs before any join. */
const RUN_SORTS = new Set(['number', 'state', 'updatedAt', 'createdAt']);

/** `mail` sends the review step's e-mails (run-mail.ts) in the request's transaction. */
export function runRoutes(sequelize: Sequelize, mail: Omit<RunMailDeps, 'sequelize'>): RouteDef[] {
  const mailDeps: RunMailDeps = { sequelize, ...mail };
  const act = (action: RunAction, roles: readonly ('lab-admin' | 'engineer' | 'reviewer')[], summary: string, withReason = false): RouteDef =>
    route<{ reason?: string }>({
      method: 'post',
      path: `/runs/:id/${action}`,
      summary,
      access: { kind: 'member', roles },
      bodySchema: withReason ? reasonSchema : undefined,
      async handler(ctx) {
        ctx.status(200);
        const run = await transition(ctx, await loadRun(ctx.params.id), action, ctx.body?.reason);
        if (action === 'submit') await mailReviewRequested(mailDeps, ctx, run);
        if (action === 'return') await mailReturnedForRework(mailDeps, ctx, run, ctx.body!.reason!);
        return runDetail(run);
      },
    });

  return [
    route({
      method: 'get',
      path: '/runs',
      summary: 'Test runs, paginated, sortable and filterable (state, search)',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(SORT_COLUMNS), filterable: ['state', 'search', 'engineerId'], defaultSort: '-updatedAt' });
        const states = q.filter.state?.split(',') ?? [];
        if (states.some((s) => !(RUN_STATES as readonly string[]).includes(s))) throw badRequest(`Unknown state in "${q.filter.state}".`);
        // The explicit organization predicates let PostgreSQL use the (organization_id, ...) indexes;
        // row-level security still guards the rows, but its OR with the system switch is not indexable.
        const where: string[] = ['r.organization_id = :org'];
        const replacements: Record<string, unknown> = { org: ctx.organizationId, limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
        if (states.length) {
          where.push('r.state IN (:states)');
          replacements.states = states;
        }
        if (q.filter.engineerId) {
          where.push('r.engineer_id = :engineer');
          replacements.engineer = q.filter.engineerId;
        }
        if (q.filter.search) {
          // Matched against the lab's plans first (a thousand rows, not every run joined to them).
          where.push(`(r.number ILIKE :like OR r.plan_id IN (SELECT p.id FROM test_plans p
            JOIN devices d ON d.organization_id = :org AND d.id = p.device_id JOIN clients c ON c.organization_id = :org AND c.id = d.client_id
            WHERE p.organization_id = :org AND (d.model ILIKE :like OR d.serial_number ILIKE :like OR c.name ILIKE :like)))`);
          replacements.like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
        }
        const joins = `JOIN test_plans p ON p.organization_id = :org AND p.id = r.plan_id JOIN devices d ON d.organization_id = :org AND d.id = p.device_id
          JOIN clients c ON c.organization_id = :org AND c.id = d.client_id`;
        const columns = `r.id, r.number, r.state, r.updated_at AS "updatedAt", r.created_at AS "createdAt", r.engineer_id AS "engineerId",
                  p.name AS "planName", d.manufacturer, d.model, d.serial_number AS "serialNumber", c.name AS client`;
        // Ties broken by id in the same direction: the (organization_id, column, id) indexes hold this order (migration 0009).
        const order = `${SORT_COLUMNS[q.sort]} ${q.direction}, r.id ${q.direction}`;
        if (RUN_SORTS.has(q.sort)) {
          // Filters and sort on the run alone: take the page from test_runs by its indexes, join only
          // that page, and count with an index-only scan, rather than joining every run of the lab.
          const rows = await sequelize.query<Record<string, unknown>>(
            `SELECT ${columns} FROM (SELECT * FROM test_runs r WHERE ${where.join(' AND ')} ORDER BY ${order} LIMIT :limit OFFSET :offset) r ${joins} ORDER BY ${order}`,
            { replacements, type: QueryTypes.SELECT },
          );
          const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM test_runs r WHERE ${where.join(' AND ')}`, { replacements, type: QueryTypes.SELECT });
          return page(rows, Number(n), q);
        }
        const sql = `FROM test_runs r ${joins} WHERE ${where.join(' AND ')}`;
        const rows = await sequelize.query<Record<string, unknown>>(
          `SELECT ${columns}, count(*) OVER () AS total ${sql} ORDER BY ${order} LIMIT :limit OFFSET :offset`,
          { replacements, type: QueryTypes.SELECT },
        );
        let total = rows.length ? Number(rows[0].total) : 0;
        if (!rows.length && q.page > 1) {
          const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n ${sql}`, { replacements, type: QueryTypes.SELECT });
          total = Number(n);
        }
        return page(rows.map(({ total: _t, ...r }) => r), total, q);
      },
    }),
    route({
      method: 'post',
      path: '/runs',
      summary: 'Start a test run from a plan',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: createRunSchema,
      async handler(ctx) {
        const run = await createRun(sequelize, ctx, (ctx.body as { planId: string }).planId);
        return runDetail(run);
      },
    }),
    route({
      method: 'get',
      path: '/runs/:id',
      summary: 'A run with its test cases, latest readings and results',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        return runDetail(await loadRun(ctx.params.id));
      },
    }),
    route<SaveReadingBody>({
      method: 'put',
      path: '/runs/:id/cases/:caseId/reading',
      summary: 'Save a reading; the server recomputes the result with the shared engine',
      access: { kind: 'member-or-api-key', roles: ['lab-admin', 'engineer'] },
      bodySchema: saveReadingSchema,
      async handler(ctx) {
        return saveReading(ctx, await loadRun(ctx.params.id), ctx.params.caseId, ctx.body.values);
      },
    }),
    route<RunInstrumentsBody>({
      method: 'put',
      path: '/runs/:id/instruments',
      summary: 'Set the instruments used on the run (each must be in calibration); their contributions join the uncertainty budgets',
      access: { kind: 'member', roles: ['lab-admin', 'engineer'] },
      bodySchema: runInstrumentsSchema,
      async handler(ctx) {
        const run = await loadRun(ctx.params.id);
        await setRunInstruments(ctx, run, ctx.body.instrumentIds);
        return runDetail(run);
      },
    }),
    act('submit', ['lab-admin', 'engineer'], 'Send the run for technical review'),
    act('return', ['lab-admin', 'reviewer'], 'Return the run to the bench, with a reason', true),
    act('approve', ['lab-admin', 'reviewer'], 'Authorize the run’s results (four-eyes rule)'),
  ];
}
