import type { DataSource } from 'typeorm';
import { ForbiddenError, UnauthenticatedError } from '../http/errors';
import { ProjectMember } from '../projects/project-member.entity';
import type { ProjectRole } from '../projects/project-role';
import { verifyAgainstDecoy, verifyPassword } from '../users/password';
import { type UserSummary, toUserSummary } from '../users/user-views';
import { User } from '../users/user.entity';
import { type Action, allowedActions, canCreateProjects } from './permissions';
import type { SignedInUser } from './session-user';

export interface MembershipView {
  projectId: string;
  projectName: string;
  role: ProjectRole;
}

/** GET /api/auth/me: who is signed in and what the client may offer them. */
export interface SessionView {
  user: UserSummary;
  memberships: MembershipView[];
  permissions: Record<string, Action[]>;
  canCreateProjects: boolean;
  devOutbox: boolean;
}

const SIGNED_IN_FIELDS = { id: true, email: true, name: true, isAdmin: true, active: true, sessionVersion: true } as const;

export class AuthService {
  constructor(private readonly dataSource: DataSource) {}

  /**
   * Wrong password and unknown address give the same answer (and take the same time). Only
   * with the right password does a deactivated account learn that it is deactivated.
   */
  async verifyCredentials(email: string, password: string): Promise<SignedInUser> {
    const user = await this.dataSource.getRepository(User).findOneBy({ email: email.toLowerCase() });
    const valid = user ? await verifyPassword(password, user.passwordHash) : await verifyAgainstDecoy(password);
    if (!user || !valid) {
      throw new UnauthenticatedError('The e-mail address or password is not right.', { code: 'invalid_credentials' });
    }
    if (!user.active) {
      throw new ForbiddenError('This account has been deactivated. Ask a site administrator to reactivate it.', {
        code: 'deactivated',
      });
    }
    return user;
  }

  /** The account behind a session, or null when it no longer qualifies (deactivated, password reset). */
  async findSessionUser(userId: string, sessionVersion: number): Promise<SignedInUser | null> {
    const user = await this.dataSource.getRepository(User).findOne({ where: { id: userId }, select: SIGNED_IN_FIELDS });
    return user && user.active && user.sessionVersion === sessionVersion ? user : null;
  }

  /** `outboxServed`: the server runs its dev outbox; only a site admin is told so (only they may read it). */
  async describeSession(user: SignedInUser, outboxServed: boolean): Promise<SessionView> {
    const members = await this.dataSource.getRepository(ProjectMember).find({
      where: { userId: user.id },
      relations: { project: true },
      order: { project: { name: 'ASC' } },
    });
    const memberships: MembershipView[] = [];
    const permissions: Record<string, Action[]> = {};
    for (const m of members) {
      if (!m.project) continue;
      memberships.push({ projectId: m.projectId, projectName: m.project.name, role: m.role });
      permissions[m.projectId] = allowedActions({ role: m.role, isAdmin: user.isAdmin, archived: m.project.archived });
    }
    return {
      user: toUserSummary(user),
      memberships,
      permissions,
      canCreateProjects: canCreateProjects(user, memberships.map((m) => m.role)),
      devOutbox: outboxServed && user.isAdmin,
    };
  }
}
