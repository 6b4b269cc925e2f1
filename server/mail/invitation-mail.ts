import { formatUtc, renderMail } from './mail-layout';
import type { MailMessage } from './mailer';

export interface InvitationMailInput {
  to: string;
  inviteeName: string;
  inviterName: string;
  /** Present when the invitation also makes the invitee a project member. */
  project?: { name: string; role: string };
  acceptUrl: string;
  expiresAt: Date;
  /** The address has an account: the invitee signs in to join instead of creating one. */
  hasAccount: boolean;
}

export function invitationMail(input: InvitationMailInput): MailMessage {
  const where = input.project ? ` as ${input.project.role} in the project “${input.project.name}”` : '';
  return renderMail({
    to: input.to,
    subject: input.project ? `You are invited to ${input.project.name} on Taulens` : 'You are invited to Taulens',
    greeting: input.inviteeName ? `Hello ${input.inviteeName},` : 'Hello,',
    paragraphs: [
      `${input.inviterName} invited you to Taulens${where}. Taulens checks the web shear of the steel members in a structural model.`,
      input.hasAccount
        ? 'You already have a Taulens account with this address: open the link below and sign in to join.'
        : 'Open the link below, confirm your name and choose a password to create your account.',
    ],
    action: { label: 'Accept the invitation', url: input.acceptUrl },
    notes: [
      `The link works once and expires on ${formatUtc(input.expiresAt)}.`,
      'If you did not expect this invitation, you can ignore this e-mail.',
    ],
  });
}
