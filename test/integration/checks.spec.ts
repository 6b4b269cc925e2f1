import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { findSection, seriesOf, toSectionInput } from '../../server/catalogue/catalogue';
import { CheckMemberDetail } from '../../server/checks/check-member-detail.entity';
import { CheckMemberResult } from '../../server/checks/check-member-result.entity';
import { CheckRun } from '../../server/checks/check-run.entity';
import { fromNewtons, toNewtons } from '../../server/engine/units';
import type { MemberRecord } from '../../server/ifc/model-read-result';
import { REPORT_CAUTIONS, REPORT_CAUTIONS_TEXT } from '../../server/reports/report-cautions';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { buildingSmartSample } from '../fixtures/ifc/buildingsmart-samples';
import { generateFrame } from '../generator/generate-frame';
import {
  DEFAULT_MAPPING,
  type Revision,
  type RunBody,
  checksUrl,
  importResults,
  ingestModel,
  membersOf,
  resultsCsv,
  resultsFootprint,
  runCheck,
  untilFinished,
} from './results-scene';

const sha256 = (bytes: string | Buffer): string => createHash('sha256').update(bytes).digest('hex');
const kips = (newtons: number) => fromNewtons(newtons, 'kip');
const KIP_MAPPING = { ...DEFAULT_MAPPING, forceUnit: 'kip' };

/**
 * Check runs through the API on a generated imperial frame of our invented scenario. Its beam B17 is a W24x62 in
 * A992, so the run's capacity can be compared with the published one: AISC Design Examples (v15.0) G.1A, quoting
 * Manual Table 3-2, gives φvVn = 306 kips (LRFD) and Vn/Ωv = 204 kips (ASD) for W24x62 at Fy = 50 ksi.
 */
