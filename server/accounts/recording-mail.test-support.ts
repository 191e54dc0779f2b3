/**
 * A MailSender for tests that keeps each mail once its transaction commits (as the real queue
 * would deliver it), so a test can follow the link in an invitation or reset e-mail.
 */
import type { OutgoingMail } from '../mail/mailer';
import type { MailSender } from './account-deps';

export interface RecordingMail extends MailSender {
  sent: OutgoingMail[];
  /** The last mail to `to`; throws when there is none. */
  lastTo(to: string): OutgoingMail;
  /** The token at the end of the first link under `path` (e.g. "/invitations/") in the last mail to `to`. */
  tokenFrom(to: string, path: string): string;
}

export function recordingMail(): RecordingMail {
  const sent: OutgoingMail[] = [];
  return {
    sent,
    async enqueue(transaction, mail) {
      if (transaction) transaction.afterCommit(() => void sent.push(mail));
      else sent.push(mail);
    },
    lastTo(to) {
      const mail = [...sent].reverse().find((m) => m.to.toLowerCase() === to.toLowerCase());
      if (!mail) throw new Error(`no mail to ${to}; sent: ${sent.map((m) => m.to).join(', ')}`);
      return mail;
    },
    tokenFrom(to, path) {
      const text = this.lastTo(to).text;
      const match = new RegExp(`${path.replace(/[/]/g, '\\/')}([A-Za-z0-9_-]+)`).exec(text);
      if (!match) throw new Error(`no ${path} link in the mail to ${to}`);
      return match[1];
    },
  };
}
