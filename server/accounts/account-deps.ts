/**
 * What the people-and-access routes need from the process: the database, the sign-in token
 * settings (sign-up and invitation acceptance answer like sign-in), the public address for links
 * in e-mails, and the mail queue.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { TokenSettings } from '../auth/tokens';
import type { OutgoingMail } from '../mail/mailer';

/**
 * Sends mail by enqueueing it in the caller's transaction (server/mail/mail-queue.ts), so a
 * rolled-back change sends nothing. Tests may pass a recording stand-in.
 */
export interface MailSender {
  enqueue(transaction: Transaction | null, mail: OutgoingMail): Promise<void>;
}

export interface AccountDeps {
  sequelize: Sequelize;
  tokens: TokenSettings;
  secureCookies: boolean;
  /** Base of links in e-mails, e.g. https://sidecheck.example (no trailing slash). */
  publicUrl: string;
  mail: MailSender;
}
