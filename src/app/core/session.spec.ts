import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { CSRF_HEADER, CSRF_TOKEN_URL } from './csrf.interceptor';
import { provideApiForTests } from './http.testing';
import { Session } from './session';
import { meFor, TEST_PROJECT_ID } from './session.testing';

describe('Session', () => {
  let session: Session;
  let backend: HttpTestingController;

  const unauthorised = { status: 401, statusText: 'Unauthorized' };
  const signInFirst = { error: { code: 'unauthenticated', message: 'Please sign in.' } };

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), ...provideApiForTests()],
    });
    session = TestBed.inject(Session);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('asks the server once, however many callers wait', async () => {
    expect(session.me()).toBeUndefined();
    const first = session.ensureLoaded();
    const second = session.ensureLoaded();
    backend.expectOne('/api/auth/me').flush(meFor('reviewer'));
    await expect(Promise.all([first, second])).resolves.toEqual([meFor('reviewer'), meFor('reviewer')]);
    await session.ensureLoaded();
    expect(session.user()?.email).toBe('reviewer@example.test');
  });

  it('knows an anonymous visitor from a 401', async () => {
    const loading = session.ensureLoaded();
    backend.expectOne('/api/auth/me').flush(signInFirst, unauthorised);
    await expect(loading).resolves.toBeNull();
    expect(session.signedIn()).toBe(false);
    expect(session.can(TEST_PROJECT_ID, 'project.read')).toBe(false);
  });

  it("answers can() from the server's list for the project", async () => {
    const loading = session.refresh();
    backend.expectOne('/api/auth/me').flush(meFor('engineer'));
    await loading;
    expect(session.can(TEST_PROJECT_ID, 'check.run')).toBe(true);
    expect(session.can(TEST_PROJECT_ID, 'model.upload')).toBe(false);
    expect(session.can('another-project', 'project.read')).toBe(false);
    expect(session.isAdmin()).toBe(false);
  });

  it("lets a site admin into projects the list does not name, but keeps a listed project's limits", async () => {
    const admin = meFor('admin');
    // An archived project the admin is listed for: the server already removed the write actions.
    admin.permissions = { archived: ['project.read', 'export', 'project.archive'] };
    const loading = session.refresh();
    backend.expectOne('/api/auth/me').flush(admin);
    await loading;
    expect(session.can(TEST_PROJECT_ID, 'members.manage')).toBe(true);
    expect(session.can('archived', 'project.read')).toBe(true);
    expect(session.can('archived', 'model.upload')).toBe(false);
    expect(session.isAdmin()).toBe(true);
  });

  it('signs in with a fresh CSRF token and then loads who is signed in', async () => {
    const signingIn = session.signIn('coordinator@example.test', 'long enough password');
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'anonymous-token' });
    const login = backend.expectOne({ method: 'POST', url: '/api/auth/login' });
    expect(login.request.body).toEqual({ email: 'coordinator@example.test', password: 'long enough password' });
    expect(login.request.headers.get(CSRF_HEADER)).toBe('anonymous-token');
    login.flush({ user: meFor('coordinator').user });
    await Promise.resolve();
    backend.expectOne('/api/auth/me').flush(meFor('coordinator'));
    await expect(signingIn).resolves.toEqual(meFor('coordinator'));
    expect(session.can(TEST_PROJECT_ID, 'members.manage')).toBe(true);
    expect(session.canCreateProjects()).toBe(true);

    // The next write asks for a token bound to the new session.
    const signingOut = session.signOut();
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'signed-in-token' });
    const logout = backend.expectOne('/api/auth/logout');
    expect(logout.request.headers.get(CSRF_HEADER)).toBe('signed-in-token');
    logout.flush(null, { status: 204, statusText: 'No Content' });
    await signingOut;
    expect(session.signedIn()).toBe(false);
  });

  it("passes the server's reason on when signing in fails", async () => {
    const signingIn = session.signIn('engineer@example.test', 'wrong password');
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 't' });
    backend
      .expectOne('/api/auth/login')
      .flush({ error: { code: 'deactivated', message: 'This account is deactivated.' } }, { status: 403, statusText: 'Forbidden' });
    await expect(signingIn).rejects.toMatchObject({ code: 'deactivated', message: 'This account is deactivated.' });
    expect(session.signedIn()).toBe(false);
  });

  it('forgets the user on sign-out even if the server cannot be reached', async () => {
    const loading = session.refresh();
    backend.expectOne('/api/auth/me').flush(meFor('reviewer'));
    await loading;

    const signingOut = session.signOut();
    backend.expectOne(CSRF_TOKEN_URL).error(new ProgressEvent('error'));
    await expect(signingOut).rejects.toMatchObject({ code: 'network' });
    expect(session.signedIn()).toBe(false);
  });
});
