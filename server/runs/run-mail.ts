/**
 * The e-mails of the review step: a submitted run asks the lab's reviewers to review it, and a
 * returned run tells the engineer who submitted it why. Both are enqueued in the request's
 * transaction, so a refused or rolled-back transition sends nothing.
 */
import type { Sequelize } from 'sequelize';
import { AuditEntry, Client, Device, Organization, TestPlan, User, type TestRun } from '../db/models';
import type { RouteContext } from '../http/route';
import type { MailSender } from '../accounts/account-deps';
import { peopleWithRole } from '../mail/people-with-role';
import { reviewRequestedEmail } from '../../templates/email/review-requested';
import { returnedForReworkEmail } from '../../templates/email/returned-for-rework';

export interface RunMailDeps {
  sequelize: Sequelize;
  /** Base of links in e-mails, e.g. https://sidecheck.example (no trailing slash). */
  publicUrl: string;
  mail: MailSender;
}

async function describeRun(run: TestRun) {
  const plan = (await TestPlan.findByPk(run.planId))!;
  const device = (await Device.findByPk(plan.deviceId))!;
  const client = (await Client.findByPk(device.clientId))!;
  const lab = (await Organization.findByPk(run.organizationId))!;
  return { lab, client, deviceLabel: `${device.manufacturer} ${device.model} (s/n ${device.serialNumber})` };
}

/**
 * Mail every reviewer of the lab except the submitter (who may not authorize a run they measured);
 * a lab without another reviewer asks its administrators, who may review too.
 */
export async function mailReviewRequested(deps: RunMailDeps, ctx: RouteContext, run: TestRun): Promise<number> {
  const me = ctx.principal!.userId;
  let recipients = (await peopleWithRole(deps.sequelize, run.organizationId, ['reviewer'], ctx.transaction)).filter((p) => p.userId !== me);
  if (!recipients.length) recipients = (await peopleWithRole(deps.sequelize, run.organizationId, ['lab-admin'], ctx.transaction)).filter((p) => p.userId !== me);
  if (!recipients.length) return 0;
  const { lab, client, deviceLabel } = await describeRun(run);
  const submitter = await User.findByPk(me);
  for (const r of recipients) {
    const mail = reviewRequestedEmail({
      reviewerName: r.displayName,
      labName: lab.name,
      runNumber: run.number,
      deviceLabel,
      clientName: client.name,
      submittedByName: submitter?.displayName ?? 'An engineer',
      reviewUrl: `${deps.publicUrl}/runs/${run.id}/review`,
    });
    await deps.mail.enqueue(ctx.transaction, { to: r.email, ...mail });
  }
  return recipients.length;
}

/** Mail the person who last submitted the run (from the append-only audit log; else the run's engineer) the reviewer's reason. */
export async function mailReturnedForRework(deps: RunMailDeps, ctx: RouteContext, run: TestRun, reason: string): Promise<void> {
  const submitted = await AuditEntry.findOne({ where: { entity: 'test-run', entityId: run.id, action: 'run-submit' }, order: [['id', 'DESC']] });
  const engineerId = submitted?.userId ?? run.engineerId;
  const engineer = engineerId ? await User.findByPk(engineerId) : null;
  if (!engineer) return;
  const reviewer = await User.findByPk(ctx.principal!.userId);
  const { lab, deviceLabel } = await describeRun(run);
  const mail = returnedForReworkEmail({
    engineerName: engineer.displayName,
    labName: lab.name,
    runNumber: run.number,
    deviceLabel,
    reviewerName: reviewer?.displayName ?? 'A reviewer',
    reason,
    runUrl: `${deps.publicUrl}/runs/${run.id}`,
  });
  await deps.mail.enqueue(ctx.transaction, { to: engineer.email, ...mail });
}
