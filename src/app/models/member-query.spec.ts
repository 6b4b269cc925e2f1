import { DEFAULT_MEMBER_QUERY, isMemberSort, memberApiParams } from './member-query';

describe('memberApiParams', () => {
  it('sends sort and page always, filters only when set', () => {
    expect(memberApiParams(DEFAULT_MEMBER_QUERY)).toEqual({ sort: 'expressId', dir: 'asc', page: '0', pageSize: '50' });
    expect(memberApiParams({ ...DEFAULT_MEMBER_QUERY, statuses: ['not-applicable', 'flagged'], storey: 'Level 02', profile: 'IPE 300', family: 'channel', source: 'outline', q: '  B12 ' })).toEqual({
      sort: 'expressId',
      dir: 'asc',
      page: '0',
      pageSize: '50',
      status: 'not-applicable,flagged',
      storey: 'Level 02',
      profile: 'IPE 300',
      family: 'channel',
      source: 'outline',
      q: 'B12',
    });
  });

  it('knows the columns the server sorts on', () => {
    expect(isMemberSort('depth_mm')).toBe(true);
    expect(isMemberSort('profileFamily')).toBe(true);
    expect(isMemberSort('flags')).toBe(false);
  });
});
