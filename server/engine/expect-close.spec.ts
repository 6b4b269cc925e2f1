import { expectClose } from './expect-close';

describe('expectClose', () => {
  it('accepts a value inside the relative tolerance and rejects one outside, naming both numbers', () => {
    expect(() => expectClose(100.4, 100, 0.005)).not.toThrow();
    expect(() => expectClose(100.6, 100, 0.005, 'area')).toThrow(/area: actual 100.6, expected 100, relative error/);
  });

  it('divides by the expected value, not the actual one', () => {
    // |2 − 1| / 1 = 1 fails at tolerance 0.6, whereas dividing by the actual value (0.5) would pass.
    expect(() => expectClose(2, 1, 0.6)).toThrow();
  });

  it('rejects NaN instead of passing it', () => {
    expect(() => expectClose(Number.NaN, 1, 0.1)).toThrow();
  });
});
