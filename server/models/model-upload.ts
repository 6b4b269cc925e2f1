/**
 * Receiving an IFC upload: multer streams the file to a temporary folder while hashing it (never the whole file in
 * memory), an .ifczip is unpacked to its single .ifc, and the STEP header is checked before anything is stored. Every
 * temporary file a request creates is removed when its response ends, unless the ingest has taken it over (moved it).
 */
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, open, rm } from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request, RequestHandler } from 'express';
import multer, { MulterError } from 'multer';
import { PayloadTooLargeError, ValidationError } from '../http/errors';
import { DEFAULT_ARCHIVE_LIMITS, extractIfcFromZip } from '../ifc/ifc-archive';
import { HEADER_PROBE_BYTES, readStepHeader, type StepHeader, TAIL_PROBE_BYTES } from '../ifc/step-header';
import { readingIfc } from './ifc-file-errors';

/** The uploaded file as it lies in the temporary folder. */
export interface ReceivedFile {
  path: string;
  originalName: string;
  size: number;
  sha256: string;
}

/** An IFC file ready to become a revision: checked header, hash and size of the IFC content. */
export interface CheckedIfc {
  path: string;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  header: StepHeader;
}

interface RequestTempFiles {
  paths: Set<string>;
  closed: boolean;
}

const tempFiles = new WeakMap<Request, RequestTempFiles>();

function tempFilesOf(req: Request): RequestTempFiles {
  let files = tempFiles.get(req);
  if (!files) tempFiles.set(req, (files = { paths: new Set(), closed: false }));
  return files;
}

/** A temporary file that is removed with the request's other temporary files. */
export function requestTempFile(req: Request, dir: string, extension = ''): string {
  const file = path.join(dir, randomUUID() + extension);
  tempFilesOf(req).paths.add(file);
  return file;
}

function hashing(onDone: (size: number, sha256: string) => void): Transform {
  const hash = createHash('sha256');
  let size = 0;
  return new Transform({
    transform(chunk: Buffer, _encoding, done) {
      hash.update(chunk);
      size += chunk.length;
      done(null, chunk);
    },
    flush(done) {
      onDone(size, hash.digest('hex'));
      done();
    },
  });
}

/** Multer storage writing each file to `dir` and measuring its size and SHA-256 on the way. */
class HashingDiskStorage implements multer.StorageEngine {
  constructor(private readonly dir: string) {}

  _handleFile(req: Request, file: Express.Multer.File, callback: (error?: unknown, info?: Partial<ReceivedFile>) => void): void {
    const target = requestTempFile(req, this.dir);
    let measured = { size: 0, sha256: '' };
    mkdir(this.dir, { recursive: true })
      .then(() => pipeline(file.stream, hashing((size, sha256) => (measured = { size, sha256 })), createWriteStream(target, { flags: 'wx' })))
      .then(async () => {
        // The response may have ended (an error elsewhere) while the file was still being written.
        if (tempFilesOf(req).closed) await rm(target, { force: true });
        callback(null, { path: target, ...measured });
      })
      .catch(async (error: unknown) => {
        await rm(target, { force: true });
        callback(error);
      });
  }

  _removeFile(_req: Request, file: Express.Multer.File, callback: (error: Error | null) => void): void {
    rm(file.path, { force: true }).then(() => callback(null), callback);
  }
}

export interface ReceiveOptions {
  dir: string;
  maxBytes: number;
  /** Lower-case, with the dot. */
  extensions: readonly string[];
  /** What the user should choose, for messages: 'an IFC file (.ifc or .ifczip)'. */
  expected: string;
  /** Error code for a file of another type. */
  refusedCode: string;
}

/**
 * Accepts one multipart file in the field `file` (plus small text fields) into a temporary folder; the file is at
 * `receivedFile(req)` afterwards. The request's temporary files are removed when its response closes.
 */
