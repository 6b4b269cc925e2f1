import { expectClose } from '../engine/expect-close';
import { MM_PER_IN } from '../engine/units';
import { entryOfSection, findSection } from './catalogue';
import { outlineArea_mm2 } from './entry-area';
import { findCatalogueEntry } from './catalogue-lookup';
import { HP_ROWS, M_ROWS, S_ROWS, US_CHANNEL_ENTRIES, US_CHANNEL_ROWS, US_I_SECTIONS } from './us-shapes';

const MM2_PER_IN2 = MM_PER_IN * MM_PER_IN;

describe('AISC S, M, HP, C and MC shapes', () => {
  it('spot-checks S12X50 against the AISC Shapes Database v15.0', () => {
    // d 12.0, bf 5.48, tw 0.687, tf 0.659 in (average flange thickness), A 14.7 in².
    expect(findSection('S12x50')).toMatchObject({ depth_mm: 12 * MM_PER_IN, width_mm: 5.48 * MM_PER_IN, webThickness_mm: 0.687 * MM_PER_IN, flangeThickness_mm: 0.659 * MM_PER_IN });
  });

  it('spot-checks HP14X117 against the AISC Shapes Database v15.0', () => {
    // d 14.2, bf 14.9, tw = tf 0.805, k_des 1.50 in, A 34.4 in²; parallel flanges, so r = k_des − tf.
    expect(findSection('HP14x117')).toMatchObject({ depth_mm: 14.2 * MM_PER_IN, width_mm: 14.9 * MM_PER_IN, webThickness_mm: 0.805 * MM_PER_IN, flangeThickness_mm: 0.805 * MM_PER_IN });
    expect(findSection('HP14x117')!.rootRadius_mm).toBeCloseTo((1.5 - 0.805) * MM_PER_IN, 9);
    expect(findCatalogueEntry('HP14x117')).toMatchObject({ entry: { name: 'HP14X117', family: 'I' } });
  });

  it('spot-checks MC12X31 against the AISC Shapes Database v15.0', () => {
    // d 12.0, bf 3.67, tw 0.370, tf 0.700 (average), k_des 1.31 in, A 9.12 in².
    const hit = findCatalogueEntry('MC12x31');
    expect(hit).toMatchObject({ entry: { name: 'MC12X31', family: 'channel', series: 'MC12' } });
    expect(hit!.entry.dimensions).toMatchObject({ depth_mm: 12 * MM_PER_IN, width_mm: 3.67 * MM_PER_IN, webThickness_mm: 0.37 * MM_PER_IN, flangeThickness_mm: 0.7 * MM_PER_IN });
    expectClose(outlineArea_mm2(hit!.entry.dimensions) / MM2_PER_IN2, 9.12, 0.01, 'MC12X31 A');
  });

  it('rebuilds the tabulated area of every S, M and HP shape within 1 % from the outline the engine draws', () => {
    const area = new Map([...S_ROWS, ...M_ROWS, ...HP_ROWS].map((r) => [r[0], r[1]]));
    for (const s of US_I_SECTIONS) expectClose(outlineArea_mm2(entryOfSection(s).dimensions) / MM2_PER_IN2, area.get(s.name)!, 0.01, `${s.name} A`);
  });

  it('rebuilds the tabulated area of every C and MC channel within 1 %', () => {
    // Spot check: C15X33.9, A 10.0 in², d 15.0, bf 3.40, tw 0.400, tf 0.650 in.
    for (const [index, [label, area]] of US_CHANNEL_ROWS.entries()) expectClose(outlineArea_mm2(US_CHANNEL_ENTRIES[index].dimensions) / MM2_PER_IN2, area, 0.01, `${label} A`);
  });
});
