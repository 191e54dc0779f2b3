/** The payment provider's customer for the paying organization: created on its first checkout, reused after. */
import type Stripe from 'stripe';
import type { Sequelize } from 'sequelize';
import { Organization, PaymentCustomer } from '../db/models';
import type { BillingActor } from './billing-deps';

/**
 * The stored customer id of the active organization, or a new customer (name, e-mail, our
 * organization id in metadata). The idempotency key is the organization, so two first checkouts
 * at once make one customer at the provider; the insert ignores the loser of that race.
 * @example await ensurePaymentCustomer(payments, sequelize, ctx) // 'cus_...'
 */
export async function ensurePaymentCustomer(payments: Stripe, sequelize: Sequelize, ctx: BillingActor): Promise<string> {
  const organizationId = ctx.organizationId!;
  const stored = await PaymentCustomer.findByPk(organizationId);
  if (stored) return stored.providerCustomerId;
  const org = (await Organization.findByPk(organizationId))!;
  const customer = await payments.customers.create(
    { name: org.name, email: org.email ?? ctx.principal?.email, metadata: { organizationId } },
    { idempotencyKey: `sidecheck-customer-${organizationId}` },
  );
  await sequelize.query('INSERT INTO payment_customers (organization_id, provider_customer_id) VALUES (:organizationId, :id) ON CONFLICT (organization_id) DO NOTHING', {
    replacements: { organizationId, id: customer.id },
  });
  return (await PaymentCustomer.findByPk(organizationId))!.providerCustomerId;
}
