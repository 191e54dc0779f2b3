/**
 * Billing: report credits a lab sells to its clients. Lab side: price list, sales, adjustments.
 * Manufacturer side: offers, checkout, balance. Both: purchases, receipts, the ledger. The
 * provider's webhook is public and verified by its signature (webhook-route.ts).
 */
import { fileAnswer, route, type RouteDef } from '../http/route';
import { notFound } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { CreditReceipt } from '../db/models';
import { findPriceList, presentPriceList, savePriceList } from './price-list';
import { startCheckout } from './start-checkout';
import { adjustCredits } from './adjust-credits';
import { billingSide } from './billing-side';
import { findPurchase, listPurchases, PURCHASE_FILTERS, PURCHASE_SORTS } from './list-purchases';
import { presentPurchase } from './purchase-presenter';
import { LEDGER_FILTERS, listLedger } from './list-ledger';
import { BALANCE_SORTS, salesOverview } from './sales-overview';
import { manufacturerAccounts } from './manufacturer-accounts';
import { webhookRoute } from './webhook-route';
import type { BillingDeps } from './billing-deps';
import { checkoutSchema, creditAdjustmentSchema, priceListSchema, type CheckoutBody, type CreditAdjustmentBody, type PriceListBody } from '../../shared/schemas/billing';

const LAB_BILLING = ['lab-admin', 'billing'] as const;
const MANUFACTURER = ['manufacturer-admin', 'manufacturer-viewer'] as const;
const BOTH_SIDES = [...LAB_BILLING, ...MANUFACTURER] as const;

/** The billing routes; `deps` is read only when a request arrives (the access test builds the table without it). */
export function billingRoutes(deps: BillingDeps): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/billing/price-list',
      summary: 'The lab’s packs of report credits and its refund policy',
      access: { kind: 'member', roles: LAB_BILLING },
      handler: async (ctx) => presentPriceList(await findPriceList(ctx.organizationId!)),
    }),
    route<PriceListBody>({
      method: 'put',
      path: '/billing/price-list',
      summary: 'Replace the lab’s price list (currency, packs of credits, refund policy)',
      access: { kind: 'member', roles: LAB_BILLING },
      bodySchema: priceListSchema,
      handler: (ctx) => savePriceList(ctx, ctx.body),
    }),
    route<CreditAdjustmentBody>({
      method: 'post',
      path: '/billing/adjustments',
      summary: 'Add or take away credits of a client by hand, with the reason',
      access: { kind: 'member', roles: LAB_BILLING },
      bodySchema: creditAdjustmentSchema,
      handler: (ctx) => adjustCredits(deps.sequelize, ctx, ctx.body),
    }),
    route({
      method: 'get',
      path: '/billing/sales',
      summary: 'Lab overview: purchase totals and every client’s credit balance',
      access: { kind: 'member', roles: LAB_BILLING },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(BALANCE_SORTS), filterable: ['search'], defaultSort: 'name' });
        return salesOverview(deps.sequelize, ctx.organizationId!, q);
      },
    }),
    route({
      method: 'get',
      path: '/billing/offers',
      summary: 'The packs of credits each lab you are a client of sells, with your balance there',
      access: { kind: 'member', roles: MANUFACTURER },
      handler: async (ctx) => ({ items: await manufacturerAccounts(deps.sequelize, ctx.organizationId!) }),
    }),
    route({
      method: 'get',
      path: '/billing/balance',
      summary: 'Manufacturer overview: your report credits at each lab',
      access: { kind: 'member', roles: MANUFACTURER },
      async handler(ctx) {
        const accounts = await manufacturerAccounts(deps.sequelize, ctx.organizationId!);
        return { items: accounts.map(({ packs: _packs, currency: _currency, ...account }) => account), totalCredits: accounts.reduce((sum, a) => sum + a.balance, 0) };
      },
    }),
    route<CheckoutBody>({
      method: 'post',
      path: '/billing/checkout',
      summary: 'Start paying for a pack of credits; answers the payment page to send the buyer to',
      access: { kind: 'member', roles: ['manufacturer-admin'] },
      bodySchema: checkoutSchema,
      handler: (ctx) => startCheckout(deps, ctx, ctx.body),
    }),
    webhookRoute(deps),
    route({
      method: 'get',
      path: '/billing/purchases',
      summary: 'Purchases of credits: a lab’s sales or a manufacturer’s own, paginated',
      access: { kind: 'member', roles: BOTH_SIDES },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(PURCHASE_SORTS), filterable: PURCHASE_FILTERS, defaultSort: '-createdAt' });
        const { items, total } = await listPurchases(deps.sequelize, billingSide(ctx), ctx.organizationId!, q);
        return page(items.map(presentPurchase), total, q);
      },
    }),
    route({
      method: 'get',
      path: '/billing/purchases/:id',
      summary: 'One purchase, with a sentence on where it stands (shown on return from the payment page)',
      access: { kind: 'member', roles: BOTH_SIDES },
      async handler(ctx) {
        const row = await findPurchase(deps.sequelize, billingSide(ctx), ctx.organizationId!, ctx.params.id);
        if (!row) throw notFound('The purchase');
        return presentPurchase(row);
      },
    }),
    route({
      method: 'get',
      path: '/billing/purchases/:id/receipt',
      summary: 'Download the PDF receipt of a completed purchase',
      access: { kind: 'member', roles: BOTH_SIDES },
      async handler(ctx) {
        const row = await findPurchase(deps.sequelize, billingSide(ctx), ctx.organizationId!, ctx.params.id);
        const receipt = row && (await CreditReceipt.findByPk(row.id));
        if (!receipt) throw notFound('The receipt');
        return fileAnswer({ contentType: 'application/pdf', filename: `${receipt.receiptNumber}.pdf`, body: receipt.pdf });
      },
    }),
    route({
      method: 'get',
      path: '/billing/ledger',
      summary: 'The credit ledger as a statement, with the balance after each row',
      access: { kind: 'member', roles: BOTH_SIDES },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['createdAt'], filterable: LEDGER_FILTERS, defaultSort: '-createdAt' });
        const { items, total } = await listLedger(deps.sequelize, billingSide(ctx), ctx.organizationId!, q);
        return page(items, total, q);
      },
    }),
  ];
}
