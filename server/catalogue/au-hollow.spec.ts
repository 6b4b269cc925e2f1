import { expectClose } from '../engine/expect-close';
import type { BoxDimensions, TubeDimensions } from '../engine/section-family';
import { AU_HOLLOW_ENTRIES } from './au-hollow';
import { boxArea_mm2, tubeArea_mm2 } from './entry-area';

/** Common practice, no source: structural steel is taken as 7850 kg/m³ for masses per metre. */
const KG_PER_M_PER_MM2 = 7850e-6;

function entry(name: string) {
  const found = AU_HOLLOW_ENTRIES.find((e) => e.name === name);
  if (!found) throw new Error(`${name} is not in the table`);
  return found;
}

describe('AS/NZS 1163 hollow sections', () => {
  it.each([
    // Masses per metre of the Australian makers' tables. 100x100x6.0 and 50x50x3.0 SHS: also in an open transcription
    // (public GitHub repository); the others from memory.
    ['100x100x6.0 SHS', 16.7],
    ['50x50x3.0 SHS', 4.25],
    ['100x100x3.0 SHS', 8.96],
    ['100x100x4.0 SHS', 11.6],
    ['89x89x5.0 SHS', 12.5],
    ['100x50x4.0 RHS', 8.49],
  ])('%s weighs %s kg/m with the makers\' corner radii (2t up to 3 mm, 2.5t above)', (name, mass) => {
    expectClose(boxArea_mm2(entry(name).dimensions as BoxDimensions) * KG_PER_M_PER_MM2, mass, 0.005, name);
  });

  it('gives a CHS its outside diameter and wall', () => {
    // 168.3x4.8 CHS, 19.4 kg/m (from memory).
    const chs = entry('168.3x4.8 CHS').dimensions as TubeDimensions;
    expect(chs).toEqual({ family: 'tube', diameter_mm: 168.3, wallThickness_mm: 4.8 });
    expectClose(tubeArea_mm2(chs) * KG_PER_M_PER_MM2, 19.4, 0.005, '168.3x4.8 CHS');
  });

  it('keeps walls thinner than half the smaller side and inner corners inside the wall', () => {
    for (const { name, dimensions: d } of AU_HOLLOW_ENTRIES) {
      if (d.family === 'box') {
        expect(2 * d.webThickness_mm).toBeLessThan(Math.min(d.depth_mm, d.width_mm));
        expect(d.outerCornerRadius_mm! - d.innerCornerRadius_mm!).toBeCloseTo(d.webThickness_mm, 10);
      } else if (d.family === 'tube') {
        expect(2 * d.wallThickness_mm).toBeLessThan(d.diameter_mm);
      } else {
        throw new Error(`${name} is neither a box nor a tube`);
      }
    }
  });
});
