import { randomBytes } from 'node:crypto';
import { readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * The configured secret, or the one generated on first start and kept in dataDir, so sessions
 * survive restarts without anyone having to invent a secret.
 */
export async function resolveSessionSecret(options: { configured?: string; dataDir: string }): Promise<string> {
  if (options.configured) return options.configured;
  const file = path.join(options.dataDir, 'session-secret');
  try {
    const stored = (await readFile(file, 'utf8')).trim();
    if (stored.length >= 32) return stored;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
  }
  const secret = randomBytes(48).toString('hex');
  await writeFile(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
