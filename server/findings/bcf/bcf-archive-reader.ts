/**
 * Reads a zip archive held in memory with yauzl, refusing archives that are not zips, are encrypted, or would
 * expand beyond the limits (entry count, size per entry, total size, compression ratio). Limits are checked on the
 * sizes the central directory declares before anything is inflated, and yauzl checks while inflating that no entry
 * produces more than it declared.
 */
import yauzl from 'yauzl';
import { PayloadTooLargeError, ValidationError } from '../../http/errors';

export interface ArchiveLimits {
  /** Size of the archive itself. */
  maxArchiveBytes: number;
  maxEntries: number;
  /** Uncompressed size of any one entry. */
  maxEntryBytes: number;
  /** Uncompressed size of all entries together. */
  maxTotalBytes: number;
  /** Largest uncompressed/compressed ratio for entries above `ratioCheckFromBytes`. */
  maxCompressionRatio: number;
  ratioCheckFromBytes: number;
}

/**
 * Sized for a large issue list: a few thousand topics with a snapshot each. XML deflates about 5–20×, PNG hardly at
 * all (common practice, no source), so 200× only ever comes from padding made to expand.
 */
export const DEFAULT_ARCHIVE_LIMITS: ArchiveLimits = {
  maxArchiveBytes: 100 * 1024 * 1024,
  maxEntries: 50_000,
  maxEntryBytes: 32 * 1024 * 1024,
  maxTotalBytes: 512 * 1024 * 1024,
  maxCompressionRatio: 200,
  ratioCheckFromBytes: 1024 * 1024,
};

function sizeText(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MiB`;
}

function notAZip(reason: string): ValidationError {
  return new ValidationError(`The file is not a BCF archive: it is not a readable zip file (${reason}).`, {
    code: 'bcf_not_zip',
  });
}

function refused(message: string, limit: string): PayloadTooLargeError {
  return new PayloadTooLargeError(`The BCF archive was refused: ${message}.`, { code: 'bcf_archive_refused', details: { limit } });
}

function openZip(archive: Buffer): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(archive, { lazyEntries: true, autoClose: false, validateEntrySizes: true, strictFileNames: false }, (error, zip) =>
      error ? reject(notAZip(error.message)) : resolve(zip),
    );
  });
}

function listEntries(zip: yauzl.ZipFile): Promise<yauzl.Entry[]> {
  return new Promise((resolve, reject) => {
    const entries: yauzl.Entry[] = [];
    zip.on('entry', (entry: yauzl.Entry) => {
      entries.push(entry);
      zip.readEntry();
    });
    zip.on('end', () => resolve(entries));
    zip.on('error', (error: Error) => reject(notAZip(error.message)));
    zip.readEntry();
  });
}

function checkEntries(entries: readonly yauzl.Entry[], limits: ArchiveLimits): void {
  let total = 0;
  const names = new Set<string>();
  for (const entry of entries) {
    if (entry.isEncrypted()) throw notAZip(`${entry.fileName} is encrypted`);
    if (names.has(entry.fileName)) throw notAZip(`${entry.fileName} appears twice`);
    names.add(entry.fileName);
    if (entry.uncompressedSize > limits.maxEntryBytes) {
      throw refused(`${entry.fileName} would expand to ${sizeText(entry.uncompressedSize)}, above the ${sizeText(limits.maxEntryBytes)} allowed per file`, 'maxEntryBytes');
    }
    const ratio = entry.uncompressedSize / Math.max(1, entry.compressedSize);
    if (entry.uncompressedSize >= limits.ratioCheckFromBytes && ratio > limits.maxCompressionRatio) {
      throw refused(`${entry.fileName} expands ${Math.round(ratio)} times, more than the ${limits.maxCompressionRatio} times a real BCF file does`, 'maxCompressionRatio');
    }
    total += entry.uncompressedSize;
    if (total > limits.maxTotalBytes) {
      throw refused(`its files would expand to more than ${sizeText(limits.maxTotalBytes)} in total`, 'maxTotalBytes');
    }
  }
}

function readEntry(zip: yauzl.ZipFile, entry: yauzl.Entry, limits: ArchiveLimits): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (error, stream) => {
      if (error) return reject(notAZip(`${entry.fileName}: ${error.message}`));
      const chunks: Buffer[] = [];
      let size = 0;
      stream.on('data', (chunk: Buffer) => {
        size += chunk.length;
        // yauzl already stops at the declared size; this guards the limit itself.
        if (size > limits.maxEntryBytes) {
          stream.destroy();
          reject(refused(`${entry.fileName} expands beyond ${sizeText(limits.maxEntryBytes)}`, 'maxEntryBytes'));
          return;
        }
        chunks.push(chunk);
      });
      stream.on('end', () => resolve(Buffer.concat(chunks)));
      stream.on('error', (streamError: Error) => reject(notAZip(`${entry.fileName}: ${streamError.message}`)));
    });
  });
}

/** Names of every file entry (directories left out) and a reader for the ones the caller wants. */
export interface OpenedArchive {
  names: readonly string[];
  read(name: string): Promise<Buffer>;
  close(): void;
}

const ZIP_SIGNATURES = [Buffer.from('PK\x03\x04', 'latin1'), Buffer.from('PK\x05\x06', 'latin1')];

export async function openArchive(archive: Buffer, limits: ArchiveLimits = DEFAULT_ARCHIVE_LIMITS): Promise<OpenedArchive> {
  if (archive.length > limits.maxArchiveBytes) {
    throw refused(`the file is ${sizeText(archive.length)}, above the ${sizeText(limits.maxArchiveBytes)} allowed`, 'maxArchiveBytes');
  }
  if (!ZIP_SIGNATURES.some((signature) => archive.subarray(0, 4).equals(signature))) {
    throw notAZip('it does not start with a zip signature');
  }
  const zip = await openZip(archive);
  if (zip.entryCount > limits.maxEntries) {
    zip.close();
    throw refused(`it holds ${zip.entryCount} files, more than the ${limits.maxEntries} allowed`, 'maxEntries');
  }
  let entries: yauzl.Entry[];
  try {
    entries = (await listEntries(zip)).filter((entry) => !entry.fileName.endsWith('/'));
    checkEntries(entries, limits);
  } catch (error) {
    zip.close();
    throw error;
  }
  const byName = new Map(entries.map((entry) => [entry.fileName, entry]));
  return {
    names: [...byName.keys()],
    read: (name) => {
      const entry = byName.get(name);
      if (!entry) return Promise.reject(new Error(`no entry ${name} in the archive`));
      return readEntry(zip, entry, limits);
    },
    close: () => zip.close(),
  };
}
