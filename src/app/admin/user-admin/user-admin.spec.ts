import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { meFor, signInForTest } from '../../core/session.testing';
import { AdminUser } from '../admin-user';
import { UserAdmin } from './user-admin';

const users: AdminUser[] = [
  { id: 'user-admin', email: 'admin@example.test', name: 'Test admin', isAdmin: true, active: true, createdAt: '2026-01-01T00:00:00Z', lastSignInAt: '2026-03-01T09:30:00Z' },
  { id: 'u-2', email: 'leaver@example.test', name: 'Lee Leaver', isAdmin: false, active: true, createdAt: '2026-01-02T00:00:00Z', lastSignInAt: null },
];

describe('UserAdmin', () => {
  let backend: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'admin/users', component: UserAdmin }]), ...provideApiForTests()],
    });
    backend = TestBed.inject(HttpTestingController);
    await signInForTest(meFor('admin'));
    const harness = await RouterTestingHarness.create('/admin/users');
    (await nextRequest(backend, '/api/users')).flush({ users });
    await settle();
    page = harness.routeNativeElement!;
  });

  afterEach(() => backend.verify());

  async function chooseAction(userName: string, action: string): Promise<void> {
    page.querySelector<HTMLButtonElement>(`button[aria-label="Actions for ${userName}"]`)!.click();
    await settle();
    [...document.querySelectorAll<HTMLButtonElement>('[mat-menu-item]')].find((item) => item.textContent?.includes(action))!.click();
  }

  it('lists users with their status and last sign-in', () => {
    const rows = [...page.querySelectorAll('tbody tr')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Test admin Site admin');
    expect(rows[1]).toContain('Active');
    expect(rows[1]).toContain('Never');
  });

  it('deactivates a user only after the admin confirms', async () => {
    await chooseAction('Lee Leaver', 'Deactivate');
    await settle();
    [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-actions button')].find((b) => b.textContent?.trim() === 'Deactivate')!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: '/api/users/u-2/deactivate' })).flush({ user: { ...users[1], active: false } });
    (await nextRequest(backend, '/api/users')).flush({ users: [users[0], { ...users[1], active: false }] });
    await settle();
    expect(page.querySelector('[role=status]')?.textContent).toContain('Lee Leaver was deactivated.');
    expect(page.querySelectorAll('tbody tr')[1].textContent).toContain('Deactivated');
  });

  it('does not offer admins to deactivate themselves', async () => {
    page.querySelector<HTMLButtonElement>('button[aria-label="Actions for Test admin"]')!.click();
    await settle();
    const items = [...document.querySelectorAll('[mat-menu-item]')].map((item) => item.textContent!.trim());
    expect(items.some((item) => item.includes('Deactivate'))).toBe(false);
  });

  it('sends a password reset e-mail', async () => {
    await chooseAction('Lee Leaver', 'Send password reset');
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: '/api/users/u-2/password-reset' })).flush(null, { status: 202, statusText: 'Accepted' });
    (await nextRequest(backend, '/api/users')).flush({ users });
    await settle();
    expect(page.querySelector('[role=status]')?.textContent).toContain('A password reset link was sent to leaver@example.test.');
  });
});
