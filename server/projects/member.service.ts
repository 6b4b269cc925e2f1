import type { DataSource, EntityManager } from 'typeorm';
import { runTransaction } from '../data-source';
import { ConflictError, NotFoundError } from '../http/errors';
import { type InvitationView, InvitationService } from '../users/invitation.service';
import type { Mailer } from '../mail/mailer';
import { ProjectMember } from './project-member.entity';
import type { ProjectRole } from './project-role';

export interface MemberView {
  userId: string;
  email: string;
  name: string;
  role: ProjectRole;
  active: boolean;
}

export class MemberService {
  private readonly invitations: InvitationService;

  constructor(
    private readonly dataSource: DataSource,
    mailer: Mailer,
    publicUrl: string,
  ) {
    this.invitations = new InvitationService(dataSource, mailer, publicUrl);
  }

  async list(projectId: string): Promise<MemberView[]> {
    const members = await this.dataSource.getRepository(ProjectMember).find({
      where: { projectId },
      relations: { user: true },
      order: { user: { name: 'ASC' } },
    });
    return members.map(toMemberView);
  }

  /**
   * Invites the address into the project, whether or not it has an account, so the answer never tells which; the
   * invitee joins by accepting. Only someone already in the project is refused, as the member list shows them anyway.
   */
  async add(projectId: string, email: string, role: ProjectRole, actor: { id: string; name: string }): Promise<{ invitation: InvitationView }> {
    if (await this.dataSource.getRepository(ProjectMember).existsBy({ projectId, user: { email: email.toLowerCase() } })) {
      throw new ConflictError(`${email} is already a member of this project.`, { code: 'already_member' });
    }
    return { invitation: await this.invitations.invite({ email, project: { id: projectId, role }, invitedBy: actor }) };
  }

  async setRole(projectId: string, userId: string, role: ProjectRole): Promise<MemberView> {
    const member = await runTransaction(this.dataSource, async (manager) => {
      const current = await findMember(manager, projectId, userId);
      if (current.role === 'coordinator' && role !== 'coordinator') await assertAnotherCoordinator(manager, projectId, userId);
      await manager.update(ProjectMember, { projectId, userId }, { role });
      return findMember(manager, projectId, userId);
    });
    return toMemberView(member);
  }

  async remove(projectId: string, userId: string): Promise<void> {
    await runTransaction(this.dataSource, async (manager) => {
      const current = await findMember(manager, projectId, userId);
      if (current.role === 'coordinator') await assertAnotherCoordinator(manager, projectId, userId);
      await manager.delete(ProjectMember, { projectId, userId });
    });
  }
}

async function findMember(manager: EntityManager, projectId: string, userId: string): Promise<ProjectMember> {
  const member = await manager.findOne(ProjectMember, { where: { projectId, userId }, relations: { user: true } });
  if (!member) throw new NotFoundError('This user is not a member of the project.', { code: 'member_not_found' });
  return member;
}

/** Every project keeps at least one coordinator, or nobody could manage its members. */
async function assertAnotherCoordinator(manager: EntityManager, projectId: string, userId: string): Promise<void> {
  const coordinators = await manager.findBy(ProjectMember, { projectId, role: 'coordinator' });
  if (!coordinators.some((c) => c.userId !== userId)) {
    throw new ConflictError('A project needs at least one coordinator. Make someone else coordinator first.', {
      code: 'last_coordinator',
    });
  }
}

function toMemberView(member: ProjectMember): MemberView {
  if (!member.user) throw new Error('member loaded without its user');
  return { userId: member.userId, email: member.user.email, name: member.user.name, role: member.role, active: member.user.active };
}
