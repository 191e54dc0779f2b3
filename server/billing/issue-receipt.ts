/** The PDF receipt of a completed purchase: numbered per lab and year, rendered once, stored as a record. */
import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { Client, CreditReceipt, Organization, User, type CreditPurchase } from '../db/models';
import { nextCounter } from '../runs/run-number';
import { renderReceiptPdf } from '../../templates/receipt/render-receipt';
import type { ReceiptDocument } from '../../templates/receipt/receipt-document';

/**
 * Number (LABCODE-RYYYY-NNNN, gap-free per lab and year), render and store the receipt of
 * `purchase`, which must be completed in the caller's transaction. Returns the stored row and
 * what the e-mail needs.
 * @example (await issueReceipt(sequelize, purchase, { paymentReference: 'pi_1', balanceAfter: 8 })).receipt.receiptNumber // 'KBRTL-R2026-0001'
 */
export async function issueReceipt(sequelize: Sequelize, purchase: CreditPurchase, input: { paymentReference: string; balanceAfter: number }) {
  const lab = (await Organization.findByPk(purchase.organizationId))!;
  const client = (await Client.findByPk(purchase.clientId))!;
  const buyer = purchase.boughtBy ? await User.findByPk(purchase.boughtBy) : null;
  const paidAt = purchase.completedAt ?? new Date();
  const year = paidAt.getUTCFullYear();
  const n = await nextCounter(sequelize, lab.id, `receipt-${year}`, null);
  const receiptNumber = `${lab.code}-R${year}-${String(n).padStart(4, '0')}`;
  const doc: ReceiptDocument = {
    receiptNumber,
    paidAt: paidAt.toISOString(),
    issuedAt: new Date().toISOString(),
    seller: { name: lab.name, addressLines: lab.addressLines, email: lab.email ?? undefined, phone: lab.phone ?? undefined },
    buyer: { name: client.name, addressLines: client.addressLines, contactName: client.contactName },
    currency: purchase.currency,
    lines: [{ description: purchase.credits === 1 ? 'Report credit' : `Report credits, pack of ${purchase.credits}`, quantity: 1, unitPriceMinor: purchase.amountMinor }],
    payment: { method: 'Card payment', reference: input.paymentReference, paidBy: buyer?.email },
    balanceAfterCredits: input.balanceAfter,
  };
  const { pdf } = await renderReceiptPdf(doc);
  const receipt = await CreditReceipt.create({
    purchaseId: purchase.id,
    organizationId: lab.id,
    clientId: client.id,
    receiptNumber,
    sha256: crypto.createHash('sha256').update(pdf).digest('hex'),
    pdf,
    issuedAt: new Date(doc.issuedAt),
  });
  return { receipt, lab, client, buyer };
}
