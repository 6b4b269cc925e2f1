import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { NOTIFICATION_SETTINGS_URL } from '../findings-api';
import { openNotificationSettings } from './notification-settings';

describe('NotificationSettings', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: provideApiForTests() });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    TestBed.inject(MatDialog).closeAll();
    backend.verify();
  });

  async function open(): Promise<HTMLElement> {
    openNotificationSettings(TestBed.inject(MatDialog));
    (await nextRequest(backend, NOTIFICATION_SETTINGS_URL)).flush({ assigned: true, statusChanged: false, mentioned: true });
    await settle();
    return document.querySelector<HTMLElement>('tl-notification-settings')!;
  }

  const toggles = (dialog: HTMLElement) => [...dialog.querySelectorAll<HTMLButtonElement>('mat-slide-toggle button[role=switch]')];

  it('shows each kind of e-mail as stored and saves a change at once', async () => {
    const dialog = await open();
    expect(toggles(dialog).map((toggle) => toggle.getAttribute('aria-checked'))).toEqual(['true', 'false', 'true']);
    toggles(dialog)[0].click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const save = await nextRequest(backend, { method: 'PUT', url: NOTIFICATION_SETTINGS_URL });
    expect(save.request.body).toEqual({ assigned: false, statusChanged: false, mentioned: true });
    save.flush({ assigned: false, statusChanged: false, mentioned: true });
    await settle();
    expect(dialog.querySelector('[role=status]')!.textContent).toContain('Saved.');
  });

  it('puts the switch back when the server refuses', async () => {
    const dialog = await open();
    toggles(dialog)[2].click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'PUT', url: NOTIFICATION_SETTINGS_URL })).flush(
      { error: { code: 'internal', message: 'Something went wrong on the server. The error has been logged.', details: null } },
      { status: 500, statusText: 'Server Error' },
    );
    await settle();
    expect(dialog.querySelector('[role=alert]')!.textContent).toContain('Something went wrong on the server.');
    expect(toggles(dialog)[2].getAttribute('aria-checked')).toBe('true');
  });
});
