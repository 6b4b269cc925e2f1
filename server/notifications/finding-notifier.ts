/**
 * Sends the finding e-mails after a change has been committed. A failed e-mail is logged and never undoes the
 * change or fails the request. Nobody is mailed about their own change, and only active members of the project
 * who have not switched that kind of e-mail off are mailed.
 */
import type { Logger } from 'pino';
import { type DataSource, In } from 'typeorm';
import { Finding } from '../findings/finding.entity';
import { type FindingStatus, findingReference } from '../findings/finding-fields';
import { statusLabel } from '../findings/finding-export-view';
import type { Mailer, MailMessage } from '../mail/mailer';
import { Project } from '../projects/project.entity';
import { ProjectMember } from '../projects/project-member.entity';
import type { User } from '../users/user.entity';
import { type MailProject, type MailedFinding, assignedMail, mentionedMail, statusChangedMail } from './finding-mails';
import { type NotificationKind, NotificationPreferences } from './notification-preferences';

export type FindingNotice =
  | { kind: 'assigned'; projectId: string; findingIds: string[]; assigneeId: string; actorId: string }
  | {
      kind: 'status-changed';
      projectId: string;
      findingId: string;
      from: FindingStatus;
      to: FindingStatus;
      /** Null for a check run. */
      actorId: string | null;
      justification?: string | null;
    }
  | { kind: 'mentioned'; projectId: string; findingId: string; mentionedIds: string[]; actorId: string; text: string };

const PREFERENCE_OF: Readonly<Record<FindingNotice['kind'], NotificationKind>> = {
  assigned: 'assigned',
  'status-changed': 'statusChanged',
  mentioned: 'mentioned',
};

interface Scene {
  project: MailProject & { id: string };
  findings: Map<string, Finding>;
  /** Active project members by id (admins who are not members get no finding mail). */
  members: Map<string, User>;
}

/** Where services hand their notices once a change is committed (the demo seed passes one that sends nothing). */
export type NoticeSink = Pick<FindingNotifier, 'deliver'>;

export class FindingNotifier {
  private readonly preferences: NotificationPreferences;

  constructor(
    private readonly dataSource: DataSource,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
    private readonly logger: Logger,
  ) {
    this.preferences = new NotificationPreferences(dataSource);
  }

  /** Never throws: every problem is logged. */
  async deliver(notices: readonly FindingNotice[]): Promise<void> {
    if (notices.length === 0) return;
    try {
      const messages = await this.messagesFor(notices);
      const results = await Promise.allSettled(messages.map((message) => this.mailer.send(message)));
      results.forEach((result, i) => {
        if (result.status === 'rejected') this.logger.warn({ err: result.reason, to: messages[i].to }, 'finding e-mail not sent');
      });
    } catch (error) {
      this.logger.error({ err: error }, 'finding e-mails could not be prepared');
    }
  }

  private async messagesFor(notices: readonly FindingNotice[]): Promise<MailMessage[]> {
    const byProject = new Map<string, FindingNotice[]>();
    for (const notice of notices) byProject.set(notice.projectId, [...(byProject.get(notice.projectId) ?? []), notice]);
    const messages: MailMessage[] = [];
    for (const [projectId, projectNotices] of byProject) {
      const scene = await this.sceneFor(projectId, projectNotices);
      if (!scene) continue;
      for (const notice of projectNotices) messages.push(...(await this.messagesOf(notice, scene)));
    }
    return messages;
  }

  private async sceneFor(projectId: string, notices: readonly FindingNotice[]): Promise<Scene | null> {
    const project = await this.dataSource.getRepository(Project).findOneBy({ id: projectId });
    if (!project) return null;
    const ids = notices.flatMap((notice) => (notice.kind === 'assigned' ? notice.findingIds : [notice.findingId]));
    const findings = await this.dataSource.getRepository(Finding).findBy({ id: In(ids), projectId });
    const memberships = await this.dataSource.getRepository(ProjectMember).find({ where: { projectId }, relations: { user: true } });
    const members = new Map(memberships.flatMap((m) => (m.user?.active ? [[m.userId, m.user] as const] : [])));
    return { project: { id: project.id, name: project.name, code: project.code }, findings: new Map(findings.map((f) => [f.id, f])), members };
  }

  private mailed(scene: Scene, finding: Finding): MailedFinding {
    return {
      reference: findingReference(finding.number),
      title: finding.title,
      url: `${this.publicUrl}/projects/${scene.project.id}/findings/${finding.id}`,
    };
  }

  /** Members among `ids` other than the actor who want this kind of e-mail. */
  private async recipients(scene: Scene, ids: readonly (string | null)[], actorId: string | null, notice: FindingNotice): Promise<User[]> {
    const candidates = [...new Set(ids.filter((id): id is string => id !== null && id !== actorId && scene.members.has(id)))];
    const wanting = await this.preferences.wanting(candidates, PREFERENCE_OF[notice.kind]);
    return candidates.filter((id) => wanting.has(id)).map((id) => scene.members.get(id)!);
  }

  private actorName(scene: Scene, actorId: string): string {
    return scene.members.get(actorId)?.name ?? 'A Taulens administrator';
  }

  private async messagesOf(notice: FindingNotice, scene: Scene): Promise<MailMessage[]> {
    if (notice.kind === 'assigned') {
      const findings = notice.findingIds.flatMap((id) => scene.findings.get(id) ?? []);
      if (findings.length === 0) return [];
      const listUrl = `${this.publicUrl}/projects/${scene.project.id}/findings?assignee=me`;
      const to = await this.recipients(scene, [notice.assigneeId], notice.actorId, notice);
      return to.map((user) =>
        assignedMail(user, scene.project, this.actorName(scene, notice.actorId), findings.map((f) => this.mailed(scene, f)), listUrl),
      );
    }
    const finding = scene.findings.get(notice.findingId);
    if (!finding) return [];
    if (notice.kind === 'mentioned') {
      const to = await this.recipients(scene, notice.mentionedIds, notice.actorId, notice);
      return to.map((user) => mentionedMail(user, scene.project, this.mailed(scene, finding), this.actorName(scene, notice.actorId), notice.text));
    }
    const to = await this.recipients(scene, [finding.assigneeId, finding.createdById], notice.actorId, notice);
    const change = {
      fromLabel: statusLabel(notice.from),
      toLabel: statusLabel(notice.to),
      actorName: notice.actorId === null ? null : this.actorName(scene, notice.actorId),
      justification: notice.justification,
    };
    return to.map((user) => statusChangedMail(user, scene.project, this.mailed(scene, finding), change));
  }
}
