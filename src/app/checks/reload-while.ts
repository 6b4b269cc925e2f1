import { HttpContext } from '@angular/common/http';
import { effect, EffectRef, Signal } from '@angular/core';
import { SHOW_PROGRESS } from '../core/request-progress';

/** How often a page asks about runs the server is still working on. */
export const RUN_POLL_INTERVAL_MS = 1000;

/** For the polling requests: they run in the background, without the app's progress bar. */
export function backgroundContext(): HttpContext {
  return new HttpContext().set(SHOW_PROGRESS, false);
}

/**
 * Reloads `resource` every `interval_ms` while `active()` holds. Call in an injection context; the timer stops with
 * the component.
 */
export function reloadWhile(
  resource: { readonly isLoading: Signal<boolean>; reload(): boolean },
  active: () => boolean,
  interval_ms = RUN_POLL_INTERVAL_MS,
): EffectRef {
  return effect((onCleanup) => {
    if (resource.isLoading() || !active()) return;
    const timer = setTimeout(() => resource.reload(), interval_ms);
    onCleanup(() => clearTimeout(timer));
  });
}
