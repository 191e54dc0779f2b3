import { createServer } from 'node:http';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { closeHttpServer, listenOnLoopback } from '../loopback-listen';
import { createInboxApp } from './inbox-app';
import { MessageStore } from './message-store';

/** Options of {@link startSmtpStandIn}. */
export type SmtpStandInOptions = {
  /** SMTP port on 127.0.0.1; 0 = ephemeral. */
  smtpPort: number;
  /** Inbox HTTP port on 127.0.0.1; 0 = ephemeral. */
  httpPort: number;
  /** Folder that keeps the messages across restarts (created when missing). */
  dataDir: string;
  /** Largest message accepted, bytes (advertised with SIZE, RFC 1870); default 25 MiB. */
  maxMessageBytes?: number;
};

/** A running SMTP stand-in with the ports it really bound. */
export type SmtpStandIn = { close(): Promise<void>; smtpPort: number; httpPort: number };

/** An smtp-server callback error carrying the SMTP reply code to send. */
type SmtpReplyError = Error & { responseCode?: number };

/**
 * Starts the local mail stand-in: a real SMTP server (smtp-server) that keeps every message on
 * disk and in memory, plus an HTTP inbox (pages and JSON API). Both listen on 127.0.0.1 only.
 *
 * Plain SMTP without STARTTLS (smtp-server's bundled certificate is expired, so a client that
 * upgraded would fail), AUTH optional so clients configured with or without credentials both work.
 *
 * @param options - ports (0 = ephemeral) and the data folder.
 * @returns the running stand-in; `close()` stops both servers.
 * @throws when a port is taken or the data folder cannot be read.
 * @example const mail = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir: '/tmp/mail' })
 */
export async function startSmtpStandIn(options: SmtpStandInOptions): Promise<SmtpStandIn> {
  const store = await MessageStore.open(options.dataDir);
  const maxMessageBytes = options.maxMessageBytes ?? 25 * 1024 * 1024;

  const smtp = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    allowInsecureAuth: true, // AUTH over plain SMTP (loopback only; STARTTLS is off anyway)
    disableReverseLookup: true, // no DNS queries for the (always loopback) client address
    logger: false,
    size: maxMessageBytes,
    closeTimeout: 2000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anonymous' }); // any credentials are accepted
    },
    onData(stream: SMTPServerDataStream, session: SMTPServerSession, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        if (stream.sizeExceeded) {
          const error: SmtpReplyError = new Error('Message exceeds fixed maximum message size');
          error.responseCode = 552; // RFC 5321 §4.5.3.1.10
          callback(error);
          return;
        }
        const envelope = {
          mailFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          rcptTo: session.envelope.rcptTo.map((rcpt) => rcpt.address),
          authUser: typeof session.user === 'string' ? session.user : null,
        };
        store.add(Buffer.concat(chunks), envelope).then(
          (message) => callback(null, `Message queued as ${message.id}`),
          (cause: unknown) => {
            console.error('[smtp stand-in] could not store a message', cause);
            const error: SmtpReplyError = new Error('Local error in processing');
            error.responseCode = 451; // transient: the client should retry
            callback(error);
          },
        );
      });
    },
  });
  smtp.on('error', (error) => console.error('[smtp stand-in] SMTP error', error));

  const http = createServer(createInboxApp(store));
  const smtpPort = await listenOnLoopback(smtp.server, options.smtpPort);
  let httpPort: number;
  try {
    httpPort = await listenOnLoopback(http, options.httpPort);
  } catch (error) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw error;
  }

  return {
    smtpPort,
    httpPort,
    async close() {
      await Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        closeHttpServer(http),
      ]);
    },
  };
}