export function receiveFile(options: ReceiveOptions): RequestHandler {
  const upload = multer({
    storage: new HashingDiskStorage(options.dir),
    // Browsers send file names as raw UTF-8 without a charset; busboy would read them as latin1 ('TrÃ¤ger.ifc').
    defParamCharset: 'utf8',
    limits: { fileSize: options.maxBytes, files: 1, fields: 10, fieldSize: 8192 },
    fileFilter: (_req, file, accept) => {
      const extension = path.extname(file.originalname).toLowerCase();
      if (options.extensions.includes(extension)) accept(null, true);
      else {
        const message = `'${file.originalname}' is not ${options.expected}.`;
        accept(new ValidationError(message, { code: options.refusedCode, details: [{ location: 'body', field: 'file', message }] }));
      }
    },
  }).single('file');
  const limitMb = Math.round(options.maxBytes / 1024 ** 2);
  return (req, res, next) => {
    const files = tempFilesOf(req);
    res.once('close', () => {
      files.closed = true;
      for (const file of files.paths) void rm(file, { force: true });
    });
    upload(req, res, (error?: unknown) => {
      if (error instanceof MulterError && error.code === 'LIMIT_FILE_SIZE') {
        next(new PayloadTooLargeError(`The file is larger than the upload limit of ${limitMb} MB.`, { code: 'file_too_large' }));
      } else next(error);
    });
  };
}

/** The file `receiveFile` accepted; a ValidationError when the request carried none. */
export function receivedFile(req: Request, expected: string): ReceivedFile {
  const file = req.file as (Express.Multer.File & Partial<ReceivedFile>) | undefined;
  if (!file?.path || file.sha256 === undefined || file.size === undefined) {
    throw new ValidationError(`Choose ${expected} to upload (multipart field 'file').`, { code: 'file_required' });
  }
  return { path: file.path, originalName: file.originalname, size: file.size, sha256: file.sha256 };
}

async function readRange(file: string, position: number, length: number): Promise<Uint8Array> {
  const handle = await open(file, 'r');
  try {
    const buffer = Buffer.alloc(Math.max(0, length));
    const { bytesRead } = await handle.read(buffer, 0, buffer.length, position);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

async function headerOf(file: string, size: number): Promise<StepHeader> {
  const [head, tail] = await Promise.all([
    readRange(file, 0, HEADER_PROBE_BYTES),
    readRange(file, Math.max(0, size - TAIL_PROBE_BYTES), Math.min(size, TAIL_PROBE_BYTES)),
  ]);
  return readStepHeader(head, tail, size);
}

async function measure(file: string): Promise<{ size: number; sha256: string }> {
  const hash = createHash('sha256');
  let size = 0;
  for await (const chunk of createReadStream(file)) {
    hash.update(chunk as Buffer);
    size += (chunk as Buffer).length;
  }
  return { size, sha256: hash.digest('hex') };
}

/** Reads the header, size and SHA-256 of an IFC file on disk; throws the domain error for a file that is not IFC. */
export async function checkIfcFile(file: string, fileName: string): Promise<CheckedIfc> {
  const { size, sha256 } = await measure(file);
  return { path: file, fileName, sizeBytes: size, sha256, header: await readingIfc(() => headerOf(file, size)) };
}

/**
 * Turns the received file into a checked IFC: an .ifczip is unpacked (with the upload limit on the unpacked size and
 * the archive reader's ratio limit), then the STEP header is read. Throws the domain error for a file that is not a
 * complete IFC file of a supported schema.
 */
export async function checkIfcUpload(req: Request, file: ReceivedFile, options: { dir: string; maxBytes: number }): Promise<CheckedIfc> {
  if (path.extname(file.originalName).toLowerCase() !== '.ifczip') {
    const header = await readingIfc(() => headerOf(file.path, file.size));
    return { path: file.path, fileName: file.originalName, sizeBytes: file.size, sha256: file.sha256, header };
  }
  const extracted = requestTempFile(req, options.dir, '.ifc');
  try {
    await readingIfc(() => extractIfcFromZip(file.path, extracted, { ...DEFAULT_ARCHIVE_LIMITS, maxUncompressedBytes: options.maxBytes }));
  } catch (error) {
    // Gone before the refusal is answered, not after: the client may look at once.
    await Promise.all([rm(extracted, { force: true }), rm(file.path, { force: true })]);
    throw error;
  }
  await rm(file.path, { force: true });
  return checkIfcFile(extracted, file.originalName);
}
