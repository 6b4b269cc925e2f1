import { createHash, randomBytes } from 'node:crypto';

/** A link token (sent by e-mail) and the hash we keep, so a database leak reveals no usable link. */
export interface LinkToken {
  token: string;
  tokenHash: string;
}

export function createLinkToken(): LinkToken {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
