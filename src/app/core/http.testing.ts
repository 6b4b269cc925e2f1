// HttpTestingController helpers for client specs. Not imported by the app.
import { HttpRequest } from '@angular/common/http';
import { HttpTestingController, TestRequest } from '@angular/common/http/testing';

type RequestMatch = string | { method?: string; url?: string } | ((request: HttpRequest<unknown>) => boolean);

/**
 * The request a component or guard sends a few tasks after the user acts (zoneless change
 * detection and async handlers run later). Fails if it never comes.
 */
export async function nextRequest(backend: HttpTestingController, match: RequestMatch): Promise<TestRequest> {
  for (let tries = 0; tries < 50; tries++) {
    const [request] = backend.match(match);
    if (request) return request;
    await new Promise((resolve) => setTimeout(resolve));
  }
  throw new Error(`No request matched ${typeof match === 'function' ? 'the predicate' : JSON.stringify(match)}`);
}

/** Lets pending tasks (navigation, change detection) finish. */
export function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 10));
}
