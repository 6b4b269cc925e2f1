import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom, Observable } from 'rxjs';
import { CSRF_HEADER, CSRF_TOKEN_URL, csrfInterceptor } from './csrf.interceptor';

describe('csrfInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([csrfInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  // The outcome, success or error, so a failed expectation never leaves a rejection unhandled.
  function outcome(request: Observable<unknown>): Promise<unknown> {
    return firstValueFrom(request).catch((error: unknown) => error);
  }

  const csrfRejection = {
    status: 403,
    statusText: 'Forbidden',
  };
  const csrfBody = { error: { code: 'csrf_invalid', message: 'The security token is missing or out of date.' } };

  it('leaves reads alone', async () => {
    const read = firstValueFrom(http.get('/api/projects'));
    const request = backend.expectOne('/api/projects');
    expect(request.request.headers.has(CSRF_HEADER)).toBe(false);
    request.flush({ projects: [] });
    await read;
  });

  it('fetches the token once and sends it with every state-changing request', async () => {
    const first = firstValueFrom(http.post('/api/projects', { name: 'A' }));
    backend.expectOne({ method: 'GET', url: CSRF_TOKEN_URL }).flush({ token: 't-1' });
    const post = backend.expectOne({ method: 'POST', url: '/api/projects' });
    expect(post.request.headers.get(CSRF_HEADER)).toBe('t-1');
    post.flush({ project: {} });
    await first;

    const second = firstValueFrom(http.delete('/api/projects/p/members/u'));
    // No second token request: expectOne below would see it, and verify() would fail on it.
    backend.expectNone(CSRF_TOKEN_URL);
    const del = backend.expectOne({ method: 'DELETE', url: '/api/projects/p/members/u' });
    expect(del.request.headers.get(CSRF_HEADER)).toBe('t-1');
    del.flush(null, { status: 204, statusText: 'No Content' });
    await second;
  });

  it('shares one token request between concurrent writes', async () => {
    const writes = Promise.all([
      firstValueFrom(http.put('/api/projects/p/members/u', { role: 'reviewer' })),
      firstValueFrom(http.patch('/api/projects/p', { name: 'B' })),
    ]);
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 't-1' });
    for (const url of ['/api/projects/p/members/u', '/api/projects/p']) {
      const request = backend.expectOne(url);
      expect(request.request.headers.get(CSRF_HEADER)).toBe('t-1');
      request.flush({});
    }
    await writes;
  });

  it('refetches the token once after a CSRF rejection and retries', async () => {
    const write = outcome(http.post('/api/auth/logout', null));
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'stale' });
    backend.expectOne('/api/auth/logout').flush(csrfBody, csrfRejection);
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'fresh' });
    const retry = backend.expectOne('/api/auth/logout');
    expect(retry.request.headers.get(CSRF_HEADER)).toBe('fresh');
    retry.flush(null, { status: 204, statusText: 'No Content' });
    expect(await write).toBeNull();
  });

  it('gives up after the second CSRF rejection instead of looping', async () => {
    const write = outcome(http.post('/api/projects', {}));
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'a' });
    backend.expectOne('/api/projects').flush(csrfBody, csrfRejection);
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'b' });
    backend.expectOne('/api/projects').flush(csrfBody, csrfRejection);
    expect(await write).toMatchObject({ status: 403 });
  });

  it('does not retry a 403 that is about permissions', async () => {
    const write = outcome(http.post('/api/projects', {}));
    backend.expectOne(CSRF_TOKEN_URL).flush({ token: 'a' });
    backend
      .expectOne('/api/projects')
      .flush({ error: { code: 'forbidden', message: 'You do not have permission to do this.' } }, csrfRejection);
    expect(await write).toMatchObject({ status: 403 });
  });
});
