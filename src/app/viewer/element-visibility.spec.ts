import { ElementVisibility } from './element-visibility';

describe('ElementVisibility', () => {
  it('shows everything at first', () => {
    const visibility = new ElementVisibility();
    expect(visibility.isShown('beam', false)).toBe(true);
    expect(visibility.isShown('slab', true)).toBe(true);
  });

  it('filters members only; context elements keep their own switch', () => {
    const visibility = new ElementVisibility();
    visibility.filterMembers(['beam-1']);
    expect(visibility.isShown('beam-1', false)).toBe(true);
    expect(visibility.isShown('beam-2', false)).toBe(false);
    expect(visibility.isShown('slab', true)).toBe(true);
    visibility.contextVisible = false;
    expect(visibility.isShown('slab', true)).toBe(false);
  });

  it('lets hiding win over isolation, and "show all" keep the filter', () => {
    const visibility = new ElementVisibility();
    visibility.filterMembers(['beam-1', 'beam-2']);
    visibility.isolate(['beam-2', 'beam-3', 'slab']);
    visibility.hide(['beam-2']);
    expect(['beam-1', 'beam-2', 'beam-3'].map((id) => visibility.isShown(id, false))).toEqual([false, false, true]);
    expect(visibility.isShown('slab', true)).toBe(true);
    visibility.showAll();
    expect(['beam-1', 'beam-2', 'beam-3'].map((id) => visibility.isShown(id, false))).toEqual([true, true, false]);
  });

  it('restores a viewpoint as the whole truth, in both of its forms', () => {
    const visibility = new ElementVisibility();
    visibility.filterMembers([]);
    visibility.restore(true, ['beam-2']);
    expect(['beam-1', 'beam-2'].map((id) => visibility.isShown(id, false))).toEqual([true, false]);
    visibility.restore(false, ['beam-2', 'slab']);
    expect(['beam-1', 'beam-2'].map((id) => visibility.isShown(id, false))).toEqual([false, true]);
    expect(visibility.isShown('slab', true)).toBe(true);
  });
});
