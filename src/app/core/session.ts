import { HttpClient, HttpContext } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import { ApiError, REDIRECT_ON_UNAUTHORISED } from './api-error';
import { CsrfTokenStore } from './csrf-token-store';
import { ProjectAction, ProjectRole } from './permissions';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

export interface Membership {
  projectId: string;
  projectName: string;
  role: ProjectRole;
}

/** `GET /api/auth/me` */
export interface Me {
  user: SessionUser;
  memberships: Membership[];
  permissions: Record<string, ProjectAction[]>;
  canCreateProjects: boolean;
  devOutbox: boolean;
}

// Session calls answer 401 as part of their normal flow, so they never bounce to the sign-in page.
const quiet = () => ({ context: new HttpContext().set(REDIRECT_ON_UNAUTHORISED, false) });

/** Who is signed in and what they may do, as signals. `undefined` until the server was first asked. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly csrfToken = inject(CsrfTokenStore);

  private readonly state = signal<Me | null | undefined>(undefined);
  private pending: Promise<Me | null> | null = null;

  readonly me = this.state.asReadonly();
  readonly user = computed(() => this.state()?.user ?? null);
  readonly signedIn = computed(() => !!this.state());
  readonly isAdmin = computed(() => this.state()?.user.isAdmin ?? false);
  readonly canCreateProjects = computed(() => this.state()?.canCreateProjects ?? false);
  readonly devOutbox = computed(() => this.state()?.devOutbox ?? false);

  /**
   * What the server listed for this project (it applies the role and the archived rule); a site
   * admin may open projects the list does not name.
   */
  can(projectId: string, action: ProjectAction): boolean {
    const me = this.state();
    if (!me) return false;
    const listed = me.permissions[projectId];
    return listed ? listed.includes(action) : me.user.isAdmin;
  }

  /** Knows whether this user is a member of the project at all (admins see every project). */
  knowsProject(projectId: string): boolean {
    const me = this.state();
    return !!me && (me.user.isAdmin || projectId in me.permissions);
  }

  /** The session as last loaded, asking the server only the first time. */
  ensureLoaded(): Promise<Me | null> {
    const known = this.state();
    if (known !== undefined) return Promise.resolve(known);
    return this.refresh();
  }

  /** Asks the server again, e.g. after the user's memberships changed. */
  refresh(): Promise<Me | null> {
    this.pending ??= this.fetchMe().finally(() => (this.pending = null));
    return this.pending;
  }

  async signIn(email: string, password: string): Promise<Me> {
    await firstValueFrom(this.http.post('/api/auth/login', { email, password }, quiet()));
    return this.afterSessionChange();
  }

  /** After accepting an invitation the server has already signed the user in. */
  async signedInByServer(): Promise<Me> {
    return this.afterSessionChange();
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/logout', null, quiet()));
    } finally {
      this.csrfToken.reset();
      this.state.set(null);
    }
  }

  /** The server no longer knows this session (expired, or the user was deactivated). */
  markSignedOut(): void {
    this.csrfToken.reset();
    this.state.set(null);
  }

  private async afterSessionChange(): Promise<Me> {
    // The new session needs a new CSRF token.
    this.csrfToken.reset();
    const me = await this.refresh();
    if (!me) throw new ApiError(401, 'unauthorised', 'Signing in did not take effect. Try again.');
    return me;
  }

  private async fetchMe(): Promise<Me | null> {
    try {
      const me = await firstValueFrom(this.http.get<Me>('/api/auth/me', quiet()));
      this.state.set(me);
      return me;
    } catch (error) {
      if (error instanceof ApiError && error.status === 401) {
        this.state.set(null);
        return null;
      }
      throw error;
    }
  }
}
