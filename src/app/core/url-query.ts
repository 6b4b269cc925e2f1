/** Reading a page's state back from its URL query, where anything malformed falls back to the default. */

/** A non-negative integer from the query, else `fallback`; with `allowed`, only one of those values. */
export function wholeNumber(text: string | undefined, fallback: number, allowed?: readonly number[]): number {
  const value = Number(text);
  if (text === undefined || !Number.isInteger(value) || value < 0) return fallback;
  return allowed && !allowed.includes(value) ? fallback : value;
}
