/**
 * Deterministic IFC GlobalIds: 22 characters of the IFC base-64 alphabet, the first one carrying only 2 bits (as a
 * compressed 128-bit GUID does). The index is spelled in the last six characters, so ids never repeat in a model.
 */
const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';

/** mulberry32: a tiny seeded generator, so the same model gets the same ids on every run. */
function scramble(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function globalIdFor(index: number): string {
  if (!Number.isInteger(index) || index < 0 || index >= 64 ** 6) throw new Error(`GlobalId index out of range: ${index}`);
  const random = scramble(index * 2654435761);
  let id = ALPHABET[Math.floor(random() * 4)];
  for (let i = 1; i < 16; i++) id += ALPHABET[Math.floor(random() * 64)];
  for (let i = 5; i >= 0; i--) id += ALPHABET[Math.floor(index / 64 ** i) % 64];
  return id;
}
