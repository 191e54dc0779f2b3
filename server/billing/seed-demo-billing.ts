/**
 * The demo's billing: the demo lab's price list (invented prices) and a starting balance of three
 * report credits for the demo manufacturer, as an 'adjustment' row by the lab administrator.
 */
import type { Transaction } from 'sequelize';
import { CreditLedgerEntry, CreditPriceList } from '../db/models';
import { packIdFor } from '../../shared/schemas/billing';

/** Invented prices: 1 credit GBP 180, 5 for GBP 800, 20 for GBP 2,900 (minor units: pence). */
export const DEMO_PRICE_LIST = {
  currency: 'GBP',
  packs: [
    { credits: 1, priceMinor: 18_000 },
    { credits: 5, priceMinor: 80_000 },
    { credits: 20, priceMinor: 290_000 },
  ],
  refundOnWithdrawWithinDays: 30,
} as const;

export const DEMO_STARTING_CREDITS = 3;

/** Write the demo lab's price list and the client's starting credits inside the seed's system transaction. */
export async function seedDemoBilling(input: { labId: string; clientId: string; byUserId: string }, transaction: Transaction): Promise<void> {
  await CreditPriceList.create(
    {
      organizationId: input.labId,
      currency: DEMO_PRICE_LIST.currency,
      packs: DEMO_PRICE_LIST.packs.map((p) => ({ id: packIdFor(p.credits), ...p })),
      refundOnWithdrawWithinDays: DEMO_PRICE_LIST.refundOnWithdrawWithinDays,
      updatedBy: input.byUserId,
    },
    { transaction },
  );
  await CreditLedgerEntry.create(
    { organizationId: input.labId, clientId: input.clientId, kind: 'adjustment', credits: DEMO_STARTING_CREDITS, reason: 'demo starting balance', createdBy: input.byUserId, purchaseId: null, reportId: null, providerEventId: null },
    { transaction },
  );
}
