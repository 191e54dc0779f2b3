import type { Sequelize } from 'sequelize';
import { route, type RouteDef } from '../http/route';
import { readListQuery } from '../http/list-query';
import { listRuns, RUN_FILTERS, RUN_SORT_COLUMNS } from './run-list';
import { createRunSchema, reasonSchema, saveReadingSchema, type SaveReadingBody } from '../../shared/schemas/records';
import type { RunAction } from '../../shared/runs/run-state';
import { createRun, loadRun, transition } from './run-service';
import { runDetail } from './run-detail';
import { saveReading } from './save-reading';
import { runInstrumentsSchema, type RunInstrumentsBody } from '../../shared/schemas/instruments';
import { setRunInstruments } from '../instruments/run-instruments';
import { mailReturnedForRework, mailReviewRequested, type RunMailDeps } from './run-mail';

const LAB = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;

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
        return runDetail(ctx.transaction!, run.id);
      },
    });

  return [
    route({
      method: 'get',
      path: '/runs',
      summary: 'Test runs, paginated, sortable and filterable (state, search)',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(RUN_SORT_COLUMNS), filterable: RUN_FILTERS, defaultSort: '-updatedAt' });
        return listRuns(ctx.transaction!, ctx.organizationId!, q);
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
        return runDetail(ctx.transaction!, run.id);
      },
    }),
    route({
      method: 'get',
      path: '/runs/:id',
      summary: 'A run with its test cases, latest readings and results',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        return runDetail(ctx.transaction!, ctx.params.id, { thenCommit: true });
      },
    }),
    route<SaveReadingBody>({
      method: 'put',
      path: '/runs/:id/cases/:caseId/reading',
      summary: 'Save a reading; the server recomputes the result with the shared engine',
      access: { kind: 'member-or-api-key', roles: ['lab-admin', 'engineer'] },
      bodySchema: saveReadingSchema,
      async handler(ctx) {
        return saveReading(ctx, ctx.params.id, ctx.params.caseId, ctx.body.values);
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
        return runDetail(ctx.transaction!, run.id);
      },
    }),
    act('submit', ['lab-admin', 'engineer'], 'Send the run for technical review'),
    act('return', ['lab-admin', 'reviewer'], 'Return the run to the bench, with a reason', true),
    act('approve', ['lab-admin', 'reviewer'], 'Authorize the run’s results (four-eyes rule)'),
  ];
}
