/**
 * Extracts the one .ifc file of an .ifczip archive to disk, refusing archives that could exhaust the machine: an
 * entry declared larger than the limit, a compression ratio no IFC text reaches (a zip bomb), or a stream that grows
 * past what its header declared. A refused or failed extraction leaves no partial file behind.
 */
import * as fs from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { Transform } from 'node:stream';
import * as yauzl from 'yauzl';
import { IfcReadError } from './ifc-read-error';

export interface ArchiveLimits {
  /** Largest .ifc accepted, in bytes (the upload limit applies to the extracted model too). */
  maxUncompressedBytes: number;
  /** Largest uncompressed : compressed ratio. IFC text compresses about 5–30 : 1; bombs reach thousands. */
  maxCompressionRatio: number;
}

export const DEFAULT_ARCHIVE_LIMITS: ArchiveLimits = { maxUncompressedBytes: 1024 ** 3, maxCompressionRatio: 200 };

export interface ExtractedIfc {
  entryName: string;
  bytes: number;
}

function openZip(path: string): Promise<yauzl.ZipFile> {
  return new Promise((resolve, reject) => {
    yauzl.open(path, { lazyEntries: true, validateEntrySizes: true, autoClose: false }, (error, zip) => {
      if (error || !zip) reject(new IfcReadError('bad-archive', `The archive cannot be read as a zip file (${error?.message ?? 'no entries'}).`));
      else resolve(zip);
    });
  });
}

function listEntries(zip: yauzl.ZipFile): Promise<yauzl.Entry[]> {
  return new Promise((resolve, reject) => {
    const entries: yauzl.Entry[] = [];
    zip.on('entry', (entry: yauzl.Entry) => {
      entries.push(entry);
      zip.readEntry();
    });
    zip.once('end', () => resolve(entries));
    zip.once('error', (error: Error) => reject(new IfcReadError('bad-archive', `The archive is damaged: ${error.message}.`)));
    zip.readEntry();
  });
}

function openEntry(zip: yauzl.ZipFile, entry: yauzl.Entry): Promise<NodeJS.ReadableStream> {
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (error, stream) => (error || !stream ? reject(error) : resolve(stream)));
  });
}

const isIfc = (entry: yauzl.Entry): boolean =>
  !entry.fileName.endsWith('/') && !entry.fileName.startsWith('__MACOSX/') && /\.ifc$/i.test(entry.fileName);

function checkEntry(entry: yauzl.Entry, limits: ArchiveLimits): void {
  if (entry.isEncrypted()) throw new IfcReadError('bad-archive', `'${entry.fileName}' in the archive is encrypted.`);
  if (entry.uncompressedSize > limits.maxUncompressedBytes) {
    const mb = (n: number): string => `${(n / 1024 ** 2).toFixed(0)} MB`;
    throw new IfcReadError('archive-too-large', `'${entry.fileName}' unpacks to ${mb(entry.uncompressedSize)}, more than the ${mb(limits.maxUncompressedBytes)} allowed.`);
  }
  const ratio = entry.uncompressedSize / Math.max(1, entry.compressedSize);
  if (ratio > limits.maxCompressionRatio) {
    throw new IfcReadError(
      'archive-too-large',
      `'${entry.fileName}' is compressed ${ratio.toFixed(0)} : 1, far beyond what an IFC file reaches (at most ${limits.maxCompressionRatio} : 1 is accepted); the archive was refused.`,
    );
  }
}

/** Counts bytes as they pass and stops the stream once the limit is passed, whatever the header said. */
function byteLimit(limit: number, name: string): Transform {
  let seen = 0;
  return new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      seen += chunk.length;
      if (seen > limit) callback(new IfcReadError('archive-too-large', `'${name}' unpacks to more than the ${limit} bytes allowed.`));
      else callback(null, chunk);
    },
  });
}

/** Extracts the archive's single .ifc entry to `outPath`. Throws IfcReadError for anything else. */
export async function extractIfcFromZip(zipPath: string, outPath: string, limits: ArchiveLimits = DEFAULT_ARCHIVE_LIMITS): Promise<ExtractedIfc> {
  const zip = await openZip(zipPath);
  try {
    const ifcEntries = (await listEntries(zip)).filter(isIfc);
    if (ifcEntries.length === 0) throw new IfcReadError('no-ifc-in-archive', 'The archive contains no .ifc file.');
    if (ifcEntries.length > 1) {
      const names = ifcEntries.map((e) => `'${e.fileName}'`).join(', ');
      throw new IfcReadError('bad-archive', `The archive contains ${ifcEntries.length} .ifc files (${names}); an .ifczip must hold exactly one.`);
    }
    const [entry] = ifcEntries;
    checkEntry(entry, limits);
    try {
      const stream = await openEntry(zip, entry);
      await pipeline(stream, byteLimit(limits.maxUncompressedBytes, entry.fileName), fs.createWriteStream(outPath));
    } catch (error) {
      fs.rmSync(outPath, { force: true });
      if (error instanceof IfcReadError) throw error;
      throw new IfcReadError('bad-archive', `'${entry.fileName}' could not be unpacked: ${(error as Error).message}.`);
    }
    return { entryName: entry.fileName, bytes: fs.statSync(outPath).size };
  } finally {
    zip.close();
  }
}
