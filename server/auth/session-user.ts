import type { User } from '../users/user.entity';

/** What passport puts in req.user: the signed-in account, loaded afresh for each request. */
export type SignedInUser = Pick<User, 'id' | 'email' | 'name' | 'isAdmin' | 'active' | 'sessionVersion'>;

declare global {
  namespace Express {
    interface User extends SignedInUser {}
  }
}
