/** Who a comment mentions: "@address@example.com" or "@Full Name" of a project member, in any letter case. */

export interface Mentionable {
  id: string;
  email: string;
  name: string;
}

const WORD_CHAR = /[\p{L}\p{N}_@-]/u;

/** Whether the text goes on with the same word at `index`; a full stop ends a mention unless more follows. */
function continuesWord(text: string, index: number): boolean {
  const next = text.charAt(index);
  if (next === '.') return WORD_CHAR.test(text.charAt(index + 1));
  return next !== '' && WORD_CHAR.test(next);
}

/** A mention must not run on into a longer word ("@Ann" is not "@Anna"). */
function mentionedAt(text: string, handle: string): boolean {
  const lower = text.toLowerCase();
  const needle = `@${handle.toLowerCase()}`;
  for (let at = lower.indexOf(needle); at !== -1; at = lower.indexOf(needle, at + 1)) {
    if (!continuesWord(lower, at + needle.length)) return true;
  }
  return false;
}

/** The members mentioned, each once, in member order. */
export function mentionedMembers<T extends Mentionable>(text: string, members: readonly T[]): T[] {
  if (!text.includes('@')) return [];
  return members.filter((member) => mentionedAt(text, member.email) || (member.name.trim() !== '' && mentionedAt(text, member.name.trim())));
}
