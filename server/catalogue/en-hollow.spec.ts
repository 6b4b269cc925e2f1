import { expectClose } from '../engine/expect-close';
import { findCatalogueEntry } from './catalogue-lookup';
import { EN_10210_CHS, EN_10210_SHS, EN_10219_SHS, EN_HOLLOW_ENTRIES, type HollowRows } from './en-hollow';
import { outlineArea_mm2 } from './entry-area';

function checkAreas(rows: HollowRows, name: (size: number, t: number) => string): void {
  for (const [size, walls] of rows) {
    for (const [t, area] of walls) {
      const entry = EN_HOLLOW_ENTRIES.find((e) => e.name === name(size, t));
      if (!entry) throw new Error(`${name(size, t)} is not in the table`);
      // Listed areas are printed to three figures.
      expectClose(outlineArea_mm2(entry.dimensions) / 100, area, 0.01, `${entry.name} A`);
    }
  }
}

describe('EN 10219 and EN 10210 hollow sections', () => {
  it('gives EN 10219 cold-formed corners of 2t up to 6 mm walls, 2.5t to 10 mm and 3t above', () => {
    // EN 10219-2 rule (from memory); inner radius = outer − t (common practice, no source).
    expect(findCatalogueEntry('SHS 100x100x6.0 EN 10219')!.entry.dimensions).toMatchObject({ outerCornerRadius_mm: 12, innerCornerRadius_mm: 6 });
    expect(findCatalogueEntry('SHS 100x100x8.0 EN 10219')!.entry.dimensions).toMatchObject({ outerCornerRadius_mm: 20, innerCornerRadius_mm: 12 });
  });

  it('gives EN 10210 hot-finished corners of 1.5t outside and 1.0t inside', () => {
    // EN 10210-2 rule (from memory).
    expect(findCatalogueEntry('SHS 100x100x10.0 EN 10210')!.entry.dimensions).toMatchObject({ outerCornerRadius_mm: 15, innerCornerRadius_mm: 10 });
  });

  it('rebuilds the listed area of every EN 10219 SHS within 1 % (SCI tables, transcription named in the source)', () => {
    // Spot check: 100x100x6.0 cold-formed, A 21.6 cm², 17.0 kg/m.
    checkAreas(EN_10219_SHS, (b, t) => `SHS ${b}x${b}x${t.toFixed(1)} EN 10219`);
  });

  it('rebuilds the listed area of every EN 10210 SHS and CHS within 1 %', () => {
    // Spot checks: 100x100x6.3 hot-finished, A 23.2 cm²; 168.3x5.0 CHS, A 25.7 cm², 20.1 kg/m.
    checkAreas(EN_10210_SHS, (b, t) => `SHS ${b}x${b}x${t.toFixed(1)} EN 10210`);
    checkAreas(EN_10210_CHS, (d, t) => `CHS ${d.toFixed(1)}x${t.toFixed(1)} EN 10210`);
  });
});
