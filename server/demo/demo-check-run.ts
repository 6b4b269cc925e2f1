/**
 * Demo step: one finished check run on the depot project, started by the demo engineer on the latest revision and
 * the demo shear results with the project's parameters, so a new user sees a results table, calculation sheets and
 * colours in the 3D view at once. Invented data, for the demo only.
 *
 * Seeding happens before the app and its listeners exist, so this run's `check-run.finished` reaches no one; the
 * findings of the demo are made from this run by their own step.
 */
import { CheckRun } from '../checks/check-run.entity';
import { CheckRunService } from '../checks/check-run.service';
import { createDomainEvents } from '../http/domain-events';
import { latestReadyRevision } from '../models/model-queries';
import { ResultMatchingService } from '../results/result-matching.service';
import { ResultSet } from '../results/result-set.entity';
import { DEMO_RESULTS_NAME } from './demo-results';
import { type DemoStep, demoProject, demoUser } from './demo-context';

export const demoCheckRunStep: DemoStep = {
  name: 'demo check run',
  async run(ctx) {
    const project = demoProject(ctx, 'depot');
    const revision = await latestReadyRevision(ctx.dataSource, project.id);
    const resultSet = await ctx.dataSource.getRepository(ResultSet).findOneBy({ projectId: project.id, name: DEMO_RESULTS_NAME });
    if (!revision || !resultSet) throw new Error('the demo check run needs the demo model and shear results: their steps must run first');
    if (await ctx.dataSource.getRepository(CheckRun).existsBy({ projectId: project.id, resultSetId: resultSet.id, status: 'done' })) return;

    const engineer = demoUser(ctx, 'engineer');
    const runs = new CheckRunService({ ...ctx, events: createDomainEvents(), matching: ResultMatchingService.of(ctx.dataSource) });
    const { finished } = await runs.start(project.id, { id: engineer.id, name: engineer.name }, {
      modelRevisionId: revision.id,
      resultSetId: resultSet.id,
      standard: project.standard,
      parameters: {},
    });
    const run = await finished;
    if (run.status !== 'done') throw new Error(`the demo check run failed: ${run.error}`);
  },
};
