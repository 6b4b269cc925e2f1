import { invitationRequestOf } from './invite-user-dialog';

describe('invitationRequestOf', () => {
  const blank = { email: ' ana@example.test ', name: ' ', isAdmin: false, projectId: '', role: 'reviewer' as const };

  it('sends only the address and admin flag when nothing else was filled in', () => {
    expect(invitationRequestOf(blank)).toEqual({ email: 'ana@example.test', isAdmin: false });
  });

  it('sends the role only together with a project', () => {
    expect(invitationRequestOf({ ...blank, name: 'Ana', projectId: 'p-1' })).toEqual({
      email: 'ana@example.test',
      isAdmin: false,
      name: 'Ana',
      projectId: 'p-1',
      role: 'reviewer',
    });
  });
});
