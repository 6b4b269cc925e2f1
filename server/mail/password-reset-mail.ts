import { formatUtc, renderMail } from './mail-layout';
import type { MailMessage } from './mailer';

export interface PasswordResetMailInput {
  to: string;
  name: string;
  resetUrl: string;
  expiresAt: Date;
  /** True when an administrator asked for it rather than the user. */
  byAdmin: boolean;
}

export function passwordResetMail(input: PasswordResetMailInput): MailMessage {
  return renderMail({
    to: input.to,
    subject: 'Choose a new Taulens password',
    greeting: `Hello ${input.name},`,
    paragraphs: [
      input.byAdmin
        ? 'An administrator asked Taulens to send you a link to choose a new password.'
        : 'Someone (hopefully you) asked to reset the password of your Taulens account.',
      'Open the link below to choose a new password. Setting it signs you out on every device.',
    ],
    action: { label: 'Choose a new password', url: input.resetUrl },
    notes: [
      `The link works once and expires on ${formatUtc(input.expiresAt)}.`,
      'If you did not ask for this, ignore this e-mail: your password stays as it is.',
    ],
  });
}
