import { inject } from '@angular/core';
import { ActivatedRouteSnapshot, CanActivateFn, RedirectCommand, Router } from '@angular/router';
import { ProjectAction } from './permissions';
import { Session } from './session';
import { signInUrl } from './sign-in-redirect';

export const NOT_FOUND_PATH = '/not-found';

// Shows the not-found page under the address the user asked for, and says the same for "missing"
// and "not yours" so no project's existence leaks.
function notFound(router: Router, requestedUrl: string): RedirectCommand {
  return new RedirectCommand(router.parseUrl(NOT_FOUND_PATH), { browserUrl: requestedUrl });
}

function projectIdOf(route: ActivatedRouteSnapshot): string | null {
  for (let current: ActivatedRouteSnapshot | null = route; current; current = current.parent) {
    const id = current.paramMap.get('projectId');
    if (id) return id;
  }
  return null;
}

export const signedInGuard: CanActivateFn = async (_route, state) => {
  const session = inject(Session);
  const router = inject(Router);
  return (await session.ensureLoaded()) ? true : signInUrl(router, state.url);
};

export const adminGuard: CanActivateFn = async (_route, state) => {
  const session = inject(Session);
  const router = inject(Router);
  const me = await session.ensureLoaded();
  if (!me) return signInUrl(router, state.url);
  return me.user.isAdmin || notFound(router, state.url);
};

/** Lets the user in when their role in the route's project (`:projectId`) allows `action`. */
export function projectPermissionGuard(action: ProjectAction): CanActivateFn {
  return async (route, state) => {
    const session = inject(Session);
    const router = inject(Router);
    const projectId = projectIdOf(route);
    let me = await session.ensureLoaded();
    // A project we have not heard of may be a membership granted since the session was loaded.
    if (me && projectId && !session.knowsProject(projectId)) me = await session.refresh();
    if (!me) return signInUrl(router, state.url);
    return (!!projectId && session.can(projectId, action)) || notFound(router, state.url);
  };
}
