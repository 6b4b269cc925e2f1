/** The finding e-mails, in the foundation's mail layout: one short message with one link. */
import { renderMail } from '../mail/mail-layout';
import type { MailMessage } from '../mail/mailer';

export interface MailRecipient {
  email: string;
  name: string;
}

export interface MailProject {
  name: string;
  code: string;
}

export interface MailedFinding {
  /** "F-0012" */
  reference: string;
  title: string;
  url: string;
}

const SWITCH_OFF = 'You can switch these e-mails off in Taulens: open the findings of any project, then Notification settings.';
/** Comments are quoted only this far; the link shows the rest. */
const QUOTE_CHARS = 600;
const LISTED_FINDINGS = 20;

function quote(text: string): string {
  const trimmed = text.trim();
  return trimmed.length > QUOTE_CHARS ? `${trimmed.slice(0, QUOTE_CHARS)}…` : trimmed;
}

function named(finding: MailedFinding): string {
  return `${finding.reference} “${finding.title}”`;
}

export function assignedMail(
  recipient: MailRecipient,
  project: MailProject,
  actorName: string,
  findings: readonly MailedFinding[],
  listUrl: string,
): MailMessage {
  const single = findings.length === 1 ? findings[0] : undefined;
  const listed = findings.slice(0, LISTED_FINDINGS).map(named);
  const more = findings.length - listed.length;
  return renderMail({
    to: recipient.email,
    subject: single
      ? `[${project.code}] ${single.reference} assigned to you: ${single.title}`
      : `[${project.code}] ${findings.length} findings assigned to you`,
    greeting: `Hello ${recipient.name},`,
    paragraphs: single
      ? [`${actorName} assigned the finding ${named(single)} in ${project.name} to you.`]
      : [
          `${actorName} assigned ${findings.length} findings in ${project.name} to you:`,
          listed.join('\n') + (more > 0 ? `\n… and ${more} more` : ''),
        ],
    action: single ? { label: 'Open the finding', url: single.url } : { label: 'Open your findings', url: listUrl },
    notes: [SWITCH_OFF],
  });
}

export interface StatusChangeText {
  fromLabel: string;
  toLabel: string;
  /** Null when a check run made the change. */
  actorName: string | null;
  justification?: string | null;
}

export function statusChangedMail(
  recipient: MailRecipient,
  project: MailProject,
  finding: MailedFinding,
  change: StatusChangeText,
): MailMessage {
  const who = change.actorName ?? 'A check run of a newer model revision';
  const paragraphs = [`${who} moved the finding ${named(finding)} in ${project.name} from ${change.fromLabel} to ${change.toLabel}.`];
  if (change.justification) paragraphs.push(`Justification: ${quote(change.justification)}`);
  return renderMail({
    to: recipient.email,
    subject: `[${project.code}] ${finding.reference} is now ${change.toLabel}: ${finding.title}`,
    greeting: `Hello ${recipient.name},`,
    paragraphs,
    action: { label: 'Open the finding', url: finding.url },
    notes: ['You get this e-mail because the finding is assigned to you or you raised it.', SWITCH_OFF],
  });
}

export function mentionedMail(
  recipient: MailRecipient,
  project: MailProject,
  finding: MailedFinding,
  actorName: string,
  comment: string,
): MailMessage {
  return renderMail({
    to: recipient.email,
    subject: `[${project.code}] ${actorName} mentioned you on ${finding.reference}: ${finding.title}`,
    greeting: `Hello ${recipient.name},`,
    paragraphs: [`${actorName} mentioned you in a comment on the finding ${named(finding)} in ${project.name}:`, quote(comment)],
    action: { label: 'Open the finding', url: finding.url },
    notes: [SWITCH_OFF],
  });
}
