import { FindingChange } from '../../server/findings/finding-change.entity';
import { syncFindingsForRun } from '../../server/findings/finding-run-listener';
import { syncFindingsFromRun } from '../../server/findings/finding-sync';
import { Finding } from '../../server/findings/finding.entity';
import type { MemberRecord } from '../../server/ifc/model-read-result';
import { pdfPageTexts } from '../../server/reports/pdf-page-texts';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TEXT } from '../../server/reports/report-cautions';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { mailsTo } from '../fixtures/test-outbox';
import { generateFrame } from '../generator/generate-frame';
import { findingsUrl, runResult } from './findings-fixtures';
import { type RunBody, checksUrl, importResults, ingestModel, membersOf, resultsCsv, runCheck } from './results-scene';

/**
 * Findings following real check runs: a generated frame of our invented scenario ingested through the API, shear
 * results in which one beam is far over any capacity (invented forces), runs in the worker, and the
 * `check-run.finished` event. The second revision is the same frame saved again, with that beam's shear reduced.
 */
describe('findings from check runs', () => {
  let app: TestApp;
  let team: TestTeam;
  let projectId: string;
  let coordinator: ApiAgent;
  let engineer: ApiAgent;
  let reviewer: ApiAgent;
  let members: MemberRecord[];
  let overloaded: MemberRecord;
  let firstRun: RunBody;

  const findings = () => app.dataSource.getRepository(Finding).find({ where: { projectId }, order: { number: 'ASC' } });

  /** The sync runs after the run is stored; wait until a finding shows the run. */
  async function afterSync(runId: string): Promise<Finding[]> {
    for (let tries = 0; tries < 400; tries++) {
      const current = await findings();
      if (current.some((finding) => finding.runId === runId)) return current;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    throw new Error(`no finding followed run ${runId}`);
  }

  function shears(overloadedShear_kN: number): string {
    return resultsCsv(members.flatMap((member) => [[member.tag!, 'ULS-1', member === overloaded ? overloadedShear_kN : 12] as const, [member.tag!, 'ULS-2', -8] as const]));
  }

  async function checkRevision(fileName: string, overloadedShear_kN: number): Promise<RunBody> {
    const revision = await ingestModel(coordinator, projectId, generateFrame({ members: 24, fileName }), fileName);
    members = await membersOf(app, revision.id);
    overloaded ??= members.find((member) => member.profile && member.tag)!;
    const resultSet = await importResults(coordinator, projectId, revision.id, shears(overloadedShear_kN));
    return runCheck(engineer, projectId, { modelRevisionId: revision.id, resultSetId: resultSet.id, standard: 'en1993-1-1', parameters: {} });
  }

  beforeAll(async () => {
    app = await startTestApp();
    team = await createTeam(app.dataSource);
    projectId = team.project.id;
    [coordinator, engineer, reviewer] = await Promise.all([app.signIn(team.coordinator), app.signIn(team.engineer), app.signIn(team.reviewer)]);
    firstRun = await checkRevision('depot-frame-rev-1.ifc', 9000);
  });
  afterAll(() => app.close());

  const failFinding = async () => (await findings()).find((finding) => finding.kind === 'web-shear-fail' && finding.memberKey === overloaded.globalId)!;

  it('raises one finding for the failing member, by the system', async () => {
    const raised = await afterSync(firstRun.id);
    expect(firstRun.summary?.fail).toBe(1);
    const fails = raised.filter((finding) => finding.kind === 'web-shear-fail');
    expect(fails).toHaveLength(1);
    expect(fails[0]).toMatchObject({
      memberKey: overloaded.globalId,
      memberGlobalIds: [overloaded.globalId],
      memberTag: overloaded.tag,
      status: 'open',
      priority: 'high',
      createdById: null,
      runId: firstRun.id,
      revisionNumber: 1,
      title: `Web shear over capacity: ${overloaded.tag}`,
    });
    expect(fails[0].utilisation).toBeGreaterThan(1);
    const detail = await reviewer.get(findingsUrl(projectId, `/${fails[0].id}`)).expect(200);
    expect(detail.body.history).toEqual([expect.objectContaining({ actor: { id: null, name: 'System' }, source: 'system', field: 'created' })]);
  });

  it('does not duplicate findings when the same check runs again', async () => {
    const before = await afterSync(firstRun.id);
    const revision = firstRun.modelRevision as { id: string };
    const resultSet = firstRun.resultSet as { id: string };
    const again = await runCheck(engineer, projectId, { modelRevisionId: revision.id, resultSetId: resultSet.id, standard: 'en1993-1-1', parameters: {} });
    const after = await afterSync(again.id);
    expect(after.map((finding) => finding.id)).toEqual(before.map((finding) => finding.id));
    expect((await failFinding()).runId).toBe(again.id);
  });

  it('keeps one finding when the same revision is checked by another standard, and says which standard', async () => {
    const before = await findings();
    const revision = firstRun.modelRevision as { id: string };
    const resultSet = firstRun.resultSet as { id: string };
    const aisc = await runCheck(engineer, projectId, { modelRevisionId: revision.id, resultSetId: resultSet.id, standard: 'aisc360-22-lrfd', parameters: {} });
    const after = await afterSync(aisc.id);
    expect(after.map((finding) => [finding.id, finding.kind, finding.memberKey])).toEqual(before.map((finding) => [finding.id, finding.kind, finding.memberKey]));
    const failure = await failFinding();
    expect(failure.runId).toBe(aisc.id);
    expect(failure.description).toContain('in the AISC 360-22 LRFD check of model revision 1.');
  });

  it('keeps an accepted finding on the run it was accepted on until it is reopened', async () => {
    const accepted = await failFinding();
    const justification = 'Web doubler plates on the shop drawing cover the shear (invented scenario).';
    await reviewer.post(findingsUrl(projectId, `/${accepted.id}/transitions`)).send({ to: 'accepted', justification }).expect(200);
    const revision = firstRun.modelRevision as { id: string };
    const resultSet = firstRun.resultSet as { id: string };
    const later = await runCheck(engineer, projectId, { modelRevisionId: revision.id, resultSetId: resultSet.id, standard: 'en1993-1-1', parameters: {} });
    // Applied here as well as by the listener, so the test knows it has happened: an accepted finding shows no sign.
    await syncFindingsForRun(app.dataSource, projectId, later.id);
    const kept = await failFinding();
    expect(kept).toMatchObject({ status: 'accepted', justification, runId: accepted.runId, utilisation: accepted.utilisation, description: accepted.description });
    const report = await reviewer
      .get(`${checksUrl(projectId)}/${later.id}/report.pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const text = pdfPageTexts(report.body as Buffer).join(' ');
    expect(text).toContain('Accepted findings and their justifications');
    expect(text).toContain(justification);

    await reviewer.post(findingsUrl(projectId, `/${accepted.id}/transitions`)).send({ to: 'open' }).expect(200);
    await syncFindingsForRun(app.dataSource, projectId, later.id);
    expect(await failFinding()).toMatchObject({ status: 'open', justification: null, runId: later.id });
  });

  it('turns an accepted warning finding into a failure and reopens it, with history, when a later run finds the member failing', async () => {
    const member = members.find((candidate) => candidate !== overloaded && candidate.tag)!;
    await syncFindingsFromRun(app.dataSource, projectId, { runId: 'warning-run', revisionNumber: 1 }, [runResult(member.globalId, 'warning', 0.94)]);
    const warning = (await findings()).filter((finding) => finding.memberKey === member.globalId);
    expect(warning.map((finding) => finding.kind)).toEqual(['web-shear-warning']);
    const justification = 'Close to capacity is acceptable for this temporary strut (invented scenario).';
    await reviewer.post(findingsUrl(projectId, `/${warning[0].id}/transitions`)).send({ to: 'accepted', justification }).expect(200);
    await syncFindingsFromRun(app.dataSource, projectId, { runId: 'failure-run', revisionNumber: 1, standardLabel: 'AISC 360-22 ASD' }, [runResult(member.globalId, 'fail', 1.08)]);
    const after = (await findings()).filter((finding) => finding.memberKey === member.globalId);
    expect(after).toHaveLength(1);
    expect(after[0]).toMatchObject({
      id: warning[0].id,
      kind: 'web-shear-fail',
      status: 'open',
      justification: null,
      priority: 'high',
      title: `Web shear over capacity: T-${member.globalId.slice(0, 4)}`,
    });
    const history = await app.dataSource.getRepository(FindingChange).find({ where: { findingId: after[0].id }, order: { at: 'ASC' } });
    const system = history.filter((change) => change.source === 'system').map((change) => [change.field, change.fromValue]);
    expect(system).toEqual([
      ['created', null],
      ['title', `Web shear close to capacity: T-${member.globalId.slice(0, 4)}`],
      ['priority', 'normal'],
      ['status', 'accepted'],
      ['justification', justification],
      ['utilisation', '94 %'],
      ['description', warning[0].description],
    ]);
    expect(history.at(-1)?.toValue).toContain('in the AISC 360-22 ASD check of model revision 1.');
    // Leaves the scene as it was for the next revision's test.
    await app.dataSource.getRepository(FindingChange).delete({ findingId: after[0].id });
    await app.dataSource.getRepository(Finding).delete(after[0].id);
  });

  it('moves the finding to Ready to verify when a newer revision passes, telling the assignee', async () => {
    const finding = await failFinding();
    await coordinator.patch(findingsUrl(projectId, `/${finding.id}`)).send({ assigneeId: team.engineer.id }).expect(200);
    await engineer.post(findingsUrl(projectId, `/${finding.id}/transitions`)).send({ to: 'resolved' }).expect(400);
    await engineer.post(findingsUrl(projectId, `/${finding.id}/transitions`)).send({ to: 'resolved', note: 'Section changed to HE 400 B in revision 2.' }).expect(200);

    const secondRun = await checkRevision('depot-frame-rev-2.ifc', 15);
    await afterSync(secondRun.id);
    const moved = await failFinding();
    expect(moved).toMatchObject({ status: 'ready-to-verify', runId: secondRun.id, revisionNumber: 1 });
    expect(moved.utilisation).toBeLessThan(1);
    const change = await app.dataSource.getRepository(FindingChange).findOneByOrFail({ findingId: moved.id, field: 'status', toValue: 'ready-to-verify' });
    expect(change).toMatchObject({ actorId: null, source: 'system', fromValue: 'resolved' });
    // The e-mail goes out once the sync has been committed.
    const subject = (mail: { subject: string }) => mail.subject.includes('Ready to verify');
    let mails = await mailsTo(app.dataSource, team.engineer.email);
    for (let tries = 0; tries < 200 && !mails.some(subject); tries++) {
      await new Promise((resolve) => setTimeout(resolve, 50));
      mails = await mailsTo(app.dataSource, team.engineer.email);
    }
    expect(mails.at(-1)?.subject).toBe(`[${team.project.code}] ${'F-' + String(moved.number).padStart(4, '0')} is now Ready to verify: ${moved.title}`);
    expect(mails.at(-1)?.text).toContain('A check run of a newer model revision moved the finding');
  });

  describe('GET /api/projects/:projectId/checks/:runId/report.pdf', () => {
    it('returns the PDF report of the run with the cautions on every page and a sheet for the failing member', async () => {
      const response = await reviewer
        .get(`${checksUrl(projectId)}/${firstRun.id}/report.pdf`)
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (chunk: Buffer) => chunks.push(chunk));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        })
        .expect(200);
      expect(response.headers['content-type']).toBe('application/pdf');
      expect(response.headers['content-disposition']).toMatch(new RegExp(`^attachment; filename=${team.project.code}-check-revision-1-`));
      const pages = pdfPageTexts(response.body as Buffer);
      for (const [i, text] of pages.entries()) expect({ page: i + 1, cautions: text.includes(REPORT_CAUTIONS_TEXT) }).toEqual({ page: i + 1, cautions: true });
      for (const caution of REPORT_CAUTIONS) expect(pages[0]).toContain(caution);
      const all = pages.join(' ');
      expect(all).toContain(team.project.name);
      expect(all).toContain('depot-frame-rev-1.ifc');
      expect(all).toContain(`Calculation sheet — ${overloaded.tag}`);
      expect(all).toContain('F-0001');
    });

    it('returns 404 for a run of another project and 401 when signed out', async () => {
      const other = await createTeam(app.dataSource);
      const outsiderReviewer = await app.signIn(other.reviewer);
      await outsiderReviewer.get(`${checksUrl(other.project.id)}/${firstRun.id}/report.pdf`).expect(404);
      await (await app.agent()).get(`${checksUrl(projectId)}/${firstRun.id}/report.pdf`).expect(401);
      await (await app.signIn(team.outsider)).get(`${checksUrl(projectId)}/${firstRun.id}/report.pdf`).expect(404);
    });
  });
});
