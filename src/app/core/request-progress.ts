import { HttpContextToken, HttpInterceptorFn } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { finalize } from 'rxjs';

/** Set to false on background requests (polling) that should not show the progress bar. */
export const SHOW_PROGRESS = new HttpContextToken<boolean>(() => true);

/** Counts API requests in flight so the app frame can show one progress bar for all of them. */
@Injectable({ providedIn: 'root' })
export class RequestProgress {
  private readonly inFlight = signal(0);
  readonly busy = computed(() => this.inFlight() > 0);

  started(): void {
    this.inFlight.update((count) => count + 1);
  }

  ended(): void {
    this.inFlight.update((count) => Math.max(0, count - 1));
  }
}

export const requestProgressInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.context.get(SHOW_PROGRESS)) return next(req);
  const progress = inject(RequestProgress);
  progress.started();
  return next(req).pipe(finalize(() => progress.ended()));
};
