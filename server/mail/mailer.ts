import nodemailer, { type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { Knex } from 'knex';
import type { Config } from '../config/env.ts';
import { startCatcher, type Catcher } from './catcher.ts';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Uint8Array; contentType?: string }[];
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
  /** True when mail goes to the local catcher (development and tests). */
  readonly catching: boolean;
  close(): Promise<void>;
}

/**
 * Mail goes through nodemailer: to SMTP_URL where set, otherwise (outside production) to an SMTP
 * catcher that the app starts on loopback and that stores what it receives in the database.
 */
export async function createMailer(config: Config, db: Knex, log: Logger): Promise<Mailer> {
  let catcher: Catcher | undefined;
  let transport: Transporter;
  if (config.SMTP_URL) {
    transport = nodemailer.createTransport(config.SMTP_URL);
  } else if (config.NODE_ENV !== 'production') {
    catcher = await startCatcher(db, log);
    transport = nodemailer.createTransport({ host: '127.0.0.1', port: catcher.port, secure: false, ignoreTLS: true });
    log.info({ port: catcher.port }, 'SMTP catcher listening on loopback; caught mail is listed on the admin mail page');
  } else {
    transport = nodemailer.createTransport({ jsonTransport: true });
    log.warn('SMTP_URL is not set: e-mails cannot be delivered in production');
  }
  return {
    catching: Boolean(catcher),
    async send(mail) {
      if (config.NODE_ENV === 'production' && !config.SMTP_URL) throw new Error('No SMTP server is configured (SMTP_URL).');
      const info = await transport.sendMail({
        from: config.MAIL_FROM,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        attachments: mail.attachments?.map((a) => ({ filename: a.filename, content: Buffer.from(a.content), contentType: a.contentType })),
      });
      return { messageId: info.messageId };
    },
    async close() {
      transport.close();
      await catcher?.close();
    },
  };
}
