import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { provideApiForTests, settle } from '../../core/http.testing';
import { Outbox } from './outbox';

describe('Outbox', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function render(respond: (request: ReturnType<HttpTestingController['expectOne']>) => void): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(Outbox);
    fixture.detectChanges();
    respond(backend.expectOne('/api/dev/outbox'));
    await settle();
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it("makes the message's links clickable and shows its markup as plain text", async () => {
    const page = await render((request) =>
      request.flush({
        messages: [
          {
            id: 'm1',
            to: 'newcomer@example.test',
            subject: 'You are invited to Taulens',
            text: 'Open http://localhost:4300/invitations/tok123 to join. <b>not bold</b>',
            html: '<p>ignored</p>',
            receivedAt: '2026-03-02T08:00:00Z',
          },
        ],
      }),
    );
    const link = page.querySelector<HTMLAnchorElement>('.body a')!;
    expect(link.getAttribute('href')).toBe('http://localhost:4300/invitations/tok123');
    expect(page.querySelector('.body b')).toBeNull();
    expect(page.querySelector('.body')?.textContent).toContain('<b>not bold</b>');
    expect(page.querySelector('summary')?.textContent).toContain('You are invited to Taulens');
  });

  it('explains that the outbox needs the development mail server', async () => {
    const page = await render((request) =>
      request.flush({ error: { code: 'not_found', message: 'Not found.' } }, { status: 404, statusText: 'Not Found' }),
    );
    expect(page.querySelector('[role=alert]')?.textContent).toContain('FAKE_SMTP');
  });
});
