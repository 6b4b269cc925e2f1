import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, readFile, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { NotFoundError, PayloadTooLargeError } from '../http/errors';
import { type FileStorage, type StoredFile, assertStorageKey } from './file-storage';

/** Files under `<root>/<key>`; writes go to `<root>/.partial/` first and are renamed into place. */
export class LocalFileStorage implements FileStorage {
  private readonly partialDir: string;

  constructor(private readonly root: string) {
    this.partialDir = path.join(root, '.partial');
  }

  async put(key: string, content: Buffer | Uint8Array | Readable, options: { maxBytes?: number } = {}): Promise<StoredFile> {
    const target = this.pathOf(key);
    await mkdir(this.partialDir, { recursive: true });
    await mkdir(path.dirname(target), { recursive: true });
    const partial = path.join(this.partialDir, randomUUID());
    const hash = createHash('sha256');
    let size_bytes = 0;
    const measure = new Transform({
      transform(chunk: Buffer, _encoding, done) {
        size_bytes += chunk.length;
        if (options.maxBytes !== undefined && size_bytes > options.maxBytes) {
          done(new PayloadTooLargeError(`The file is larger than ${options.maxBytes} bytes.`));
          return;
        }
        hash.update(chunk);
        done(null, chunk);
      },
    });
    const source = content instanceof Readable ? content : Readable.from([Buffer.from(content)]);
    try {
      await pipeline(source, measure, createWriteStream(partial, { flags: 'wx' }));
      await rename(partial, target);
    } catch (error) {
      await rm(partial, { force: true });
      throw error;
    }
    return { key, size_bytes, sha256: hash.digest('hex') };
  }

  async get(key: string): Promise<Buffer> {
    try {
      return await readFile(this.pathOf(key));
    } catch (error) {
      throw missingAs404(error, key);
    }
  }

  async stream(key: string): Promise<Readable> {
    if ((await this.size(key)) === null) throw fileNotFound(key);
    return createReadStream(this.pathOf(key));
  }

  async size(key: string): Promise<number | null> {
    try {
      const info = await stat(this.pathOf(key));
      return info.isFile() ? info.size : null;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async deletePrefix(prefix: string): Promise<void> {
    await rm(this.pathOf(prefix), { force: true, recursive: true });
  }

  private pathOf(key: string): string {
    assertStorageKey(key);
    return path.join(this.root, ...key.split('/'));
  }
}

function missingAs404(error: unknown, key: string): unknown {
  return (error as NodeJS.ErrnoException).code === 'ENOENT' ? fileNotFound(key) : error;
}

function fileNotFound(key: string): NotFoundError {
  return new NotFoundError(`The stored file ${key} is missing.`, { code: 'file_not_found' });
}
