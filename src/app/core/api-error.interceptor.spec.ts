import { HttpClient, HttpContext, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { firstValueFrom } from 'rxjs';
import { ApiError, REDIRECT_ON_UNAUTHORISED } from './api-error';
import { apiErrorInterceptor } from './api-error.interceptor';
import { Session } from './session';
import { meFor } from './session.testing';

@Component({ template: 'page' })
class Page {}

describe('apiErrorInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'sign-in', component: Page },
          { path: 'projects/:projectId/checks', component: Page },
        ]),
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function failure(url: string, respond: (request: ReturnType<HttpTestingController['expectOne']>) => void, context?: HttpContext) {
    const call = firstValueFrom(http.get(url, { context }));
    respond(backend.expectOne(url));
    return call.then(
      () => {
        throw new Error('expected the request to fail');
      },
      (error: unknown) => error,
    );
  }

  it("carries the server's code, message and details", async () => {
    const error = await failure('/api/projects/p/members/u', (request) =>
      request.flush(
        { error: { code: 'last_coordinator', message: 'A project needs at least one coordinator.', details: { userId: 'u' } } },
        { status: 409, statusText: 'Conflict' },
      ),
    );
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 409,
      code: 'last_coordinator',
      message: 'A project needs at least one coordinator.',
      details: { userId: 'u' },
    });
  });

  it('explains a gateway page that is not our JSON', async () => {
    const error = await failure('/api/health', (request) =>
      request.flush('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' }),
    );
    expect(error).toMatchObject({ status: 502, code: 'http_error' });
    expect((error as ApiError).message).toContain('could not complete the request');
  });

  it('says the server cannot be reached when the network fails', async () => {
    const error = await failure('/api/health', (request) => request.error(new ProgressEvent('error')));
    expect(error).toMatchObject({ status: 0, code: 'network' });
    expect((error as ApiError).message).toContain('Cannot reach the Taulens server');
  });

  it('sends a lost session to sign in, remembering the page', async () => {
    const harness = await RouterTestingHarness.create('/projects/p1/checks');
    const session = TestBed.inject(Session);
    const loading = session.refresh();
    backend.expectOne('/api/auth/me').flush(meFor('engineer'));
    await loading;

    await failure('/api/projects/p1', (request) =>
      request.flush({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401, statusText: 'Unauthorized' }),
    );
    await harness.fixture.whenStable();

    expect(TestBed.inject(Router).url).toBe('/sign-in?returnUrl=%2Fprojects%2Fp1%2Fchecks');
    expect(session.signedIn()).toBe(false);
  });

  it('leaves the page alone when a 401 is an expected answer', async () => {
    await RouterTestingHarness.create('/projects/p1/checks');
    const error = await failure(
      '/api/auth/login',
      (request) =>
        request.flush(
          { error: { code: 'invalid_credentials', message: 'The e-mail address or password is not right.' } },
          { status: 401, statusText: 'Unauthorized' },
        ),
      new HttpContext().set(REDIRECT_ON_UNAUTHORISED, false),
    );
    expect(error).toMatchObject({ status: 401, code: 'invalid_credentials' });
    expect(TestBed.inject(Router).url).toBe('/projects/p1/checks');
  });
});
