import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Readable } from 'node:stream';
import { text } from 'node:stream/consumers';
import { NotFoundError, PayloadTooLargeError } from '../http/errors';
import { LocalFileStorage } from './local-file-storage';

// SHA-256("abc") from FIPS 180-2, Appendix B.1 (the standard's own example).
const SHA256_ABC = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

describe('LocalFileStorage', () => {
  let root: string;
  let storage: LocalFileStorage;

  beforeEach(async () => {
    root = await mkdtemp(path.join(os.tmpdir(), 'taulens-storage-'));
    storage = new LocalFileStorage(root);
  });
  afterEach(() => rm(root, { recursive: true, force: true }));

  it('stores a buffer and reports its size and SHA-256', async () => {
    await expect(storage.put('projects/p1/models/m1.ifc', Buffer.from('abc'))).resolves.toEqual({
      key: 'projects/p1/models/m1.ifc',
      size_bytes: 3,
      sha256: SHA256_ABC,
    });
    await expect(storage.get('projects/p1/models/m1.ifc')).resolves.toEqual(Buffer.from('abc'));
    await expect(storage.size('projects/p1/models/m1.ifc')).resolves.toBe(3);
    await expect(text(await storage.stream('projects/p1/models/m1.ifc'))).resolves.toBe('abc');
  });

  it('stores a stream and replaces an existing file whole', async () => {
    await storage.put('a/b.txt', Buffer.from('old content'));
    await storage.put('a/b.txt', Readable.from([Buffer.from('a'), Buffer.from('bc')]));
    await expect(storage.get('a/b.txt')).resolves.toEqual(Buffer.from('abc'));
  });

  it('refuses content over maxBytes and leaves nothing behind', async () => {
    await expect(storage.put('big.bin', Readable.from([Buffer.alloc(6), Buffer.alloc(6)]), { maxBytes: 10 })).rejects.toBeInstanceOf(
      PayloadTooLargeError,
    );
    await expect(storage.size('big.bin')).resolves.toBeNull();
    await expect(readdir(path.join(root, '.partial'))).resolves.toEqual([]);
  });

  it('answers missing files with a NotFoundError and deletes quietly', async () => {
    await expect(storage.get('none.txt')).rejects.toBeInstanceOf(NotFoundError);
    await expect(storage.stream('none.txt')).rejects.toBeInstanceOf(NotFoundError);
    await expect(storage.delete('none.txt')).resolves.toBeUndefined();
  });

  it('deletes one file or a whole prefix', async () => {
    await storage.put('projects/p1/a.txt', Buffer.from('1'));
    await storage.put('projects/p1/sub/b.txt', Buffer.from('2'));
    await storage.put('projects/p2/c.txt', Buffer.from('3'));
    await storage.delete('projects/p1/a.txt');
    await expect(storage.size('projects/p1/a.txt')).resolves.toBeNull();
    await storage.deletePrefix('projects/p1');
    await expect(storage.size('projects/p1/sub/b.txt')).resolves.toBeNull();
    await expect(storage.size('projects/p2/c.txt')).resolves.toBe(1);
  });

  it.each(['../escape', 'a/../b', '/absolute', 'a//b', '.partial/x', 'sp ace', ''])('rejects the key "%s"', async (key) => {
    await expect(storage.put(key, Buffer.from('x'))).rejects.toThrow(/invalid storage key/);
  });
});
