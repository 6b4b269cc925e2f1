// HttpTestingController helpers for client specs. Not imported by the app.
import { HttpRequest, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { EnvironmentProviders, Provider } from '@angular/core';
import { apiInterceptors } from './api-interceptors';

type RequestMatch = string | { method?: string; url?: string } | ((request: HttpRequest<unknown>) => boolean);

/**
 * The request a component or guard sends a few tasks after the user acts (zoneless change
 * detection and async handlers run later). Fails if it never comes.
 */
export async function nextRequest(backend: HttpTestingController, match: RequestMatch): Promise<TestRequest> {
  // Up to about a second: dialogs hand over their result only after their closing animation.
  for (let tries = 0; tries < 100; tries++) {
    const [request] = backend.match(match);
    if (request) return request;
    await new Promise((resolve) => setTimeout(resolve, tries < 10 ? 0 : 10));
  }
  throw new Error(`No request matched ${typeof match === 'function' ? 'the predicate' : JSON.stringify(match)}`);
}

/** Lets pending tasks (navigation, change detection) finish. */
export function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 10));
}

/** The app's HTTP stack (all interceptors) over the testing backend. */
export function provideApiForTests(): (Provider | EnvironmentProviders)[] {
  return [provideHttpClient(withInterceptors(apiInterceptors)), provideHttpClientTesting()];
}
