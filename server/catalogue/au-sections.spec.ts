import { expectClose } from '../engine/expect-close';
import { sectionProperties } from '../engine/section-properties';
import { AU_UB_ROWS, AU_UC_ROWS, AU_WB_ROWS } from './au-sections';
import { findSection, toSectionInput } from './catalogue';

/** Common practice, no source: structural steel is taken as 7850 kg/m³ for masses per metre. */
const KG_PER_M_PER_MM2 = 7850e-6;

describe('AS/NZS 3679 I-sections', () => {
  it('holds the universal beams, columns and welded beams of the makers\' tables', () => {
    expect(AU_UB_ROWS).toHaveLength(28);
    expect(AU_UC_ROWS).toHaveLength(13);
    expect(AU_WB_ROWS).toHaveLength(23);
  });

  it('spot-checks 310UC96.8 against the published table', () => {
    // Liberty / InfraBuild Hot Rolled and Structural Steel Products (9th ed. 2019), Table 11: d 308, bf 305, tf 15.4,
    // tw 9.9; r1 16.5 from memory.
    expect(findSection('310UC96.8')).toMatchObject({ depth_mm: 308, width_mm: 305, flangeThickness_mm: 15.4, webThickness_mm: 9.9, rootRadius_mm: 16.5, series: '310UC' });
  });

  it('rebuilds the tabulated gross area Ag of every UB and UC within 0.6 % (Ag is printed to three figures)', () => {
    for (const [name, , , , , , area] of [...AU_UB_ROWS, ...AU_UC_ROWS]) {
      expectClose(sectionProperties(toSectionInput(findSection(name)!)).area_mm2, area, 0.006, `${name} Ag`);
    }
  });

  it('rebuilds the nominal mass in every welded-beam name from its plates within 1 %', () => {
    for (const [name] of AU_WB_ROWS) {
      const section = findSection(name)!;
      expect(toSectionInput(section).fabrication).toBe('welded');
      const mass = Number(/WB(\d+)$/.exec(name)![1]);
      expectClose(sectionProperties(toSectionInput(section)).area_mm2 * KG_PER_M_PER_MM2, mass, 0.01, `${name} mass`);
    }
  });
});
