import { MAX_PICKABLE_INSTANCES, decodePickId, encodePickId } from './pick-id';

describe('pick ids', () => {
  it('round-trips instance ids through three 8-bit channels', () => {
    for (const id of [0, 1, 255, 256, 49_999, 65_535, 65_536, MAX_PICKABLE_INSTANCES]) {
      expect(decodePickId(...encodePickId(id))).toBe(id);
    }
  });

  it('reads a cleared (black) pixel as no member', () => {
    expect(decodePickId(0, 0, 0)).toBe(-1);
  });

  it('refuses ids it cannot hold', () => {
    expect(() => encodePickId(MAX_PICKABLE_INSTANCES + 1)).toThrow('from 0 to 16777214');
    expect(() => encodePickId(-1)).toThrow('got -1');
  });
});
