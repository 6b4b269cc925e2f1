import { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle, provideApiForTests } from '../../core/http.testing';
import { meFor } from '../../core/session.testing';
import { SignIn } from './sign-in';

@Component({ template: 'destination' })
class Destination {}

describe('SignIn', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'sign-in', component: SignIn },
            { path: '**', component: Destination },
          ],
          withComponentInputBinding(),
        ),
        ...provideApiForTests(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function openSignIn(url = '/sign-in?returnUrl=%2Fprojects%2Fp1%2Fchecks'): Promise<HTMLElement> {
    harness = await RouterTestingHarness.create(url);
    return harness.routeNativeElement!;
  }

  function type(element: HTMLElement, selector: string, value: string): void {
    const input = element.querySelector<HTMLInputElement>(selector)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  function submit(element: HTMLElement, email: string, password: string): void {
    type(element, 'input[type=email]', email);
    type(element, 'input[type=password]', password);
    element.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
  }

  async function answerLogin(status: 200 | 401 | 429, body: object): Promise<unknown> {
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const login = await nextRequest(backend, { method: 'POST', url: '/api/auth/login' });
    login.flush(body, { status, statusText: String(status) });
    return login.request.body;
  }

  it('signs in and returns to the page that asked for it', async () => {
    const page = await openSignIn();
    submit(page, ' engineer@example.test ', 'correct horse battery');
    expect(await answerLogin(200, { user: meFor('engineer').user })).toEqual({
      email: 'engineer@example.test',
      password: 'correct horse battery',
    });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('engineer'));
    await settle();
    expect(TestBed.inject(Router).url).toBe('/projects/p1/checks');
  });

  it("shows the server's message for a wrong password and clears the password", async () => {
    const page = await openSignIn();
    submit(page, 'engineer@example.test', 'not the password');
    await answerLogin(401, {
      error: { code: 'invalid_credentials', message: 'The e-mail address or password is not right.' },
    });
    await harness.fixture.whenStable();
    expect(page.querySelector('[role=alert]')?.textContent).toContain('The e-mail address or password is not right.');
    expect(page.querySelector<HTMLInputElement>('input[type=password]')!.value).toBe('');
    expect(TestBed.inject(Router).url).toBe('/sign-in?returnUrl=%2Fprojects%2Fp1%2Fchecks');
  });

  it('says to wait when sign-in is rate limited', async () => {
    const page = await openSignIn();
    submit(page, 'engineer@example.test', 'guess number eleven');
    await answerLogin(429, { error: { code: 'rate_limited', message: 'Too many attempts. Wait a few minutes and try again.' } });
    await harness.fixture.whenStable();
    expect(page.querySelector('[role=alert]')?.textContent).toContain('Too many attempts');
  });

  it('sends nothing while the form is incomplete', async () => {
    const page = await openSignIn();
    submit(page, 'not-an-address', '');
    await harness.fixture.whenStable();
    expect(backend.match(() => true)).toEqual([]);
    expect(page.textContent).toContain('This is not an e-mail address.');
    expect(page.textContent).toContain('Enter your password.');
  });

  it('ignores a return address on another site', async () => {
    const page = await openSignIn('/sign-in?returnUrl=%2F%2Felsewhere.test%2Fphish');
    submit(page, 'engineer@example.test', 'correct horse battery');
    await answerLogin(200, { user: meFor('engineer').user });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('engineer'));
    await settle();
    expect(TestBed.inject(Router).url).toBe('/projects');
  });
});
