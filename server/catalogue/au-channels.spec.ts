import { expectClose } from '../engine/expect-close';
import { AU_PFC_ENTRIES, AU_PFC_ROWS } from './au-channels';
import { channelArea_mm2 } from './entry-area';
import type { ChannelDimensions } from '../engine/section-family';

describe('AS/NZS 3679.1 parallel flange channels', () => {
  it('spot-checks 300PFC against the published table', () => {
    // Liberty / InfraBuild Hot Rolled and Structural Steel Products (9th ed. 2019), Table 15: d 300, bf 90, tf 16.0,
    // tw 8.0, 40.1 kg/m; parallel flanges (no slope).
    const entry = AU_PFC_ENTRIES.find((e) => e.name === '300PFC40.1')!;
    expect(entry.dimensions).toEqual({ family: 'channel', depth_mm: 300, width_mm: 90, webThickness_mm: 8, flangeThickness_mm: 16, rootRadius_mm: 14 });
  });

  it('rebuilds the tabulated gross area Ag of every channel within 0.5 %', () => {
    for (const [index, [name, , , , , , area]] of AU_PFC_ROWS.entries()) {
      expectClose(channelArea_mm2(AU_PFC_ENTRIES[index].dimensions as ChannelDimensions), area, 0.005, `${name} Ag`);
    }
  });
});
