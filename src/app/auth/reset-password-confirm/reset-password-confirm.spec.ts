import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { ResetPasswordConfirm } from './reset-password-confirm';

describe('ResetPasswordConfirm', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'reset-password/:token', component: ResetPasswordConfirm }], withComponentInputBinding()),
        ...provideApiForTests(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create('/reset-password/r-9');
  });

  afterEach(() => backend.verify());

  it('says an expired link has expired and offers a new one', async () => {
    (await nextRequest(backend, '/api/auth/password-reset/r-9')).flush(
      { error: { code: 'reset_expired', message: 'This password-reset link has expired. Ask for a new one.' } },
      { status: 410, statusText: 'Gone' },
    );
    await settle();
    const page = harness.routeNativeElement!;
    expect(page.querySelector('[role=alert] h2')?.textContent).toBe('This link has expired');
    expect(page.querySelector('a')?.getAttribute('href')).toBe('/reset-password');
  });

  it('sets the new password and sends the user to sign in', async () => {
    (await nextRequest(backend, '/api/auth/password-reset/r-9')).flush({ email: 'engineer@example.test' });
    await settle();
    const page = harness.routeNativeElement!;
    expect(page.textContent).toContain('engineer@example.test');
    for (const input of page.querySelectorAll<HTMLInputElement>('input[type=password]')) {
      input.value = 'another long password';
      input.dispatchEvent(new Event('input'));
    }
    page.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const reset = await nextRequest(backend, { method: 'POST', url: '/api/auth/password-reset/r-9' });
    expect(reset.request.body).toEqual({ password: 'another long password' });
    reset.flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    expect(page.querySelector('[role=status]')?.textContent).toContain('Your password was changed.');
  });
});
