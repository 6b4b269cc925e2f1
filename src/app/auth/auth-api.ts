import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';
import { ApiError, errorMessage } from '../core/api-error';

/** `GET /api/auth/invitations/:token` */
export interface InvitationPreview {
  email: string;
  name: string | null;
  expiresAt: string;
  /** The address has an account: its holder signs in and joins instead of creating one. */
  hasAccount: boolean;
  project: { name: string; role: string } | null;
}

/** The token links sent by e-mail: accepting an invitation and resetting a password. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  /** Creates the account and signs it in. */
  acceptInvitation(token: string, name: string, password: string): Observable<unknown> {
    return this.http.post(`${invitationUrl(token)}/accept`, { name, password });
  }

  /** The signed-in holder of the invited address joins the invitation's project. */
  joinInvitation(token: string): Observable<{ projectId: string | null }> {
    return this.http.post<{ projectId: string | null }>(`${invitationUrl(token)}/join`, null);
  }

  /** The server answers the same whether or not the address has an account. */
  requestPasswordReset(email: string): Observable<unknown> {
    return this.http.post('/api/auth/password-reset', { email });
  }

  resetPassword(token: string, password: string): Observable<unknown> {
    return this.http.post(passwordResetUrl(token), { password });
  }
}

export function invitationUrl(token: string): string {
  return `/api/auth/invitations/${encodeURIComponent(token)}`;
}

export function passwordResetUrl(token: string): string {
  return `/api/auth/password-reset/${encodeURIComponent(token)}`;
}

export interface LinkProblem {
  title: string;
  message: string;
}

/** Why an e-mailed link cannot be used: a short title by error code, the server's explanation below it. */
export function linkProblemOf(error: unknown): LinkProblem {
  const message = errorMessage(error);
  if (!(error instanceof ApiError)) return { title: 'The link could not be checked', message };
  if (error.code.endsWith('_expired')) return { title: 'This link has expired', message };
  if (error.code.endsWith('_used')) return { title: 'This link was already used', message };
  if (error.status === 404) return { title: 'This link is not valid', message };
  if (error.status === 410) return { title: 'This link can no longer be used', message };
  return { title: 'The link could not be checked', message };
}
