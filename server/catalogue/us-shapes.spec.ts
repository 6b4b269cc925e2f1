import { expectClose } from '../engine/expect-close';
import { MM_PER_IN } from '../engine/units';
import { entryOfSection, findSection } from './catalogue';
import { outlineArea_mm2 } from './entry-area';
import { C_ROWS, M_ROWS, S_ROWS, US_CHANNEL_ENTRIES, US_I_SECTIONS } from './us-shapes';

const MM2_PER_IN2 = MM_PER_IN * MM_PER_IN;

describe('AISC S, M and C shapes', () => {
  it('spot-checks S12X50 against the AISC Shapes Database v15.0', () => {
    // d 12.0, bf 5.48, tw 0.687, tf 0.659 in (average flange thickness), A 14.7 in².
    expect(findSection('S12x50')).toMatchObject({ depth_mm: 12 * MM_PER_IN, width_mm: 5.48 * MM_PER_IN, webThickness_mm: 0.687 * MM_PER_IN, flangeThickness_mm: 0.659 * MM_PER_IN });
  });

  it('rebuilds the tabulated area of every S and M shape within 1 % from the outline the engine draws', () => {
    const area = new Map([...S_ROWS, ...M_ROWS].map((r) => [r[0], r[1]]));
    for (const s of US_I_SECTIONS) expectClose(outlineArea_mm2(entryOfSection(s).dimensions) / MM2_PER_IN2, area.get(s.name)!, 0.01, `${s.name} A`);
  });

  it('rebuilds the tabulated area of every C channel within 1 %', () => {
    // Spot check: C15X33.9, A 10.0 in², d 15.0, bf 3.40, tw 0.400, tf 0.650 in.
    for (const [index, [label, area]] of C_ROWS.entries()) expectClose(outlineArea_mm2(US_CHANNEL_ENTRIES[index].dimensions) / MM2_PER_IN2, area, 0.01, `${label} A`);
  });
});
