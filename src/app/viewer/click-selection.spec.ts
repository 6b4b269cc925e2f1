import { selectionAfterClick } from './click-selection';

describe('selection after a click', () => {
  it('selects only the member clicked, and clears on empty space', () => {
    expect(selectionAfterClick(['a', 'b'], 'c', false)).toEqual(['c']);
    expect(selectionAfterClick(['a', 'b'], null, false)).toEqual([]);
  });

  it('adds with a modifier key, removes what was selected, and keeps the selection on empty space', () => {
    expect(selectionAfterClick(['a'], 'b', true)).toEqual(['a', 'b']);
    expect(selectionAfterClick(['a', 'b'], 'a', true)).toEqual(['b']);
    expect(selectionAfterClick(['a'], null, true)).toEqual(['a']);
  });
});
