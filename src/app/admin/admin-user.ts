import { ProjectRole } from '../core/permissions';

/** A row of `GET /api/users`. */
export interface AdminUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  active: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}

/** Body of `POST /api/users/invitations`. */
export interface InvitationRequest {
  email: string;
  name?: string;
  isAdmin?: boolean;
  projectId?: string;
  role?: ProjectRole;
}
