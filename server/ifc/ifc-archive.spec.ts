import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as yazl from 'yazl';
import { buildingSmartSample } from '../../test/fixtures/ifc/buildingsmart-samples';
import { extractIfcFromZip } from './ifc-archive';

const SAMPLE = buildingSmartSample('column-extruded-solid.ifc');

function zip(file: string, entries: { name: string; data: Buffer; store?: boolean }[]): Promise<string> {
  return new Promise((resolve, reject) => {
    const archive = new yazl.ZipFile();
    for (const entry of entries) archive.addBuffer(entry.data, entry.name, { compress: !entry.store });
    archive.end();
    archive.outputStream.pipe(fs.createWriteStream(file)).on('close', () => resolve(file)).on('error', reject);
  });
}

describe('extractIfcFromZip', () => {
  let dir: string;
  beforeEach(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-ifczip-'));
  });
  afterEach(() => fs.rmSync(dir, { recursive: true, force: true }));

  const out = (): string => path.join(dir, 'model.ifc');

  it('extracts the single .ifc, skipping other entries', async () => {
    const sample = fs.readFileSync(SAMPLE);
    const archive = await zip(path.join(dir, 'a.ifczip'), [
      { name: 'readme.txt', data: Buffer.from('issued for coordination') },
      { name: 'models/Column.IFC', data: sample },
    ]);
    expect(await extractIfcFromZip(archive, out())).toEqual({ entryName: 'models/Column.IFC', bytes: sample.length });
    expect(fs.readFileSync(out()).equals(sample)).toBe(true);
  });

  it('refuses an archive without an .ifc', async () => {
    const archive = await zip(path.join(dir, 'b.ifczip'), [{ name: 'model.ifcxml', data: Buffer.from('<ifc/>') }]);
    await expect(extractIfcFromZip(archive, out())).rejects.toMatchObject({ code: 'no-ifc-in-archive', message: 'The archive contains no .ifc file.' });
    expect(fs.existsSync(out())).toBe(false);
  });

  it('refuses an archive with two .ifc files, naming them', async () => {
    const archive = await zip(path.join(dir, 'c.ifczip'), [
      { name: 'a.ifc', data: Buffer.from('x') },
      { name: 'b.ifc', data: Buffer.from('y') },
    ]);
    await expect(extractIfcFromZip(archive, out())).rejects.toMatchObject({ code: 'bad-archive', message: expect.stringContaining("'a.ifc', 'b.ifc'") });
  });

  it('refuses a zip bomb by its compression ratio before unpacking anything', async () => {
    // 64 MB of one repeated byte deflates about 1000 : 1 (common practice, no source: deflate's ratio on constant input).
    const archive = await zip(path.join(dir, 'bomb.ifczip'), [{ name: 'model.ifc', data: Buffer.alloc(64 * 1024 ** 2, 0x20) }]);
    await expect(extractIfcFromZip(archive, out())).rejects.toMatchObject({ code: 'archive-too-large', message: expect.stringMatching(/compressed \d+ : 1/) });
    expect(fs.existsSync(out())).toBe(false);
  });

  it('refuses an entry larger than the limit', async () => {
    const archive = await zip(path.join(dir, 'big.ifczip'), [{ name: 'model.ifc', data: fs.readFileSync(SAMPLE), store: true }]);
    await expect(extractIfcFromZip(archive, out(), { maxUncompressedBytes: 1000, maxCompressionRatio: 200 })).rejects.toMatchObject({
      code: 'archive-too-large',
    });
    expect(fs.existsSync(out())).toBe(false);
  });

  it('refuses a file that is not a zip', async () => {
    await expect(extractIfcFromZip(SAMPLE, out())).rejects.toMatchObject({ code: 'bad-archive' });
  });
});
