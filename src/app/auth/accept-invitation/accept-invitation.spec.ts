import { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { meFor, signInForTest } from '../../core/session.testing';
import { AcceptInvitation } from './accept-invitation';

@Component({ template: 'projects' })
class Projects {}

describe('AcceptInvitation', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'invitations/:token', component: AcceptInvitation },
            { path: 'projects', component: Projects },
            { path: 'projects/:projectId', component: Projects },
          ],
          withComponentInputBinding(),
        ),
        ...provideApiForTests(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function open(answer: (request: Awaited<ReturnType<typeof nextRequest>>) => void) {
    const harness = await RouterTestingHarness.create('/invitations/tok-1');
    answer(await nextRequest(backend, '/api/auth/invitations/tok-1'));
    await settle();
    await harness.fixture.whenStable();
    return harness.routeNativeElement!;
  }

  const gone = (code: string, message: string) => (request: Awaited<ReturnType<typeof nextRequest>>) =>
    request.flush({ error: { code, message } }, { status: 410, statusText: 'Gone' });

  it('says plainly that an expired invitation has expired, with no form', async () => {
    const page = await open(gone('invitation_expired', 'This invitation has expired. Ask an administrator to invite you again.'));
    expect(page.querySelector('[role=alert] h2')?.textContent).toBe('This link has expired');
    expect(page.textContent).toContain('Ask an administrator to invite you again.');
    expect(page.querySelector('form')).toBeNull();
  });

  it('says plainly that a used invitation was used', async () => {
    const page = await open(gone('invitation_used', 'This invitation has already been used. Sign in with your e-mail address and password.'));
    expect(page.querySelector('[role=alert] h2')?.textContent).toBe('This link was already used');
    expect(page.querySelector('a')?.getAttribute('href')).toBe('/sign-in');
  });

  it('creates the account with the chosen name and password, then opens the projects', async () => {
    const page = await open((request) =>
      request.flush({ email: 'newcomer@example.test', name: 'New Comer', expiresAt: '2026-03-09T08:00:00Z', hasAccount: false, project: null }),
    );
    expect(page.querySelector<HTMLInputElement>('input[formcontrolname=name]')!.value).toBe('New Comer');
    for (const input of page.querySelectorAll<HTMLInputElement>('input[type=password]')) {
      input.value = 'a long new password';
      input.dispatchEvent(new Event('input'));
    }
    page.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const accept = await nextRequest(backend, { method: 'POST', url: '/api/auth/invitations/tok-1/accept' });
    expect(accept.request.body).toEqual({ name: 'New Comer', password: 'a long new password' });
    accept.flush({ user: meFor('engineer').user });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('engineer'));
    await settle();
    expect(TestBed.inject(Router).url).toBe('/projects');
  });

  const forExistingAccount = (request: Awaited<ReturnType<typeof nextRequest>>) =>
    request.flush({
      email: 'engineer@example.test',
      name: '',
      expiresAt: '2026-03-09T08:00:00Z',
      hasAccount: true,
      project: { name: 'Gantry 4', role: 'reviewer' },
    });

  it('asks the holder of an existing account to sign in, coming back here, instead of creating an account', async () => {
    const page = await open(forExistingAccount);
    expect(page.querySelector('form')).toBeNull();
    expect(page.textContent).toContain('to the project Gantry 4 as reviewer');
    const signIn = [...page.querySelectorAll('a')].find((a) => a.textContent?.trim() === 'Sign in to join')!;
    expect(signIn.getAttribute('href')).toBe('/sign-in?returnUrl=%2Finvitations%2Ftok-1');
  });

  it('lets the signed-in holder join the project, then opens it', async () => {
    await signInForTest(meFor('engineer'));
    const page = await open(forExistingAccount);
    [...page.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent?.trim() === 'Join the project')!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: '/api/auth/invitations/tok-1/join' })).flush({ projectId: 'p1' });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('engineer'));
    await settle();
    expect(TestBed.inject(Router).url).toBe('/projects/p1');
  });
});
