/**
 * Demo step: the findings of the depot's demo check run, as a finished run makes them, then a little review work so
 * the findings pages are not empty of people: the two most utilised failures assigned to the engineer with a due
 * date, a reviewer's comment mentioning her, and one warning accepted with a written justification. The words are
 * invented for the demo. Seeding sends no e-mail.
 */
import { CheckRun } from '../checks/check-run.entity';
import { FindingChange } from '../findings/finding-change.entity';
import { syncFindingsForRun } from '../findings/finding-run-listener';
import { type FindingAccess, type FindingActor, FindingService } from '../findings/finding.service';
import { Finding } from '../findings/finding.entity';
import type { ProjectRole } from '../projects/project-role';
import { type DemoContext, type DemoStep, type DemoUserKey, demoProject, demoUser } from './demo-context';

const NO_EMAIL = { deliver: async () => undefined };

function actorOf(ctx: DemoContext, key: DemoUserKey): FindingActor {
  const user = demoUser(ctx, key);
  return { id: user.id, name: user.name, email: user.email };
}

function accessOf(projectId: string, role: ProjectRole): FindingAccess {
  return { projectId, role, isAdmin: false, archived: false };
}

/** Counted from the day of seeding, so the demo always shows upcoming due dates. */
function dueIn(days: number): string {
  return new Date(Date.now() + days * 24 * 60 * 60 * 1000).toISOString().slice(0, 10);
}

export const demoFindingsStep: DemoStep = {
  name: 'demo findings',
  async run(ctx) {
    const project = demoProject(ctx, 'depot');
    const run = await ctx.dataSource.getRepository(CheckRun).findOne({ where: { projectId: project.id, status: 'done' }, order: { createdAt: 'DESC' } });
    if (!run) throw new Error('the demo findings need the demo check run: its step must run first');
    await syncFindingsForRun(ctx.dataSource, project.id, run.id);

    const findings = await ctx.dataSource.getRepository(Finding).find({ where: { projectId: project.id }, order: { utilisation: 'DESC' } });
    const ids = findings.map((finding) => finding.id);
    const reviewed = ids.length > 0 && (await ctx.dataSource.getRepository(FindingChange).exists({ where: ids.map((findingId) => ({ findingId, source: 'user' as const })) }));
    if (reviewed) return;

    const service = new FindingService(ctx.dataSource, ctx.storage, NO_EMAIL);
    const coordinator = actorOf(ctx, 'coordinator');
    const reviewer = actorOf(ctx, 'reviewer');
    const engineer = actorOf(ctx, 'engineer');
    const failures = findings.filter((finding) => finding.kind === 'web-shear-fail').slice(0, 2);
    for (const [i, finding] of failures.entries()) {
      await service.update(project.id, finding.id, { assigneeId: engineer.id, priority: i === 0 ? 'critical' : 'high', dueDate: dueIn(10 + 4 * i), labels: ['Transfer girders'] }, accessOf(project.id, 'coordinator'), coordinator);
    }
    if (failures[0]) {
      await service.addComment(
        project.id,
        failures[0].id,
        `@${engineer.name} this girder carries the loading-bay columns; please propose a thicker web or a doubler plate before the next model issue.`,
        reviewer,
      );
      await service.transition(project.id, failures[0].id, { to: 'in-progress' }, accessOf(project.id, 'engineer'), engineer);
    }
    const warning = findings.find((finding) => finding.kind === 'web-shear-warning');
    if (warning) {
      await service.transition(
        project.id,
        warning.id,
        {
          to: 'accepted',
          justification:
            'Reviewed with the engineer of record: the governing combination is the temporary erection case, and the beam is propped until the slab is cast (demo note).',
        },
        accessOf(project.id, 'reviewer'),
        reviewer,
      );
    }
  },
};
