import nodemailer from 'nodemailer';
import type { Config } from '../config/config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: { filename: string; contentBase64: string; contentType: string }[];
}

/** SMTP through nodemailer: the local stand-in by default, any SMTP server by configuration. */
export function createMailer(config: Config['smtp']) {
  const transport = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: false,
    ignoreTLS: config.host === '127.0.0.1',
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
  return {
    async send(mail: OutgoingMail): Promise<string> {
      const info = await transport.sendMail({
        from: config.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        attachments: mail.attachments?.map((a) => ({ filename: a.filename, content: Buffer.from(a.contentBase64, 'base64'), contentType: a.contentType })),
      });
      return info.messageId;
    },
    close: () => transport.close(),
  };
}
export type Mailer = ReturnType<typeof createMailer>;
