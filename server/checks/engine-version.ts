/**
 * The engine version a check run records: the package version plus a hash of the code that computes a run (the
 * engine, and the run computation and parameters of this folder, not its routes and storage), so a reviewer can tell whether two runs were computed by the same arithmetic even when
 * the package version did not change. Read once per process, from whatever files are running (.ts or built .js).
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/** Folders hashed whole, or only the named files (without extension). */
const HASHED_SOURCES: readonly { folder: string; files?: readonly string[] }[] = [
  { folder: 'engine' },
  { folder: 'checks', files: ['check-run-compute', 'check-parameters'] },
];
const SOURCE_FILE = /\.(ts|js)$/;
const NOT_RUN = /\.(spec|bench|d)\.(ts|js)$/;

let cached: string | undefined;

/** e.g. 'taulens 0.1.0+engine.3f9a1c0b2d4e'. */
export function engineVersion(): string {
  cached ??= `${packageNameAndVersion()}+engine.${sourceHash(path.resolve(__dirname, '..'))}`;
  return cached;
}

/** SHA-256 over the names and contents of the run-computing sources below `serverRoot`, first 12 hex digits. */
export function sourceHash(serverRoot: string): string {
  const hash = createHash('sha256');
  for (const { folder, files: only } of HASHED_SOURCES) {
    const dir = path.join(serverRoot, folder);
    const files = fs
      .readdirSync(dir)
      .filter((name) => SOURCE_FILE.test(name) && !NOT_RUN.test(name) && (!only || only.includes(name.replace(SOURCE_FILE, ''))))
      .sort();
    for (const name of files) {
      hash.update(`${folder}/${name}\0`);
      hash.update(fs.readFileSync(path.join(dir, name)));
      hash.update('\0');
    }
  }
  return hash.digest('hex').slice(0, 12);
}

/** The nearest package.json above this file: the repository's, or the built copy's. */
function packageNameAndVersion(): string {
  for (let dir = __dirname; ; dir = path.dirname(dir)) {
    const candidate = path.join(dir, 'package.json');
    if (fs.existsSync(candidate)) {
      const { name, version } = JSON.parse(fs.readFileSync(candidate, 'utf8')) as { name: string; version: string };
      return `${name} ${version}`;
    }
    if (path.dirname(dir) === dir) return 'taulens (unknown version)';
  }
}
