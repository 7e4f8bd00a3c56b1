import nodemailer from 'nodemailer';

/** One plain-text message to send. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Sends e-mail; the services know nothing of SMTP. */
export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** A nodemailer transport over `smtpUrl` (e.g. `smtp://127.0.0.1:2525`), sending from `from`. */
export function createSmtpMailer(smtpUrl: string, from: string): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      await transport.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text });
    },
    close() {
      transport.close();
    },
  };
}
