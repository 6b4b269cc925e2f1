import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { engineVersion, sourceHash } from './engine-version';

describe('engineVersion', () => {
  it('names the package version and a hash of the computing sources', () => {
    const { version } = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../package.json'), 'utf8')) as { version: string };
    expect(engineVersion()).toMatch(new RegExp(`^taulens ${version.replace(/\./g, '\\.')}\\+engine\\.[0-9a-f]{12}$`));
    expect(engineVersion()).toBe(engineVersion());
  });

  describe('sourceHash', () => {
    let root: string;
    beforeEach(() => {
      root = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-version-'));
      for (const folder of ['engine', 'checks']) fs.mkdirSync(path.join(root, folder));
      fs.writeFileSync(path.join(root, 'engine', 'check.ts'), 'export const a = 1;\n');
      fs.writeFileSync(path.join(root, 'checks', 'check-run-compute.ts'), 'export const b = 2;\n');
    });
    afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

    it('changes when a computing source changes', () => {
      const before = sourceHash(root);
      fs.writeFileSync(path.join(root, 'engine', 'check.ts'), 'export const a = 2;\n');
      expect(sourceHash(root)).not.toBe(before);
    });

    it('changes when the run computation changes', () => {
      const before = sourceHash(root);
      fs.writeFileSync(path.join(root, 'checks', 'check-run-compute.ts'), 'export const b = 3;\n');
      expect(sourceHash(root)).not.toBe(before);
    });

    it('ignores the routes and storage of check runs', () => {
      const before = sourceHash(root);
      fs.writeFileSync(path.join(root, 'checks', 'check-runs.router.ts'), 'export const route = 1;\n');
      expect(sourceHash(root)).toBe(before);
    });

    it('ignores tests and benchmarks beside the code', () => {
      const before = sourceHash(root);
      fs.writeFileSync(path.join(root, 'engine', 'check.spec.ts'), 'test("x", () => {});\n');
      fs.writeFileSync(path.join(root, 'checks', 'check-run-compute.d.ts'), 'export declare const b: number;\n');
      expect(sourceHash(root)).toBe(before);
    });
  });
});
