import { LruPromiseCache } from './lru-promise-cache';

describe('LruPromiseCache', () => {
  it('computes a key once for concurrent callers and keeps the most recently used keys', async () => {
    const cache = new LruPromiseCache<string, number>(2);
    let computed = 0;
    const compute = (value: number) => () => {
      computed++;
      return Promise.resolve(value);
    };
    const [a, again] = await Promise.all([cache.get('a', compute(1)), cache.get('a', compute(99))]);
    expect([a, again, computed]).toEqual([1, 1, 1]);
    await cache.get('b', compute(2));
    await cache.get('a', compute(99)); // a is now the most recent
    await cache.get('c', compute(3)); // drops b
    expect(await cache.get('a', compute(99))).toBe(1);
    expect(await cache.get('b', compute(20))).toBe(20);
  });

  it('forgets a failed computation, so the next caller tries again', async () => {
    const cache = new LruPromiseCache<string, number>(4);
    await expect(cache.get('a', () => Promise.reject(new Error('busy')))).rejects.toThrow('busy');
    expect(await cache.get('a', () => Promise.resolve(5))).toBe(5);
  });

  it('drops the keys a test picks', async () => {
    const cache = new LruPromiseCache<string, string>(4);
    await cache.get('p1|x', () => Promise.resolve('old'));
    await cache.get('p2|x', () => Promise.resolve('kept'));
    cache.deleteWhere((key) => key.startsWith('p1|'));
    expect(await cache.get('p1|x', () => Promise.resolve('new'))).toBe('new');
    expect(await cache.get('p2|x', () => Promise.resolve('other'))).toBe('kept');
  });
});
