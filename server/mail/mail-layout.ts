import type { MailMessage } from './mailer';

export interface MailContent {
  to: string;
  subject: string;
  greeting: string;
  paragraphs: string[];
  action: { label: string; url: string };
  /** Small print after the button, e.g. expiry and "ignore this if…". */
  notes: string[];
}

/** One plain-text and one HTML rendering of the same short message with a single link. */
export function renderMail(content: MailContent): MailMessage {
  const text = [
    content.greeting,
    '',
    ...content.paragraphs.flatMap((p) => [p, '']),
    `${content.action.label}: ${content.action.url}`,
    '',
    ...content.notes,
    '',
    '— Taulens',
  ].join('\n');

  const html = [
    '<!doctype html><html><body style="font-family:Inter,Arial,sans-serif;color:#1b1c1c;line-height:1.5">',
    `<p>${escapeHtml(content.greeting)}</p>`,
    ...content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><a href="${escapeHtml(content.action.url)}" style="display:inline-block;padding:10px 18px;border-radius:20px;background:#2E5E5A;color:#ffffff;text-decoration:none">${escapeHtml(content.action.label)}</a></p>`,
    `<p style="font-size:13px">Or open this address: ${escapeHtml(content.action.url)}</p>`,
    ...content.notes.map((n) => `<p style="font-size:13px;color:#5c5f5e">${escapeHtml(n)}</p>`),
    '<p>— Taulens</p>',
    '</body></html>',
  ].join('\n');

  return { to: content.to, subject: content.subject, text, html };
}

/** Dates in e-mails are shown in UTC, since the reader's time zone is unknown. */
export function formatUtc(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}
