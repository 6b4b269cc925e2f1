import { type DataSource, IsNull, MoreThan } from 'typeorm';
import { runTransaction } from '../data-source';
import { createLinkToken, hashLinkToken } from '../auth/token';
import { ConflictError, ForbiddenError, GoneError, NotFoundError } from '../http/errors';
import { invitationMail } from '../mail/invitation-mail';
import type { Mailer } from '../mail/mailer';
import { Project } from '../projects/project.entity';
import { ProjectMember } from '../projects/project-member.entity';
import type { ProjectRole } from '../projects/project-role';
import { Invitation } from './invitation.entity';
import { hashPassword } from './password';
import { User } from './user.entity';

export const INVITATION_LIFETIME_ms = 7 * 24 * 60 * 60 * 1000;

export interface InvitationRequest {
  email: string;
  name?: string;
  isAdmin?: boolean;
  project?: { id: string; role: ProjectRole };
  invitedBy: { id: string; name: string };
}

export interface InvitationView {
  id: string;
  email: string;
  expiresAt: string;
}

/** What the invitation link shows to whoever holds it (the invitee). */
export interface InvitationPreview {
  email: string;
  name: string;
  expiresAt: string;
  /** An address with an account joins by signing in; any other creates its account. */
  hasAccount: boolean;
  project: { name: string; role: ProjectRole } | null;
}

