import type { SignedInUser } from '../auth/session-user';
import type { User } from './user.entity';

/** What any signed-in screen may show about a user. */
export interface UserSummary {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** The user-admin list row. */
export interface UserAdminView extends UserSummary {
  active: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}

export function toUserSummary(user: Pick<SignedInUser, 'id' | 'email' | 'name' | 'isAdmin'>): UserSummary {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

export function toUserAdminView(user: User): UserAdminView {
  return {
    ...toUserSummary(user),
    active: user.active,
    createdAt: user.createdAt.toISOString(),
    lastSignInAt: user.lastSignInAt?.toISOString() ?? null,
  };
}
