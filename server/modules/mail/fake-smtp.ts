import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface ReceivedMail {
  from: string;
  to: string[];
  subject: string;
  text: string;
  messageId: string | null;
  receivedAt: string;
}

export interface FakeSmtp {
  host: string;
  port: number;
  received: () => ReceivedMail[];
  close: () => Promise<void>;
}

const KEEP = 500;

/**
 * A local SMTP server that accepts every message and keeps the last few hundred in memory: the
 * mail server demo mode and the tests talk to, so nothing leaves the machine.
 */
export async function startFakeSmtp(
  options: { host?: string; port?: number } = {},
): Promise<FakeSmtp> {
  const host = options.host ?? '127.0.0.1';
  const messages: ReceivedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          messages.push({
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            messageId: mail.messageId ?? null,
            receivedAt: new Date().toISOString(),
          });
          if (messages.length > KEEP) messages.splice(0, messages.length - KEEP);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return {
    host,
    port,
    received: () => [...messages],
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
