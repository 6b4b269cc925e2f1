import type { DataSource, Repository } from 'typeorm';
import { ConflictError, NotFoundError } from '../http/errors';
import { type UserAdminView, toUserAdminView } from './user-views';
import { User } from './user.entity';

export class UserService {
  private readonly users: Repository<User>;

  constructor(dataSource: DataSource) {
    this.users = dataSource.getRepository(User);
  }

  async list(): Promise<UserAdminView[]> {
    const users = await this.users.find({ order: { name: 'ASC', email: 'ASC' } });
    return users.map(toUserAdminView);
  }

  findByEmail(email: string): Promise<User | null> {
    return this.users.findOneBy({ email: email.toLowerCase() });
  }

  async get(userId: string): Promise<User> {
    const user = await this.users.findOneBy({ id: userId });
    if (!user) throw new NotFoundError('User not found.', { code: 'user_not_found' });
    return user;
  }

  /** Blocks sign-in and ends every session the user has (their session version moves on). */
  async deactivate(actorId: string, userId: string): Promise<UserAdminView> {
    if (actorId === userId) {
      throw new ConflictError('You cannot deactivate your own account.', { code: 'cannot_deactivate_self' });
    }
    await this.get(userId);
    await this.users.update({ id: userId }, { active: false, sessionVersion: () => '"sessionVersion" + 1' });
    return toUserAdminView(await this.get(userId));
  }

  async reactivate(userId: string): Promise<UserAdminView> {
    await this.get(userId);
    await this.users.update({ id: userId }, { active: true });
    return toUserAdminView(await this.get(userId));
  }

  async recordSignIn(userId: string): Promise<void> {
    await this.users.update({ id: userId }, { lastSignInAt: new Date() });
  }
}
