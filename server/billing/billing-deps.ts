/** What the billing routes need from the process: the database, the payment client, links and mail. */
import type Stripe from 'stripe';
import type { Sequelize, Transaction } from 'sequelize';
import type { OutgoingMail } from '../mail/mailer';
import type { RouteContext } from '../http/route';

/** Enqueue an e-mail inside a transaction, so it is sent exactly when the change commits. */
export type MailEnqueuer = (transaction: Transaction | null, mail: OutgoingMail) => Promise<void>;

/** Links and mail for the e-mails billing sends (report-service's deps satisfy this too). */
export interface CreditMailDeps {
  /** Base of links in e-mails and of the checkout's return URLs, e.g. https://sidecheck.example. */
  publicUrl: string;
  enqueueMail: MailEnqueuer;
}

export interface BillingDeps extends CreditMailDeps {
  sequelize: Sequelize;
  /** The official SDK, pointed by configuration at the provider or the local stand-in. */
  payments: Stripe;
  /** Secret the provider signs webhook deliveries with (Stripe-Signature). */
  webhookSecret: string;
}

/** The part of a request's context billing functions use: who acts, in which organization and transaction. */
export type BillingActor = Pick<RouteContext, 'organizationId' | 'principal' | 'transaction'> & { req?: RouteContext['req'] };
