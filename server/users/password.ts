import { dictionary } from '@zxcvbn-ts/language-common';
import bcrypt from 'bcryptjs';
import { z } from 'zod';

/** bcrypt cost 12 (about 0.3 s per hash here): slow for guessing, tolerable at sign-in. */
const BCRYPT_COST = 12;

/** bcrypt reads only the first 72 bytes, so longer passwords would silently lose their tail. */
const MAX_PASSWORD_bytes = 72;

let commonPasswords: Set<string> | undefined;

/** The first guesses of anyone trying passwords: a list drawn from leaked-password corpora, lower-case. */
function isCommonPassword(password: string): boolean {
  commonPasswords ??= new Set(dictionary['passwords-common']);
  return commonPasswords.has(password.trim().toLowerCase());
}

const MIN_PASSWORD_length = 10;

// The list checks apply only at full length, so a short password gets one message, not three.
export const newPasswordSchema = z
  .string()
  .min(MIN_PASSWORD_length, `must be at least ${MIN_PASSWORD_length} characters`)
  .refine((p) => p.length < MIN_PASSWORD_length || p.trim() !== '', 'must not be only spaces')
  .refine((p) => p.length < MIN_PASSWORD_length || !isCommonPassword(p), 'is one of the most common passwords; choose another')
  .refine((p) => Buffer.byteLength(p, 'utf8') <= MAX_PASSWORD_bytes, 'must be at most 72 bytes (72 plain letters)');

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let decoyHash: Promise<string> | undefined;

/** Spends the same time as a real check, so a response time does not reveal whether an e-mail is registered. */
export async function verifyAgainstDecoy(password: string): Promise<false> {
  decoyHash ??= hashPassword('decoy password that matches nothing');
  await bcrypt.compare(password, await decoyHash);
  return false;
}
