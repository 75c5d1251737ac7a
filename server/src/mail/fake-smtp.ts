import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';

/** A message the fake SMTP server received, parsed by mailparser. */
export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** A local SMTP server (127.0.0.1, ephemeral port) that keeps every message it receives in memory. */
export interface FakeSmtp {
  readonly port: number;
  readonly messages: CapturedMail[];
  close(): Promise<void>;
}

/** Keeps at most this many messages (oldest dropped first). */
const MAX_MESSAGES = 500;

/** Starts the fake SMTP server used in development and tests when no `SMTP_URL` is set. */
export async function startFakeSmtp(): Promise<FakeSmtp> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          messages.push({
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
          });
          if (messages.length > MAX_MESSAGES) messages.splice(0, messages.length - MAX_MESSAGES);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    port,
    messages,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
