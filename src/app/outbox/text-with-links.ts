/** A run of message text: plain, or a web address to render as a link. */
export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; href: string };

// Trailing punctuation usually ends the sentence, not the address.
const URL_PATTERN = /https?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]]/g;

/** Splits plain e-mail text so its http(s) addresses can be shown as links and nothing else as markup. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index;
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', href: match[0] });
    last = start + match[0].length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}
