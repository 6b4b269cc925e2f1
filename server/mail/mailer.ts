import nodemailer, { type Transporter } from 'nodemailer';
import type { SmtpConfig } from '../config';
import { DependencyFailedError } from '../http/errors';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** Sends e-mail over SMTP; `send` resolves once the SMTP server has accepted the message. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/** Where to deliver: the configured SMTP host, or the built-in fake server on loopback. */
export type SmtpTarget = SmtpConfig | { fakeServerPort: number; from: string };

export function createMailer(target: SmtpTarget): Mailer {
  const transport: Transporter =
    'fakeServerPort' in target
      ? nodemailer.createTransport({ host: '127.0.0.1', port: target.fakeServerPort, secure: false, ignoreTLS: true })
      : nodemailer.createTransport({
          host: target.host,
          port: target.port,
          secure: target.port === 465,
          auth: target.user ? { user: target.user, pass: target.pass ?? '' } : undefined,
        });
  return {
    async send(message) {
      try {
        await transport.sendMail({ from: target.from, ...message });
      } catch (error) {
        throw new DependencyFailedError('The e-mail could not be sent. Check the SMTP settings and try again.', {
          code: 'mail_failed',
          cause: error,
        });
      }
    },
    close() {
      transport.close();
    },
  };
}
