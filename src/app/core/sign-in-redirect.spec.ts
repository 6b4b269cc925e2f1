import { safeReturnUrl } from './sign-in-redirect';

describe('safeReturnUrl', () => {
  it('follows a path inside the app', () => {
    expect(safeReturnUrl('/projects/p1/checks?run=3')).toBe('/projects/p1/checks?run=3');
  });

  it.each([
    ['missing', undefined],
    ['another site', 'https://elsewhere.test/'],
    ['protocol-relative address', '//elsewhere.test/path'],
    ['backslash trick', '/\\elsewhere.test'],
    ['the sign-in page itself', '/sign-in?returnUrl=%2Fprojects'],
  ])('goes to the projects for a %s', (_case, returnUrl) => {
    expect(safeReturnUrl(returnUrl)).toBe('/projects');
  });
});
