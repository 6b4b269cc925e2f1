import { expectClose } from '../engine/expect-close';
import { outlineArea_mm2 } from './entry-area';
import { UK_PFC_ENTRIES, UK_PFC_ROWS } from './uk-channels';

describe('BS 4-1 parallel flange channels', () => {
  it('spot-checks 300x90x41 PFC against the published table', () => {
    // SCI section tables (transcription named in UK_PFC_SOURCE): h 300, b 90, tw 9.0, tf 15.5, r 12 mm, A 52.7 cm², 41.4 kg/m.
    expect(UK_PFC_ENTRIES.find((e) => e.name === '300x90x41 PFC')!.dimensions).toEqual({
      family: 'channel', depth_mm: 300, width_mm: 90, webThickness_mm: 9, flangeThickness_mm: 15.5, rootRadius_mm: 12,
    });
  });

  it('rebuilds the listed area of every channel within 1 %', () => {
    for (const [index, [size, , , , , , area]] of UK_PFC_ROWS.entries()) expectClose(outlineArea_mm2(UK_PFC_ENTRIES[index].dimensions) / 100, area, 0.01, `${size} PFC A`);
  });
});
