import {
  DEFAULT_RUN_MEMBERS_QUERY,
  RunMembersQuery,
  runMembersApiParams,
  runMembersFilterParams,
  runMembersQueryFromUrl,
  runMembersUrlParams,
} from './run-members-query';

const failingOnLevel2: RunMembersQuery = {
  ...DEFAULT_RUN_MEMBERS_QUERY,
  status: 'fail',
  storey: 'Level 2',
  minUtilPercent: 91,
  maxUtilPercent: 250,
  q: '  G-1 ',
  page: 3,
};

describe('run members query', () => {
  it('asks the API for the most utilised members first, one page of 50', () => {
    expect(runMembersApiParams(DEFAULT_RUN_MEMBERS_QUERY)).toEqual({ sort: 'utilisation', dir: 'desc', page: '0', pageSize: '50' });
  });

  it('sends the utilisation range as ratios and trims the text', () => {
    expect(runMembersApiParams(failingOnLevel2)).toEqual({
      sort: 'utilisation',
      dir: 'desc',
      page: '3',
      pageSize: '50',
      status: 'fail',
      storey: 'Level 2',
      minUtil: '0.91',
      maxUtil: '2.5',
      q: 'G-1',
    });
  });

  it('gives the CSV export the same filters without sort or page', () => {
    expect(runMembersFilterParams(failingOnLevel2)).toEqual({ status: 'fail', storey: 'Level 2', minUtil: '0.91', maxUtil: '2.5', q: 'G-1' });
  });

  it('writes only what differs from the defaults into the page address, in percent', () => {
    expect(runMembersUrlParams(DEFAULT_RUN_MEMBERS_QUERY)).toEqual({});
    expect(runMembersUrlParams({ ...failingOnLevel2, sort: 'tag', dir: 'asc', pageSize: 100 })).toEqual({
      status: 'fail',
      storey: 'Level 2',
      minUtil: '91',
      maxUtil: '250',
      q: 'G-1',
      sort: 'tag',
      dir: 'asc',
      page: '3',
      pageSize: '100',
    });
  });

  it('reads the address back, ignoring anything it does not know', () => {
    const query = { ...failingOnLevel2, q: 'G-1', sort: 'tag' as const, dir: 'asc' as const, pageSize: 100 };
    expect(runMembersQueryFromUrl(runMembersUrlParams(query))).toEqual(query);
    expect(runMembersQueryFromUrl({ sort: 'password', dir: 'up', page: '-1', pageSize: '7', status: 'great', minUtil: 'x', maxUtil: '' })).toEqual(
      DEFAULT_RUN_MEMBERS_QUERY,
    );
  });
});
