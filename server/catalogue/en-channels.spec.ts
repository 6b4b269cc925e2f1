import { expectClose } from '../engine/expect-close';
import { EN_CHANNEL_ENTRIES, UPE_ROWS, UPN_ROWS, upnDimensions } from './en-channels';
import { outlineArea_mm2 } from './entry-area';

function entry(name: string) {
  const found = EN_CHANNEL_ENTRIES.find((e) => e.name === name);
  if (!found) throw new Error(`${name} is not in the table`);
  return found;
}

describe('EN UPN and UPE channels', () => {
  it('spot-checks UPN 200 against the published table, flange thickness moved to mid-outstand', () => {
    // Maker's table (transcription named in EN_UPN_SOURCE): h 200, b 75, tw 8.5, t 11.5, r1 11.5, r2 6.0, A 32.2 cm²,
    // 25.3 kg/m; slope 8 % (from memory). Mid-outstand is tw/2 = 4.25 mm further out than b/2: 11.5 − 0.08 × 4.25.
    expect(entry('UPN 200').dimensions).toMatchObject({ depth_mm: 200, width_mm: 75, webThickness_mm: 8.5, rootRadius_mm: 11.5, edgeRadius_mm: 6 });
    expect((entry('UPN 200').dimensions as { flangeThickness_mm: number }).flangeThickness_mm).toBeCloseTo(11.16, 10);
  });

  it('rebuilds the tabulated area of every UPN within 1 % from the outline the engine draws', () => {
    for (const row of UPN_ROWS) expectClose(outlineArea_mm2(upnDimensions(row)) / 100, row[7], 0.01, `UPN ${row[0]} A`);
  });

  it('rebuilds the tabulated area of every UPE within 1 %', () => {
    for (const [size, , , , , , area] of UPE_ROWS) expectClose(outlineArea_mm2(entry(`UPE ${size}`).dimensions) / 100, area, 0.01, `UPE ${size} A`);
  });
});
