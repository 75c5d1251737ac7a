import nodemailer from 'nodemailer';
import type { ServerConfig } from '../config.js';
import { type CapturedMail, startFakeSmtp } from './fake-smtp.js';

/** One outgoing plain-text e-mail. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Sends e-mail over SMTP (nodemailer). */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  /** Messages captured by the local fake SMTP server; null when mail goes to a real SMTP server. */
  readonly captured: readonly CapturedMail[] | null;
  close(): Promise<void>;
}

/** The development mailbox's messages, or null when there is none (production, or mail goes to `SMTP_URL`). */
export function devMailbox(config: ServerConfig, mailer: Mailer): readonly CapturedMail[] | null {
  return config.isProduction ? null : mailer.captured;
}

/** A mailer over `SMTP_URL`, or over a local fake SMTP server that captures every message when it is absent. */
export async function createMailer(config: ServerConfig): Promise<Mailer> {
  const fake = config.smtpUrl ? null : await startFakeSmtp();
  const transport = fake
    ? nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true })
    : nodemailer.createTransport(config.smtpUrl as string);
  return {
    captured: fake ? fake.messages : null,
    async send(mail) {
      await transport.sendMail({ from: config.mailFrom, to: mail.to, subject: mail.subject, text: mail.text });
    },
    async close() {
      transport.close();
      await fake?.close();
    },
  };
}