export class InvitationService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
  ) {}

  /**
   * Stores the invitation and e-mails its link; if the e-mail fails, nothing is kept. A project invitation goes out the
   * same way whether or not the address has an account, so the inviter does not learn which; the invitee joins by
   * accepting. Site invitations (no project, or admin rights) are for new accounts only: admins see every account.
   */
  async invite(request: InvitationRequest): Promise<InvitationView> {
    const email = request.email.toLowerCase();
    const hasAccount = await this.dataSource.getRepository(User).existsBy({ email });
    if (hasAccount && (!request.project || request.isAdmin)) {
      throw new ConflictError('A user with this e-mail address already exists.', { code: 'user_exists' });
    }
    const project = request.project
      ? await this.dataSource.getRepository(Project).findOneBy({ id: request.project.id })
      : null;
    if (request.project && !project) throw new NotFoundError('Project not found.', { code: 'project_not_found' });

    const { token, tokenHash } = createLinkToken();
    const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_ms);
    const invitations = this.dataSource.getRepository(Invitation);
    const invitation = await invitations.save(
      invitations.create({
        email,
        name: request.name ?? '',
        isAdmin: request.isAdmin ?? false,
        projectId: project?.id ?? null,
        role: request.project?.role ?? null,
        tokenHash,
        expiresAt,
        invitedById: request.invitedBy.id,
      }),
    );
    try {
      await this.mailer.send(
        invitationMail({
          to: email,
          inviteeName: invitation.name,
          inviterName: request.invitedBy.name,
          project: project && request.project ? { name: project.name, role: request.project.role } : undefined,
          acceptUrl: `${this.publicUrl}/invitations/${token}`,
          expiresAt,
          hasAccount,
        }),
      );
    } catch (error) {
      await invitations.delete({ id: invitation.id });
      throw error;
    }
    return { id: invitation.id, email, expiresAt: expiresAt.toISOString() };
  }

  async lookup(token: string): Promise<InvitationPreview> {
    const invitation = await this.findUsable(token);
    const project = invitation.projectId ? await this.dataSource.getRepository(Project).findOneBy({ id: invitation.projectId }) : null;
    return {
      email: invitation.email,
      name: invitation.name,
      expiresAt: invitation.expiresAt.toISOString(),
      hasAccount: await this.dataSource.getRepository(User).existsBy({ email: invitation.email }),
      project: project && invitation.role ? { name: project.name, role: invitation.role } : null,
    };
  }

  /**
   * Creates the account, applies every open invitation for the same address (each may add a
   * project membership) and marks them used, all in one transaction.
   */
  async accept(token: string, input: { name: string; password: string }): Promise<User> {
    const invitation = await this.findUsable(token);
    if (await this.dataSource.getRepository(User).existsBy({ email: invitation.email })) throw accountExistsError();
    const passwordHash = await hashPassword(input.password);
    return runTransaction(this.dataSource, async (manager) => {
      // Checked again inside the transaction: a second accept may have run meanwhile.
      const fresh = await manager.findOneByOrFail(Invitation, { id: invitation.id });
      if (fresh.usedAt) throw usedError();
      if (await manager.existsBy(User, { email: fresh.email })) throw accountExistsError();

      const others = await manager.findBy(Invitation, { email: fresh.email, usedAt: IsNull(), expiresAt: MoreThan(new Date()) });
      const open = [fresh, ...others.filter((i) => i.id !== fresh.id)];
      const user = await manager.save(
        manager.create(User, {
          email: fresh.email,
          name: input.name,
          passwordHash,
          isAdmin: open.some((i) => i.isAdmin),
        }),
      );
      for (const project of projectRoles(open)) {
        await manager.insert(ProjectMember, { projectId: project.projectId, userId: user.id, role: project.role });
      }
      await manager.update(Invitation, open.map((i) => i.id), { usedAt: new Date() });
      return user;
    });
  }

  /** The signed-in holder of the invited address joins the invitation's project with its role. */
  async join(token: string, user: { id: string; email: string }): Promise<{ projectId: string | null }> {
    const invitation = await this.findUsable(token);
    if (invitation.email !== user.email) {
      throw new ForbiddenError(`This invitation is for ${invitation.email}. Sign out and sign in with that address to accept it.`, {
        code: 'invitation_for_other_account',
      });
    }
    return runTransaction(this.dataSource, async (manager) => {
      const fresh = await manager.findOneByOrFail(Invitation, { id: invitation.id });
      if (fresh.usedAt) throw usedError();
      const { projectId, role } = fresh;
      if (projectId && role && !(await manager.existsBy(ProjectMember, { projectId, userId: user.id }))) {
        await manager.insert(ProjectMember, { projectId, userId: user.id, role });
      }
      await manager.update(Invitation, fresh.id, { usedAt: new Date() });
      return { projectId: fresh.projectId };
    });
  }

  private async findUsable(token: string): Promise<Invitation> {
    const invitation = await this.dataSource.getRepository(Invitation).findOneBy({ tokenHash: hashLinkToken(token) });
    if (!invitation) {
      throw new NotFoundError('This invitation link is not valid. Check that you copied the whole link.', {
        code: 'invitation_not_found',
      });
    }
    if (invitation.usedAt) throw usedError();
    if (invitation.expiresAt.getTime() <= Date.now()) {
      throw new GoneError('This invitation has expired. Ask an administrator or project coordinator to invite you again.', {
        code: 'invitation_expired',
      });
    }
    return invitation;
  }
}

function usedError(): GoneError {
  return new GoneError('This invitation has already been used. Sign in with your e-mail address and password.', {
    code: 'invitation_used',
  });
}

function accountExistsError(): ConflictError {
  return new ConflictError('This address already has an account. Sign in with it, then open the invitation link again to join.', {
    code: 'account_exists',
  });
}

/** One membership per project; the most recent invitation to a project decides the role. */
function projectRoles(invitations: Invitation[]): { projectId: string; role: ProjectRole }[] {
  const byProject = new Map<string, { at: number; role: ProjectRole }>();
  for (const i of invitations) {
    if (!i.projectId || !i.role) continue;
    const current = byProject.get(i.projectId);
    if (!current || i.createdAt.getTime() >= current.at) byProject.set(i.projectId, { at: i.createdAt.getTime(), role: i.role });
  }
  return [...byProject].map(([projectId, { role }]) => ({ projectId, role }));
}