describe('check runs', () => {
  let app: TestApp;
  let team: TestTeam;
  let projectId: string;
  let coordinator: ApiAgent;
  let engineer: ApiAgent;
  let reviewer: ApiAgent;
  let model: string;
  let revision: Revision;
  let members: MemberRecord[];
  let byTag: Map<string, MemberRecord>;
  let resultsFile: string;
  let resultSetId: string;
  let run: RunBody;

  const runBody = (extra: Record<string, unknown> = {}) => ({ modelRevisionId: revision.id, resultSetId, standard: 'aisc360-22-lrfd', parameters: {}, ...extra });

  beforeAll(async () => {
    app = await startTestApp();
    team = await createTeam(app.dataSource);
    projectId = team.project.id;
    [coordinator, engineer, reviewer] = await Promise.all([app.signIn(team.coordinator), app.signIn(team.engineer), app.signIn(team.reviewer)]);
    model = generateFrame({ members: 40, unit: 'inch', fileName: 'canteen-frame.ifc' });
    revision = await ingestModel(coordinator, projectId, model, 'canteen-frame.ifc');
    members = await membersOf(app, revision.id);
    byTag = new Map(members.map((member) => [member.tag!, member]));
    // T1–T5 get no results (not checked); T17 is half used, T20 near the limit, T23 over it (invented forces).
    const rows: [string, string, number][] = [];
    for (const member of members.slice(5)) rows.push([member.tag!, 'ULS-1', 20], [member.tag!, 'ULS-2', -10]);
    const set = (tag: string, combination: string, shear: number) => (rows.find((row) => row[0] === tag && row[1] === combination)![2] = shear);
    set('T17', 'ULS-1', 153);
    set('T17', 'ULS-2', -100);
    set('T20', 'ULS-2', -290);
    set('T23', 'ULS-1', 320);
    resultsFile = resultsCsv(rows);
    resultSetId = (await importResults(coordinator, projectId, revision.id, resultsFile, { mapping: KIP_MAPPING })).id;
    run = await runCheck(engineer, projectId, runBody());
  });
  afterAll(() => app.close());

  const runUrl = (runId = run.id) => `${checksUrl(projectId)}/${runId}`;

  describe('POST /api/projects/:projectId/checks', () => {
    it('computes in a worker and keeps the record of its inputs', async () => {
      const finished: unknown[] = [];
      const listener = (event: unknown) => finished.push(event);
      app.server.context.events.on('check-run.finished', listener);
      try {
        const started = await engineer.post(checksUrl(projectId)).send(runBody()).expect(202);
        expect(started.body.run).toMatchObject({ status: 'queued', progress: { fraction: 0 }, summary: null, finishedAt: null });
        const done = await untilFinished(engineer, projectId, started.body.run.id);
        expect(done).toMatchObject({
          status: 'done',
          progress: null,
          error: null,
          standard: 'aisc360-22-lrfd',
          parameters: { standard: 'aisc360-22-lrfd', phiV: null, warningRatio: 0.9, stiffenerSpacing_mm: null, fabricationOverrides: {} },
          modelRevision: { id: revision.id, number: 1, sha256: sha256(model), fileName: 'canteen-frame.ifc' },
          resultSet: { id: resultSetId, name: 'Frame analysis', sha256: sha256(resultsFile) },
          createdBy: { id: team.engineer.id, name: team.engineer.name },
          poorMatchConfirmed: false,
          summary: { members: 40, pass: 33, warning: 1, fail: 1, notChecked: 5, notApplicable: 0, unmatchedResults: 0 },
        });
        expect(done.engineVersion).toMatch(/^taulens \d+\.\d+\.\d+\+engine\.[0-9a-f]{12}$/);
        expect(done.summary!.maxUtilisation).toBeGreaterThan(1);
        expect(finished).toEqual([{ projectId, runId: done.id }]);
      } finally {
        app.server.context.events.off('check-run.finished', listener);
      }
    });

    it('gives W24x62 the published φvVn = 306 kips (LRFD) and Vn/Ωv = 204 kips (ASD)', async () => {
      const lrfd = await engineer.get(`${runUrl()}/members`).query({ q: 'T17' }).expect(200);
      const beam = lrfd.body.rows.find((row: { tag: string }) => row.tag === 'T17');
      expect(beam).toMatchObject({ profileName: 'W24x62', grade: 'A992', status: 'pass', governingCombination: 'ULS-1' });
      // Published to three figures: ±0.5 kip.
      expect(Math.abs(kips(beam.VRd_kN * 1000) - 306)).toBeLessThanOrEqual(0.5);
      expect(Math.abs(beam.utilisation - 153 / 306)).toBeLessThanOrEqual(0.5 / 306);
      expect(beam.VEd_kN).toBeCloseTo(toNewtons(153, 'kip') / 1000, 9);

      const asd = await runCheck(engineer, projectId, runBody({ standard: 'aisc360-22-asd' }));
      const asdBeam = (await engineer.get(`${runUrl(asd.id)}/members`).query({ q: 'T17' }).expect(200)).body.rows.find((row: { tag: string }) => row.tag === 'T17');
      expect(Math.abs(kips(asdBeam.VRd_kN * 1000) - 204)).toBeLessThanOrEqual(0.5);
      expect(Math.abs(asdBeam.utilisation - 153 / 204)).toBeLessThanOrEqual(0.5 / 204);
    });

    it('refuses a revision whose model could not be read, storing nothing', async () => {
      const broken = readFileSync(buildingSmartSample('column-extruded-solid.ifc'), 'latin1').replace('IFCSIUNIT(*,.LENGTHUNIT.,.MILLI.,.METRE.)', 'IFCSIUNIT(*,.MASSUNIT.,.KILO.,.GRAM.)');
      const failed = await ingestModel(coordinator, projectId, broken, 'broken.ifc');
      const before = await resultsFootprint(app, projectId);
      const response = await engineer.post(checksUrl(projectId)).send(runBody({ modelRevisionId: failed.id })).expect(409);
      expect(response.body.error).toMatchObject({ code: 'revision_not_ready', details: { status: 'failed' } });
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('refuses results that barely match the model until the engineer confirms', async () => {
      const stranger = await importResults(coordinator, projectId, revision.id, resultsCsv([['T17', 'ULS-1', 10], ['X-1', 'ULS-1', 10], ['X-2', 'ULS-1', 10], ['X-3', 'ULS-1', 10], ['X-4', 'ULS-1', 10], ['X-5', 'ULS-1', 10]]), {
        mapping: KIP_MAPPING,
      });
      const before = await resultsFootprint(app, projectId);
      const refused = await engineer.post(checksUrl(projectId)).send(runBody({ resultSetId: stranger.id })).expect(422);
      expect(refused.body.error.code).toBe('poor_match');
      expect(refused.body.error.message).toMatch(/^Only 1 of 6 result keys \(17 %\) match a member of revision 1 \(canteen-frame\.ifc\)\. .* Confirm to run the check anyway\.$/);
      expect(refused.body.error.details.summary).toMatchObject({ matched: 1, unmatchedResults: 5, likelyOtherModel: true });
      expect(await resultsFootprint(app, projectId)).toEqual(before);
      const confirmed = await runCheck(engineer, projectId, runBody({ resultSetId: stranger.id, confirmPoorMatch: true }));
      expect(confirmed).toMatchObject({ status: 'done', poorMatchConfirmed: true, summary: { pass: 1, notChecked: 39, unmatchedResults: 5 } });
    });

    it('refuses parameters no code would accept, naming the field', async () => {
      const response = await engineer.post(checksUrl(projectId)).send(runBody({ standard: 'en1993-1-1', parameters: { gammaM0: 0.5 } })).expect(400);
      expect(response.body.error).toMatchObject({ code: 'invalid_parameters', details: [{ location: 'body', field: 'parameters.gammaM0' }] });
      const standard = await engineer.post(checksUrl(projectId)).send(runBody({ standard: 'bs5950' })).expect(400);
      expect(standard.body.error.details[0]).toMatchObject({ field: 'standard', message: 'must be one of aisc360-22-lrfd, aisc360-22-asd, en1993-1-1' });
    });

    it('lets engineers run checks and every member read them: 401 anonymous, 404 outsider, 403 coordinator and reviewer', async () => {
      await (await app.agent()).post(checksUrl(projectId)).send(runBody()).expect(401);
      await (await app.signIn(team.outsider)).post(checksUrl(projectId)).send(runBody()).expect(404);
      await coordinator.post(checksUrl(projectId)).send(runBody()).expect(403);
      await reviewer.post(checksUrl(projectId)).send(runBody()).expect(403);
      await reviewer.get(runUrl()).expect(200);
      await coordinator.get(`${runUrl()}/members`).expect(200);
      await (await app.signIn(team.outsider)).get(runUrl()).expect(404);
      await (await app.agent()).get(`${runUrl()}/colours`).expect(401);
    });

    it('marks a run failed with its reason when its inputs have gone, and stores no member rows', async () => {
      const doomed = await importResults(coordinator, projectId, revision.id, resultsFile, { mapping: KIP_MAPPING });
      await app.server.context.storage.delete(`projects/${projectId}/results/${doomed.id}/governing.bin`);
      const failed = await runCheck(engineer, projectId, runBody({ resultSetId: doomed.id }));
      expect(failed).toMatchObject({ status: 'failed', summary: null });
      expect(failed.error).toMatch(/^The stored file .*governing\.bin is missing\.$/);
      expect(await app.dataSource.getRepository(CheckMemberResult).countBy({ runId: failed.id })).toBe(0);
      expect(await app.dataSource.getRepository(CheckMemberDetail).countBy({ runId: failed.id })).toBe(0);
      const members = await engineer.get(`${runUrl(failed.id)}/members`).expect(409);
      expect(members.body.error.code).toBe('run_not_finished');
    });
  });

  describe('GET /api/projects/:projectId/checks, /latest, /:runId', () => {
    it('lists runs newest first and names the newest finished one', async () => {
      const list = await reviewer.get(checksUrl(projectId)).expect(200);
      const runs = list.body.runs as RunBody[];
      expect(runs.map((r) => r.id)).toContain(run.id);
      const created = runs.map((r) => r.createdAt as string);
      expect(created).toEqual([...created].sort().reverse());
      const latest = await reviewer.get(`${checksUrl(projectId)}/latest`).expect(200);
      expect(latest.body.run).toEqual(runs.find((r) => r.status === 'done'));
    });

    it('has no route that changes a run, and the database refuses to change a finished one', async () => {
      for (const method of ['patch', 'put', 'delete'] as const) {
        const response = await engineer[method](runUrl()).send({ status: 'queued' }).expect(404);
        expect(response.body.error.code).toBe('route_not_found');
      }
      await expect(app.dataSource.getRepository(CheckRun).update({ id: run.id }, { engineVersion: 'something else' })).rejects.toThrow(/immutable record/);
      await expect(app.dataSource.getRepository(CheckMemberResult).update({ runId: run.id }, { utilisation: 0 })).rejects.toThrow(/immutable record/);
      await expect(app.dataSource.getRepository(CheckMemberDetail).update({ runId: run.id }, { combinations: '{}' })).rejects.toThrow(/immutable record/);
      const again = await engineer.get(runUrl()).expect(200);
      expect(again.body.run).toMatchObject({ engineVersion: run.engineVersion, summary: run.summary });
    });
  });

  describe('GET …/checks/:runId/members', () => {
    const page = (query: Record<string, string | number>) => engineer.get(`${runUrl()}/members`).query(query).expect(200);

    it('sorts by utilisation, most used first, with unchecked members last, and pages', async () => {
      const first = await page({ pageSize: 3 });
      expect(first.body.total).toBe(40);
      expect(first.body.rows.map((row: { tag: string }) => row.tag)).toEqual(['T23', 'T20', 'T17']);
      expect(first.body.rows[0]).toMatchObject({ status: 'fail', governingCombination: 'ULS-1', flags: [] });
      expect(Object.keys(first.body.rows[0]).sort()).toEqual(
        ['globalId', 'tag', 'name', 'storey', 'profileName', 'grade', 'governingCombination', 'governingAxis', 'governingCheck', 'VEd_kN', 'VRd_kN', 'utilisation', 'tauMax_MPa', 'tauAvgWeb_MPa', 'status', 'flags'].sort(),
      );
      const last = await page({ pageSize: 5, page: 7 });
      expect(last.body.rows.map((row: { status: string }) => row.status)).toEqual(Array(5).fill('not-checked'));
      const ascending = await page({ dir: 'asc', pageSize: 40 });
      expect(ascending.body.rows.slice(-5).map((row: { utilisation: number | null }) => row.utilisation)).toEqual(Array(5).fill(null));
      expect(ascending.body.rows[0].utilisation).toBeLessThan(ascending.body.rows[1].utilisation + 1e-12);
    });

    it('filters by status, storey, profile, utilisation range and text, and gives the facets', async () => {
      expect((await page({ status: 'fail' })).body.rows.map((row: { tag: string }) => row.tag)).toEqual(['T23']);
      expect((await page({ status: 'warning' })).body.rows.map((row: { tag: string }) => row.tag)).toEqual(['T20']);
      expect((await page({ minUtil: 0.45, maxUtil: 0.95 })).body.rows.map((row: { tag: string }) => row.tag)).toEqual(['T20', 'T17']);
      const profile = await page({ profile: 'W24X62', sort: 'tag', dir: 'asc' });
      expect(profile.body.rows.map((row: { tag: string }) => row.tag)).toEqual(members.filter((m) => m.profile?.name === 'W24X62').map((m) => m.tag).sort());
      const text = await page({ q: 't2', sort: 'tag', dir: 'asc', pageSize: 100 });
      expect(text.body.rows.map((row: { tag: string }) => row.tag)).toEqual(members.map((m) => m.tag!).filter((tag) => tag.startsWith('T2')).sort());
      expect(text.body.total).toBe(11);
      expect((await page({ storey: 'Level 01' })).body.total).toBe(40);
      expect((await page({ storey: 'Roof' })).body.total).toBe(0);
      expect(text.body.facets).toEqual({
        storeys: ['Level 01'],
        profiles: [...new Set(members.map((m) => m.profile!.name))].sort(),
      });
    });

    it('refuses an unknown sort field or status', async () => {
      const sort = await engineer.get(`${runUrl()}/members`).query({ sort: 'record' }).expect(400);
      expect(sort.body.error.details[0]).toMatchObject({ location: 'query', field: 'sort' });
      await engineer.get(`${runUrl()}/members`).query({ status: 'ok' }).expect(400);
    });
  });

  describe('GET …/checks/:runId/members.csv and /colours', () => {
    it('exports the filtered table with the run record and the cautions, text that looks like a formula defused', async () => {
      const formula = await importResults(coordinator, projectId, revision.id, resultsCsv([['T17', '=HYPERLINK("http://x")', 50]]), { mapping: KIP_MAPPING });
      const csvRun = await runCheck(engineer, projectId, runBody({ resultSetId: formula.id }));
      const response = await reviewer.get(`${runUrl(csvRun.id)}/members.csv`).query({ status: 'pass' }).expect(200);
      expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
      const text = response.text.replace(/^\uFEFF/, '');
      const lines = text.split('\r\n');
      expect(lines[0]).toBe(`Check run,${csvRun.id}`);
      expect(lines).toContain('GlobalId,Tag,Name,Storey,Profile,Grade,Status,Governing combination,Governing axis,Governing check,VEd (kN),VRd (kN),Utilisation,Tau max (MPa),Tau avg web (MPa),Flags');
      const beam = lines.find((line) => line.startsWith(byTag.get('T17')!.globalId))!;
      expect(beam).toContain(`,pass,"'=HYPERLINK(""http://x"")",major,major-axis shear,`);
      expect(lines.filter((line) => line.includes(',pass,'))).toHaveLength(1);
      expect(text).toContain(REPORT_CAUTIONS_TEXT);
    });

    it('gives each member its utilisation and status for the 3D view', async () => {
      const response = await reviewer.get(`${runUrl()}/colours`).expect(200);
      const colours = response.body.members as Record<string, { u: number | null; s: string }>;
      expect(Object.keys(colours).sort()).toEqual(members.map((m) => m.globalId).sort());
      expect(colours[byTag.get('T23')!.globalId]).toMatchObject({ s: 'fail' });
      expect(colours[byTag.get('T23')!.globalId].u).toBeGreaterThan(1);
      expect(colours[byTag.get('T1')!.globalId]).toEqual({ u: null, s: 'not-checked' });
    });
  });

  describe('GET …/checks/:runId/members/:globalId/sheet', () => {
    it('shows the section, τ(y), the clause-by-clause trace, every combination, a passing section and the cautions', async () => {
      const beam = byTag.get('T17')!;
      const response = await reviewer.get(`${runUrl()}/members/${beam.globalId}/sheet`).expect(200);
      const sheet = response.body;
      const w24x62 = findSection('W24X62')!;
      expect(sheet.member).toEqual(beam);
      // The model writes inches; the catalogue holds millimetres: equal to far below any rolling tolerance.
      const catalogued = toSectionInput(w24x62);
      const input = sheet.section.input;
      expect(input.fabrication).toBe('rolled');
      for (const [actual, expected] of [
        [input.depth_mm, catalogued.depth_mm],
        [input.webThickness_mm, catalogued.webThickness_mm],
        [input.topFlange.width_mm, catalogued.topFlange.width_mm],
        [input.bottomFlange.thickness_mm, catalogued.bottomFlange.thickness_mm],
        [input.topFlange.filletRadius_mm, catalogued.topFlange.filletRadius_mm],
      ]) {
        expect(Math.abs(actual - expected)).toBeLessThan(1e-6);
      }
      expect(sheet).toMatchObject({ standard: 'aisc360-22-lrfd', status: 'pass', grade: 'A992', gradeRule: 'ASTM specified minimum yield stress' });
      expect(sheet.fy_MPa).toBeCloseTo(344.74, 1);
      expect(sheet.governing).toMatchObject({ combination: 'ULS-1', status: 'pass' });
      expect(sheet.combinations.map((c: { combination: string }) => c.combination)).toEqual(['ULS-1', 'ULS-2']);
      expect(sheet.combinations[1].utilisation).toBeCloseTo((sheet.governing.utilisation * 100) / 153, 12);
      expect(sheet.trace.some((step: { clause: string }) => step.clause.includes('G2.1'))).toBe(true);
      expect(sheet.trace.at(-1)).toMatchObject({ what: 'Utilisation' });
      // τ(y): zero at the outer faces, the peak at the neutral axis, a jump at each web–flange junction.
      const samples = sheet.stress.samples as { y_mm: number; tau_MPa: number }[];
      expect(samples[0].tau_MPa).toBe(0);
      expect(samples.at(-1)!.tau_MPa).toBeCloseTo(0, 9);
      expect(sheet.stress.junctions.top.webSide_MPa).toBeGreaterThan(sheet.stress.junctions.top.flangeSide_MPa);
      expect(sheet.stress.tauMax_MPa).toBeGreaterThan(sheet.stress.webAverageFullDepth_MPa);
      expect(sheet.suggestion.lighterPassing.utilisation).toBeLessThanOrEqual(1);
      expect(seriesOf(findSection(sheet.suggestion.lighterPassing.name)!)).toBe(seriesOf(w24x62));
      expect(sheet.suggestion.requiredWebThickness_mm).toBeLessThan(w24x62.webThickness_mm);
      expect(sheet.cautions).toEqual([...REPORT_CAUTIONS]);
      expect(sheet.engineVersion).toEqual({ run: run.engineVersion, sheet: run.engineVersion });
    });

    it('says why a member was not checked', async () => {
      const response = await reviewer.get(`${runUrl()}/members/${byTag.get('T1')!.globalId}/sheet`).expect(200);
      expect(response.body).toMatchObject({ status: 'not-checked', reason: 'No shear results were matched to this member.', governing: null, trace: [], stress: null });
    });

    it('answers 404 for a member the run did not check', async () => {
      const response = await reviewer.get(`${runUrl()}/members/0000000000000000000000/sheet`).expect(404);
      expect(response.body.error.code).toBe('member_not_found');
    });
  });
});
