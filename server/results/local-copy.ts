/**
 * A stored file as a local path, for readers that need one (the results reader seeks in XLSX archives): the storage
 * may be remote, so the file is streamed into the work folder and removed again afterwards.
 */
import { randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { FileStorage } from '../storage/file-storage';

export async function withLocalCopy<T>(storage: FileStorage, key: string, workDir: string, use: (file: string) => Promise<T>): Promise<T> {
  await mkdir(workDir, { recursive: true });
  const file = path.join(workDir, `${randomUUID()}${path.extname(key)}`);
  try {
    await pipeline(await storage.stream(key), createWriteStream(file, { flags: 'wx' }));
    return await use(file);
  } finally {
    await rm(file, { force: true });
  }
}

/** A fresh path in the work folder for a file a job writes, removed after `use` whatever happens. */
export async function withScratchFile<T>(workDir: string, use: (file: string) => Promise<T>): Promise<T> {
  await mkdir(workDir, { recursive: true });
  const file = path.join(workDir, randomUUID());
  try {
    return await use(file);
  } finally {
    await rm(file, { force: true });
  }
}
