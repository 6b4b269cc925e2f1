import { NO_MEMBER_FILTERS, filteredGlobalIds, searchMembers, storeysOf } from './member-filters';
import type { ViewerMember } from './viewer-member';

// Invented members for the filter rules.
function member(globalId: string, overrides: Partial<ViewerMember>): ViewerMember {
  return {
    globalId,
    tag: null,
    section: 'IPE 300',
    storey: 'Level 1',
    utilisationRatio: 0.5,
    status: 'pass',
    ...overrides,
  };
}

const members: ViewerMember[] = [
  member('0aaaaaaaaaaaaaaaaaaaaa', { tag: 'B-101', utilisationRatio: 0.62 }),
  member('0bbbbbbbbbbbbbbbbbbbbb', { tag: 'B-102', utilisationRatio: 1.12, status: 'fail' }),
  member('0ccccccccccccccccccccc', { tag: 'C-12', storey: 'Level 10', utilisationRatio: 1, status: 'warning' }),
  member('0ddddddddddddddddddddd', {
    tag: 'GB-1020',
    storey: 'Level 2',
    utilisationRatio: null,
    status: 'not-checked',
  }),
];

describe('member filters', () => {
  it('lets everything through when no filter is on', () => {
    expect(filteredGlobalIds(members, NO_MEMBER_FILTERS)).toBeNull();
  });

  it('keeps members above 100 % or with a failed check for "only failing", not those at exactly 100 %', () => {
    const kept = filteredGlobalIds(members, { onlyFailing: true, storey: null });
    expect([...(kept ?? [])]).toEqual(['0bbbbbbbbbbbbbbbbbbbbb']);
  });

  it('combines the storey filter with "only failing"', () => {
    const level2 = new Set(['0ddddddddddddddddddddd']);
    expect(filteredGlobalIds(members, { onlyFailing: false, storey: 'Level 2' })).toEqual(level2);
    expect(filteredGlobalIds(members, { onlyFailing: true, storey: 'Level 2' })).toEqual(new Set());
  });

  it('orders storeys naturally', () => {
    expect(storeysOf(members)).toEqual(['Level 1', 'Level 2', 'Level 10']);
  });
});

describe('member search', () => {
  it('ranks exact tag matches before tags that start with the query, then those that contain it', () => {
    expect(searchMembers(members, 'b-102', 10).map((m) => m.tag)).toEqual(['B-102', 'GB-1020']);
    expect(searchMembers(members, 'B-1', 10).map((m) => m.tag)).toEqual(['B-101', 'B-102', 'GB-1020']);
  });

  it('matches GlobalIds by their start, case-sensitively', () => {
    expect(searchMembers(members, '0ccc', 10).map((m) => m.tag)).toEqual(['C-12']);
    expect(searchMembers(members, '0CCC', 10)).toEqual([]);
  });

  it('finds nothing for a blank query and stops at the limit', () => {
    expect(searchMembers(members, '   ', 10)).toEqual([]);
    expect(searchMembers(members, 'B', 1)).toHaveLength(1);
  });
});
