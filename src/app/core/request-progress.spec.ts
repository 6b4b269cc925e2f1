import { HttpClient, HttpContext, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { RequestProgress, requestProgressInterceptor, SHOW_PROGRESS } from './request-progress';

describe('requestProgressInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let progress: RequestProgress;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([requestProgressInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    progress = TestBed.inject(RequestProgress);
  });

  afterEach(() => backend.verify());

  it('is busy until the last of several requests ends, failed or not', () => {
    http.get('/api/projects').subscribe();
    http.get('/api/users').subscribe({ error: () => undefined });
    expect(progress.busy()).toBe(true);
    backend.expectOne('/api/projects').flush({ projects: [] });
    expect(progress.busy()).toBe(true);
    backend.expectOne('/api/users').flush(null, { status: 500, statusText: 'Server Error' });
    expect(progress.busy()).toBe(false);
  });

  it('stops counting a request the page cancelled', () => {
    const subscription = http.get('/api/projects').subscribe();
    expect(progress.busy()).toBe(true);
    subscription.unsubscribe();
    expect(progress.busy()).toBe(false);
    expect(backend.expectOne('/api/projects').cancelled).toBe(true);
  });

  it('ignores background requests that opt out', () => {
    http.get('/api/jobs/1', { context: new HttpContext().set(SHOW_PROGRESS, false) }).subscribe();
    expect(progress.busy()).toBe(false);
    backend.expectOne('/api/jobs/1').flush({});
  });
});
