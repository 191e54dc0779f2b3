/**
 * Review comments per test case: the reviewer asks, the engineer answers, both on the record.
 * Append-only (the table refuses UPDATE and DELETE) and audited; closed once the run is issued,
 * because the issued report is then the record (a correction reopens the run and its threads).
 */
import { Op } from 'sequelize';
import { RunComment, TestCase, User } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { conflict, notFound } from '../http/problem';
import { audit } from '../audit/audit';
import { loadRun } from '../runs/run-service';
import type { Role } from '../../shared/access/roles';
import type { RunState } from '../../shared/runs/run-state';
import { commentBodySchema, type CommentBody } from './comment-body-schema';
import { presentComment } from './comment-presenter';

const PEOPLE = ['lab-admin', 'engineer', 'reviewer'] as const;
const OPEN_STATES: readonly RunState[] = ['draft', 'testing', 'in-review', 'approved'];

/** The hat the author wears in the thread; a reviewer who also measures speaks as reviewer. */
function authorRole(roles: Role[]): RunComment['authorRole'] {
  if (roles.includes('reviewer')) return 'reviewer';
  if (roles.includes('engineer')) return 'engineer';
  return 'lab-admin';
}

async function loadCase(runPlanId: string, caseId: string) {
  const testCase = await TestCase.findOne({ where: { id: caseId, planId: runPlanId } });
  if (!testCase) throw notFound('The test case');
  return testCase;
}

async function names(userIds: string[]): Promise<Map<string, string>> {
  if (userIds.length === 0) return new Map();
  // Users are not tenant rows; only names of people who wrote in this lab's thread are read.
  const users = await User.findAll({ where: { id: { [Op.in]: [...new Set(userIds)] } }, attributes: ['id', 'displayName'] });
  return new Map(users.map((u) => [u.id, u.displayName]));
}

export function commentRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/runs/:id/cases/:caseId/comments',
      summary: 'The review thread of one test case, oldest first',
      access: { kind: 'member', roles: PEOPLE },
      async handler(ctx) {
        const run = await loadRun(ctx.params.id);
        const testCase = await loadCase(run.planId, ctx.params.caseId);
        const rows = await RunComment.findAll({
          where: { organizationId: ctx.organizationId!, runId: run.id, testCaseId: testCase.id },
          order: [['createdAt', 'ASC'], ['id', 'ASC']],
        });
        const byId = await names(rows.map((r) => r.authorId));
        return { items: rows.map((r) => presentComment(r, byId.get(r.authorId) ?? 'Former member')) };
      },
    }),
    route<CommentBody>({
      method: 'post',
      path: '/runs/:id/cases/:caseId/comments',
      summary: 'Add a comment to the review thread of a test case (append-only, audited)',
      access: { kind: 'member', roles: PEOPLE },
      bodySchema: commentBodySchema,
      async handler(ctx) {
        const run = await loadRun(ctx.params.id);
        const testCase = await loadCase(run.planId, ctx.params.caseId);
        if (!OPEN_STATES.includes(run.state)) {
          throw conflict(`Run ${run.number} is ${run.state}, so its review threads are closed. Reopen it for correction to discuss it again.`, { code: 'comments-closed' });
        }
        const comment = await RunComment.create({
          organizationId: run.organizationId,
          runId: run.id,
          testCaseId: testCase.id,
          authorId: ctx.principal!.userId,
          authorRole: authorRole(ctx.roles),
          body: ctx.body.body.trim(),
        });
        const presented = presentComment(comment, ctx.principal!.displayName);
        await audit(ctx, { action: 'comment', entity: 'test-run', entityId: run.id, after: presented });
        return presented;
      },
    }),
  ];
}
