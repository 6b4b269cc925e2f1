import { Injectable } from '@angular/core';
import { Observable, shareReplay } from 'rxjs';

/**
 * Holds the CSRF token for this browser session. The server ties the token to the session, so it
 * is dropped whenever the session changes (sign-in, sign-out) and fetched again on next use.
 */
@Injectable({ providedIn: 'root' })
export class CsrfTokenStore {
  private cached: Observable<string> | null = null;

  /** The cached token, or the one `fetchToken` yields; concurrent callers share one request. */
  token(fetchToken: () => Observable<string>): Observable<string> {
    // shareReplay resets after an error, so a failed fetch is retried by the next caller.
    this.cached ??= fetchToken().pipe(shareReplay(1));
    return this.cached;
  }

  reset(): void {
    this.cached = null;
  }
}
