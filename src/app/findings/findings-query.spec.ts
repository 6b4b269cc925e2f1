import {
  DEFAULT_FINDINGS_QUERY,
  findingsApiParams,
  findingsQueryFromUrl,
  findingsUrlParams,
} from './findings-query';

describe('findings query', () => {
  const filtered = { ...DEFAULT_FINDINGS_QUERY, status: ['open' as const, 'in-progress' as const], assignee: 'me', q: '  B-12 ', page: 2 };

  it('asks the API for one page with the filters', () => {
    expect(findingsApiParams(filtered)).toEqual({
      sort: 'number',
      dir: 'desc',
      page: '2',
      pageSize: '25',
      status: 'open,in-progress',
      assignee: 'me',
      q: 'B-12',
    });
  });

  it('writes only what differs from the defaults into the page URL, and reads it back', () => {
    const params = findingsUrlParams(filtered);
    expect(params).toEqual({ status: 'open,in-progress', assignee: 'me', q: 'B-12', page: '2' });
    expect(findingsQueryFromUrl(params)).toEqual({ ...filtered, q: 'B-12' });
    expect(findingsUrlParams(DEFAULT_FINDINGS_QUERY)).toEqual({});
  });

  it('falls back to the defaults for anything it does not know', () => {
    expect(findingsQueryFromUrl({ sort: 'colour', dir: 'up', page: '-1', pageSize: '33', status: 'open,closed', kind: 'x', priority: 'urgent' })).toEqual({
      ...DEFAULT_FINDINGS_QUERY,
      status: ['open'],
    });
  });
});
