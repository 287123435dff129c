import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { AddressInfo } from 'node:net';

export interface Catcher {
  port: number;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

/**
 * A real SMTP server on 127.0.0.1 (smtp-server) that keeps every message in `caught_mail`, so
 * that any app server can list what was "sent" in development and tests.
 */
export async function startCatcher(db: Knex, log: Logger): Promise<Catcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) =>
          db('caught_mail').insert({
            mail_from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            rcpt_to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text_body: mail.text ?? '',
            attachments: JSON.stringify(mail.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size }))),
            size_bytes: stream.byteLength ?? 0,
          }),
        )
        .then(() => callback())
        .catch((err: Error) => {
          log.error({ err }, 'could not store caught mail');
          callback(err);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
