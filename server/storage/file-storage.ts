import type { Readable } from 'node:stream';

/** What `put` stored. */
export interface StoredFile {
  key: string;
  size_bytes: number;
  /** Hex SHA-256 of the content, for traceable check runs. */
  sha256: string;
}

/**
 * Uploaded files and baked geometry by key (`projects/<id>/models/<id>.ifc`). Keys are
 * '/'-separated segments of letters, digits, '.', '_' and '-'. The embedded default keeps them on
 * local disk; an S3-compatible store can implement the same interface.
 */
export interface FileStorage {
  /** Writes the whole content, then makes it visible under `key` at once (never half-written). */
  put(key: string, content: Buffer | Uint8Array | Readable, options?: { maxBytes?: number }): Promise<StoredFile>;
  get(key: string): Promise<Buffer>;
  stream(key: string): Promise<Readable>;
  /** Size in bytes, or null when nothing is stored under the key. */
  size(key: string): Promise<number | null>;
  /** Removes the file; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
  /** Removes every file whose key starts with `prefix/` (e.g. all files of a project). */
  deletePrefix(prefix: string): Promise<void>;
}

const SEGMENT = /^[A-Za-z0-9_-][A-Za-z0-9._-]*$/;

/** Rejects keys that could escape the storage root or collide with temporary files. */
export function assertStorageKey(key: string): void {
  const segments = key.split('/');
  if (key.length > 512 || segments.some((s) => !SEGMENT.test(s) || s.includes('..'))) {
    throw new Error(`invalid storage key "${key}": use '/'-separated segments of letters, digits, '.', '_' and '-'`);
  }
}
