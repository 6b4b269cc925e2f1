import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { ResetPasswordRequest } from './reset-password-request';

describe('ResetPasswordRequest', () => {
  it('gives the same answer whether or not the address has an account', async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
    const backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ResetPasswordRequest);
    await fixture.whenStable();
    const page = fixture.nativeElement as HTMLElement;
    const email = page.querySelector<HTMLInputElement>('input[type=email]')!;
    email.value = 'maybe@example.test';
    email.dispatchEvent(new Event('input'));
    page.querySelector<HTMLButtonElement>('button[type=submit]')!.click();

    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const request = await nextRequest(backend, { method: 'POST', url: '/api/auth/password-reset' });
    expect(request.request.body).toEqual({ email: 'maybe@example.test' });
    request.flush({ status: 'accepted' }, { status: 202, statusText: 'Accepted' });
    await settle();
    expect(page.querySelector('[role=status]')?.textContent).toContain('If maybe@example.test belongs to an active account');
    backend.verify();
  });
});
