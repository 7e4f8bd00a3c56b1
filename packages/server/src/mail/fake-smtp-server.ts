import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** A message the fake SMTP server received, parsed. */
export interface ReceivedMail {
  id: number;
  receivedAt: Date;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** A local SMTP server for development and tests that keeps every message it receives in memory. */
export interface FakeSmtpServer {
  /** `smtp://127.0.0.1:<port>`, for nodemailer. */
  url: string;
  /** Every message so far, oldest first. */
  messages(): ReceivedMail[];
  close(): Promise<void>;
}

/** Starts the fake SMTP server on loopback; port 0 picks a free port. */
export async function startFakeSmtpServer(port = 0): Promise<FakeSmtpServer> {
  const received: ReceivedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          received.push({
            id: received.length + 1,
            receivedAt: new Date(),
            from: session.envelope.mailFrom === false ? '' : session.envelope.mailFrom.address,
            to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
          });
          callback();
        })
        .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${address.port}`,
    messages: () => [...received],
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
