import { expectClose } from '../engine/expect-close';
import { sectionProperties } from '../engine/section-properties';
import { findSection, toSectionInput } from './catalogue';
import { UK_UB_ROWS, UK_UC_ROWS } from './uk-sections';

describe('BS 4-1 universal beams and columns', () => {
  it('spot-checks 305x165x40 UB against the published table', () => {
    // SCI section tables (BS 4-1 / BS EN 10365): h 303.4, b 165.0, tw 6.0, tf 10.2, r 8.9 mm.
    expect(findSection('UB 305x165x40')).toMatchObject({ name: '305x165x40 UB', depth_mm: 303.4, width_mm: 165, webThickness_mm: 6, flangeThickness_mm: 10.2, rootRadius_mm: 8.9, series: '305x165 UB' });
    expect(findSection('305x165x40UB')?.name).toBe('305x165x40 UB');
  });

  it('rebuilds the listed area of every section within 1 % (areas printed to three figures)', () => {
    for (const [size, , , , , , area] of [...UK_UB_ROWS, ...UK_UC_ROWS]) {
      const name = `${size} ${UK_UB_ROWS.some((r) => r[0] === size) ? 'UB' : 'UC'}`;
      expectClose(sectionProperties(toSectionInput(findSection(name)!)).area_mm2 / 100, area, 0.01, `${name} A`);
    }
  });
});
