import { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { App } from './app';
import { CSRF_TOKEN_URL } from './core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from './core/http.testing';
import { Me } from './core/session';
import { meFor } from './core/session.testing';

@Component({ template: '<p>page</p>' })
class Page {}

describe('App frame', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: '**', component: Page }]), ...provideApiForTests()],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function render(me: Me | null): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(App);
    const whoAmI = backend.expectOne('/api/auth/me');
    if (me) whoAmI.flush(me);
    else whoAmI.flush({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function mainLinks(frame: HTMLElement): string[] {
    return [...frame.querySelectorAll('nav[aria-label="Main"] .link-label')].map((label) => label.textContent!.trim());
  }

  it('shows no navigation to an anonymous visitor, but always the cautions and a skip link', async () => {
    const frame = await render(null);
    expect(frame.querySelector('nav')).toBeNull();
    expect(frame.querySelector('footer')?.textContent).toContain('not a design');
    expect(frame.querySelector('.skip-link')?.textContent).toBe('Skip to main content');
  });

  it('adds Users for a site admin and Outbox only when the development mail server runs', async () => {
    expect(mainLinks(await render({ ...meFor('admin'), devOutbox: true }))).toEqual(['Projects', 'Users', 'Outbox']);
  });

  it('shows a coordinator only the projects', async () => {
    expect(mainLinks(await render(meFor('coordinator')))).toEqual(['Projects']);
  });

  it('moves keyboard focus to the page from the skip link', async () => {
    const frame = await render(meFor('engineer'));
    frame.querySelector<HTMLAnchorElement>('.skip-link')!.click();
    expect(document.activeElement).toBe(frame.querySelector('main'));
  });

  it('signs out from the account menu and goes to the sign-in page', async () => {
    const frame = await render(meFor('reviewer'));
    frame.querySelector<HTMLButtonElement>('.account-button')!.click();
    await settle();
    const signOut = [...document.querySelectorAll<HTMLButtonElement>('[mat-menu-item]')].find((item) =>
      item.textContent?.includes('Sign out'),
    )!;
    signOut.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, '/api/auth/logout')).flush(null, { status: 204, statusText: 'No Content' });
    await settle();
    expect(TestBed.inject(Router).url).toBe('/sign-in');
    expect(frame.querySelector('nav')).toBeNull();
  });
});
