import { ElementIndex } from './element-index';

// GlobalIds in the 22-character IFC form; invented for these tests.
const BEAM = '2O2Fr$t4X7Zf8NOew3FLOH';
const COLUMN = '1kTvXnbbzCWw8lcMd1dR4o';
const GIRDER = '3cUkl32yn9qRSPvBJVyWYp';

describe('ElementIndex', () => {
  const index = ElementIndex.fromElements([BEAM, COLUMN, GIRDER], [1, 3, 1]);

  it('numbers instances in element order, several per element where a mesh has several primitives', () => {
    expect(index.instanceCount).toBe(5);
    expect([index.firstInstanceOf(1), index.endInstanceOf(1)]).toEqual([1, 4]);
    expect([0, 1, 2, 3, 4].map((instance) => index.globalIdOfInstance(instance))).toEqual([
      BEAM,
      COLUMN,
      COLUMN,
      COLUMN,
      GIRDER,
    ]);
  });

  it('maps GlobalIds to elements and back', () => {
    expect(index.elementOf(GIRDER)).toBe(2);
    expect(index.globalIds[index.elementOf(COLUMN)]).toBe(COLUMN);
    expect(index.elementOf('0000000000000000000000')).toBe(-1);
    expect(index.elementsOf([GIRDER, 'unknown', BEAM])).toEqual([2, 0]);
  });

  it('answers null for instance ids outside the batch, such as an empty pick', () => {
    expect(index.globalIdOfInstance(-1)).toBeNull();
    expect(index.globalIdOfInstance(5)).toBeNull();
    expect(index.globalIdOfInstance(1.5)).toBeNull();
  });

  it('refuses a GlobalId that names two elements', () => {
    expect(() => ElementIndex.fromElements([BEAM, BEAM], [1, 1])).toThrow(`GlobalId ${BEAM} names two elements`);
  });

  it('refuses an element without instances and mismatched lists', () => {
    expect(() => ElementIndex.fromElements([BEAM], [0])).toThrow('at least one instance');
    expect(() => ElementIndex.fromElements([BEAM], [])).toThrow('1 GlobalIds but 0 instance counts');
  });
});
