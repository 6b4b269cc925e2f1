/**
 * Instance ids in the picking pass: instance id + 1 is written as 24 bits into red, green and blue of an RGBA8
 * target, so 0 means "no member here". The fragment shader in gpu-picker.ts writes the same layout.
 */

/** Ids up to 2^24 − 2 fit; a float32 varying holds integers exactly up to 2^24. */
export const MAX_PICKABLE_INSTANCES = 0xffffff - 1;

export function encodePickId(instanceId: number): [red: number, green: number, blue: number] {
  if (!Number.isInteger(instanceId) || instanceId < 0 || instanceId > MAX_PICKABLE_INSTANCES) {
    throw new Error(`Pick ids hold instance ids from 0 to ${MAX_PICKABLE_INSTANCES}, got ${instanceId}.`);
  }
  const value = instanceId + 1;
  return [value & 0xff, (value >> 8) & 0xff, (value >> 16) & 0xff];
}

/** Instance id read back from one picking pixel, or −1 where nothing pickable was drawn. */
export function decodePickId(red: number, green: number, blue: number): number {
  return (red | (green << 8) | (blue << 16)) - 1;
}
