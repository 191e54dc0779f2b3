/** A lab's manual change of a client's credits (goodwill, a correction, a starting balance): an 'adjustment' row with its reason and author. */
import { Client, CreditLedgerEntry } from '../db/models';
import { notFound, validationFailed } from '../http/problem';
import { audit } from '../audit/audit';
import { creditBalance } from './credit-balance';
import type { BillingActor } from './billing-deps';
import type { CreditAdjustmentBody } from '../../shared/schemas/billing';
import type { Sequelize } from 'sequelize';

/**
 * Append `credits` (non-zero, may be negative) for the active lab's client `clientId`, with the
 * reason and the person. A client of another lab is 404; a blank reason 422. Returns the new
 * balance. Audited.
 * @example await adjustCredits(sequelize, ctx, { clientId, credits: 3, reason: 'Starting balance' }) // { balance: 3, ... }
 */
export async function adjustCredits(sequelize: Sequelize, ctx: BillingActor, body: CreditAdjustmentBody) {
  const reason = body.reason.trim();
  if (reason === '') throw validationFailed('An adjustment needs a reason.', [{ pointer: '/reason', message: 'must not be blank' }]);
  const labId = ctx.organizationId!;
  const client = await Client.findOne({ where: { id: body.clientId, organizationId: labId }, lock: true });
  if (!client) throw notFound('The client');
  const entry = await CreditLedgerEntry.create({ organizationId: labId, clientId: client.id, kind: 'adjustment', credits: body.credits, reason, createdBy: ctx.principal!.userId, purchaseId: null, reportId: null, providerEventId: null });
  const balance = await creditBalance(sequelize, { labId, clientId: client.id });
  await audit(ctx, { action: 'credit-adjust', entity: 'client', entityId: client.id, after: { credits: body.credits, reason, balance } });
  return { id: entry.id, clientId: client.id, kind: entry.kind, credits: entry.credits, reason, createdAt: entry.createdAt.toISOString(), balance };
}
