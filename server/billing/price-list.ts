/**
 * A lab's price list of report credits: its currency, its packs (one per size) and its refund
 * policy for withdrawn reports. A lab without a price list does not sell credits, and issuing its
 * reports consumes none (see consume-credit-for-report.ts).
 */
import { CreditPriceList, type StoredCreditPack } from '../db/models/credit-price-list';
import type { RouteContext } from '../http/route';
import { validationFailed } from '../http/problem';
import { audit } from '../audit/audit';
import { packIdFor, type PriceListBody } from '../../shared/schemas/billing';

/** A pack as the API shows it, with the price of one credit in it (rounded to whole minor units). */
export function presentPack(pack: StoredCreditPack, currency: string) {
  return { id: pack.id, credits: pack.credits, priceMinor: pack.priceMinor, currency, pricePerCreditMinor: Math.round(pack.priceMinor / pack.credits) };
}

export function presentPriceList(row: CreditPriceList | null) {
  if (!row) return { configured: false, currency: null, packs: [], refundOnWithdrawWithinDays: null, updatedAt: null };
  return {
    configured: true,
    currency: row.currency,
    packs: row.packs.map((p) => presentPack(p, row.currency)),
    refundOnWithdrawWithinDays: row.refundOnWithdrawWithinDays,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The lab's price list, or null when it sells no credits. */
export function findPriceList(labId: string): Promise<CreditPriceList | null> {
  return CreditPriceList.findByPk(labId);
}

/**
 * Replace the active lab's price list with `body`. Packs are sorted by size and named by it
 * (pack-5); two packs of the same size are refused with 422 and nothing is stored. Audited.
 */
export async function savePriceList(ctx: RouteContext, body: PriceListBody) {
  const sizes = body.packs.map((p) => p.credits);
  const duplicate = sizes.findIndex((n, i) => sizes.indexOf(n) !== i);
  if (duplicate >= 0) {
    throw validationFailed(`Two packs hold ${sizes[duplicate]} credits; a price list has one pack per size.`, [{ pointer: `/packs/${duplicate}/credits`, message: 'is the size of another pack' }]);
  }
  const packs: StoredCreditPack[] = [...body.packs].sort((a, b) => a.credits - b.credits).map((p) => ({ id: packIdFor(p.credits), credits: p.credits, priceMinor: p.priceMinor }));
  const labId = ctx.organizationId!;
  const existing = await CreditPriceList.findByPk(labId);
  const before = existing ? presentPriceList(existing) : null;
  const values = { currency: body.currency, packs, refundOnWithdrawWithinDays: body.refundOnWithdrawWithinDays ?? null, updatedBy: ctx.principal!.userId };
  const row = existing ? await existing.update(values) : await CreditPriceList.create({ organizationId: labId, ...values });
  const after = presentPriceList(row);
  await audit(ctx, { action: 'price-list-save', entity: 'credit-price-list', entityId: labId, before, after });
  return after;
}
