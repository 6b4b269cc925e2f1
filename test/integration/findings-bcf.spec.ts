import { randomUUID } from 'node:crypto';
import type { Response } from 'superagent';
import { openArchive } from '../../server/findings/bcf/bcf-archive-reader';
import { FindingChange } from '../../server/findings/finding-change.entity';
import { FindingComment } from '../../server/findings/finding-comment.entity';
import { Finding } from '../../server/findings/finding.entity';
import { syncFindingsFromRun } from '../../server/findings/finding-sync';
import type { ApiAgent } from '../fixtures/api-agent';
import { schemaErrors, schemaForEntry } from '../fixtures/bcf/bcf-schemas';
import { TOPIC_GUID, VERSION_2_1, XXE_MARKUP, markup21, zipOf } from '../fixtures/bcf/hostile-archives';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { MEMBER_IDS, TINY_PNG, findingsUrl, raiseFinding, runResult } from './findings-fixtures';

type Entries = Map<string, Buffer>;

function binary(response: Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => done(null, Buffer.concat(chunks)));
}

async function entriesOf(archive: Buffer): Promise<Entries> {
  const opened = await openArchive(archive);
  try {
    const entries: Entries = new Map();
    for (const name of opened.names) entries.set(name, await opened.read(name));
    return entries;
  } finally {
    opened.close();
  }
}

async function rezip(entries: Entries): Promise<Buffer> {
  return zipOf([...entries].map(([name, contents]) => ({ name, contents })));
}

describe('findings as BCF', () => {
  let app: TestApp;
  let team: TestTeam;
  let reviewer: ApiAgent;
  let engineer: ApiAgent;
  let coordinator: ApiAgent;
  let manualId: string;

  beforeAll(async () => {
    app = await startTestApp();
    team = await createTeam(app.dataSource);
    [reviewer, engineer, coordinator] = await Promise.all([app.signIn(team.reviewer), app.signIn(team.engineer), app.signIn(team.coordinator)]);
    for (const agent of [reviewer, engineer, coordinator]) {
      await agent.put('/api/notifications/preferences').send({ assigned: false, statusChanged: false, mentioned: false }).expect(200);
    }
    manualId = await raiseFinding(engineer, team.project.id, {
      title: 'Web opening <300 mm> next to the support & "stiffener"',
      description: 'Opening drawn in revision 4 only.',
      viewpoint: {
        camera: { kind: 'orthogonal', viewPoint_m: [4, -10, 6], direction: [0, 1, -0.2], up: [0, 0.2, 1], viewToWorldScale_m: 12, aspectRatio: 1.5 },
        selectedGlobalIds: [MEMBER_IDS.beamB12],
        visibility: { defaultVisible: false, exceptionGlobalIds: [MEMBER_IDS.beamB12, MEMBER_IDS.columnC3] },
        clippingPlanes: [{ location_m: [0, 0, 7.5], direction: [0, 0, 1] }],
      },
      snapshotPng: TINY_PNG.toString('base64'),
      labels: ['Openings'],
    });
    await coordinator.patch(findingsUrl(team.project.id, `/${manualId}`)).send({ assigneeId: team.engineer.id, dueDate: '2027-01-15', priority: 'high' }).expect(200);
    await reviewer.post(findingsUrl(team.project.id, `/${manualId}/comments`)).send({ text: 'Check the opening against the web buckling rules.' }).expect(201);
    // Two findings raised by a check run: no viewpoint of their own, so the export frames a camera (BCF 3.0 needs one).
    await syncFindingsFromRun(app.dataSource, team.project.id, { runId: randomUUID(), revisionNumber: 1 }, [
      runResult(MEMBER_IDS.beamB14, 'fail', 1.18),
      runResult(MEMBER_IDS.columnC3, 'warning', 0.94),
    ]);
  });
  afterAll(() => app.close());

  const url = (rest: string) => findingsUrl(team.project.id, rest);

  async function exported(version: '2.1' | '3.0', agent = reviewer): Promise<{ response: Response; entries: Entries }> {
    const response = await agent.get(url(`/export.bcfzip?version=${version}`)).buffer(true).parse(binary).expect(200);
    return { response, entries: await entriesOf(response.body as Buffer) };
  }

  async function dbState() {
    const findings = await app.dataSource.getRepository(Finding).find({ where: { projectId: team.project.id }, order: { number: 'ASC' } });
    const ids = findings.map((finding) => finding.id);
    return {
      findings: findings.map((finding) => [finding.id, finding.status, finding.justification]),
      comments: await app.dataSource.getRepository(FindingComment).count({ where: ids.map((findingId) => ({ findingId })) }),
      changes: await app.dataSource.getRepository(FindingChange).count({ where: ids.map((findingId) => ({ findingId })) }),
    };
  }

  function importing(agent: ApiAgent, archive: Buffer, fileName = 'returned.bcf') {
    return agent.post(url('/import')).attach('file', archive, fileName);
  }

  describe('GET /api/projects/:projectId/findings/export.bcfzip', () => {
    it.each(['2.1', '3.0'] as const)('writes BCF %s that the official XSDs accept, one topic per finding', async (version) => {
      const { response, entries } = await exported(version);
      expect(response.headers['content-disposition']).toBe(`attachment; filename=${team.project.code}-findings-bcf-${version}.bcf`);
      const topics = [...entries.keys()].filter((name) => name.endsWith('/markup.bcf'));
      expect(topics).toHaveLength(3);
      const manual = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: manualId });
      expect(entries.get(`${manual.guid}/snapshot.png`)?.equals(TINY_PNG)).toBe(true);
      for (const [name, bytes] of entries) {
        const schema = schemaForEntry(name);
        if (schema) expect({ name, errors: await schemaErrors(version, schema, name, bytes) }).toEqual({ name, errors: [] });
      }
      const markup = entries.get(`${manual.guid}/markup.bcf`)!.toString();
      expect(markup).toContain('<Priority>High</Priority>');
      expect(markup).toContain(`<AssignedTo>${team.engineer.email}</AssignedTo>`);
      expect(markup).toContain('Check the opening against the web buckling rules.');
      const framed = [...entries].filter(([name, bytes]) => name.endsWith('.bcfv') && bytes.toString().includes('PerspectiveCamera'));
      expect(framed).toHaveLength(2);
    });

    it('exports only the findings the filters select', async () => {
      const { entries } = await exported('2.1');
      const all = [...entries.keys()].filter((name) => name.endsWith('/markup.bcf')).length;
      const response = await reviewer.get(url('/export.bcfzip?kind=manual')).buffer(true).parse(binary).expect(200);
      const onlyManual = [...(await entriesOf(response.body as Buffer)).keys()].filter((name) => name.endsWith('/markup.bcf'));
      expect({ all, onlyManual: onlyManual.length }).toEqual({ all: 3, onlyManual: 1 });
    });

    it('returns 400 for a BCF version Taulens does not write', async () => {
      await reviewer.get(url('/export.bcfzip?version=2.0')).expect(400);
    });
  });

  describe('GET /api/projects/:projectId/findings/export.csv', () => {
    it('writes one row per finding, with the cautions at the end', async () => {
      const response = await reviewer.get(url('/export.csv')).expect(200);
      expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
      expect(response.headers['content-disposition']).toBe(`attachment; filename=${team.project.code}-findings.csv`);
      const lines = response.text.split('\r\n');
      expect(lines[0]).toMatch(/^\uFEFFReference,Title,Kind,Status/);
      expect(lines.slice(1, 4).map((line) => line.slice(0, 6))).toEqual(['F-0001', 'F-0002', 'F-0003']);
      expect(response.text).toContain('They are a checking aid for qualified engineers, not a design.');
    });
  });

  describe('POST /api/projects/:projectId/findings/import', () => {
    it('brings back status changes and new comments from a returned file (round trip)', async () => {
      const { entries } = await exported('2.1');
      const manual = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: manualId });
      const markupName = `${manual.guid}/markup.bcf`;
      const commentGuid = randomUUID();
      const returned = entries
        .get(markupName)!
        .toString()
        .replace('TopicStatus="Open"', 'TopicStatus="In Progress"')
        .replace(
          '</Topic>',
          `</Topic><Comment Guid="${commentGuid}"><Date>2027-01-10T09:30:00Z</Date><Author>${team.engineer.email}</Author><Comment>Opening moved 400 mm away from the support.</Comment></Comment>`,
        );
      entries.set(markupName, Buffer.from(returned));

      const response = await importing(engineer, await rezip(entries), 'returned.bcfzip').expect(200);
      expect(response.body.import).toEqual({ version: '2.1', topics: 3, statusChanges: 1, commentsAdded: 1, unchanged: 2, warnings: [] });
      expect((await app.dataSource.getRepository(Finding).findOneByOrFail({ id: manualId })).status).toBe('in-progress');
      const change = await app.dataSource.getRepository(FindingChange).findOneByOrFail({ findingId: manualId, field: 'status' });
      expect(change).toMatchObject({ actorId: team.engineer.id, source: 'bcf-import', fromValue: 'open', toValue: 'in-progress' });
      const comment = await app.dataSource.getRepository(FindingComment).findOneByOrFail({ guid: commentGuid });
      expect(comment).toMatchObject({
        findingId: manualId,
        authorId: team.engineer.id,
        text: `from BCF: “${team.engineer.email}”, 2027-01-10T09:30:00.000Z\n\nOpening moved 400 mm away from the support.`,
      });

      // The same file again changes nothing more.
      const again = await importing(engineer, await rezip(entries)).expect(200);
      expect(again.body.import).toMatchObject({ statusChanges: 0, commentsAdded: 0, unchanged: 3 });
    });

    it('never shows an imported comment as written by someone else: the importer is its author, the file’s author and date are quoted', async () => {
      const { entries } = await exported('2.1');
      const manual = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: manualId });
      const markupName = `${manual.guid}/markup.bcf`;
      const [asReviewer, asOutsider] = [randomUUID(), randomUUID()];
      const comment = (guid: string, author: string, date: string, text: string) =>
        `<Comment Guid="${guid}"><Date>${date}</Date><Author>${author}</Author><Comment>${text}</Comment></Comment>`;
      const returned = entries
        .get(markupName)!
        .toString()
        .replace(
          '</Topic>',
          `</Topic>${comment(asReviewer, team.reviewer.email, '2020-02-02T08:00:00Z', 'Approved, no stiffener needed.')}` +
            comment(asOutsider, 'Site.Manager@Elsewhere.test', '2021-03-04T05:06:07+02:00', 'Fabricated as drawn.'),
        );
      entries.set(markupName, Buffer.from(returned));

      const before = Date.now();
      await importing(engineer, await rezip(entries)).expect(200);
      const comments = app.dataSource.getRepository(FindingComment);
      const reviewerWords = await comments.findOneByOrFail({ guid: asReviewer });
      expect(reviewerWords).toMatchObject({
        authorId: team.engineer.id,
        authorEmail: team.engineer.email,
        text: `from BCF: “${team.reviewer.email}”, 2020-02-02T08:00:00.000Z\n\nApproved, no stiffener needed.`,
      });
      expect(reviewerWords.createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
      const outsiderWords = await comments.findOneByOrFail({ guid: asOutsider });
      expect(outsiderWords).toMatchObject({
        authorId: team.engineer.id,
        text: 'from BCF: “site.manager@elsewhere.test”, 2021-03-04T03:06:07.000Z\n\nFabricated as drawn.',
      });

      const shown = await reviewer.get(url(`/${manualId}`)).expect(200);
      const byGuid = new Map(shown.body.comments.map((c: { guid: string }) => [c.guid, c]));
      expect(byGuid.get(asReviewer)).toMatchObject({ author: { id: team.engineer.id, name: team.engineer.name } });
      expect(byGuid.get(asOutsider)).toMatchObject({ author: { id: team.engineer.id, name: team.engineer.name } });
    });

    it('imports an unchanged BCF 3.0 export as unchanged', async () => {
      const { response } = await exported('3.0');
      const result = await importing(reviewer, response.body as Buffer).expect(200);
      expect(result.body.import).toMatchObject({ version: '3.0', topics: 3, statusChanges: 0, commentsAdded: 0, unchanged: 3 });
    });

    it('refuses a status change the importing role may not make, and changes nothing', async () => {
      const { entries } = await exported('2.1');
      const fail = await app.dataSource.getRepository(Finding).findOneByOrFail({ projectId: team.project.id, kind: 'web-shear-fail' });
      const markupName = `${fail.guid}/markup.bcf`;
      entries.set(markupName, Buffer.from(entries.get(markupName)!.toString().replace(/TopicStatus="[^"]*"/, 'TopicStatus="Resolved"')));
      const before = await dbState();
      const response = await importing(coordinator, await rezip(entries)).expect(409);
      expect(response.body.error.code).toBe('bcf_import_refused');
      expect(response.body.error.message).toContain('F-0002: Your role does not allow moving a finding from open to resolved');
      expect(response.body.error.details.problems).toHaveLength(1);
      expect(await dbState()).toEqual(before);
    });

    it('refuses acceptance from a file, which has no place for the justification', async () => {
      const { entries } = await exported('2.1');
      const manual = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: manualId });
      const markupName = `${manual.guid}/markup.bcf`;
      entries.set(markupName, Buffer.from(entries.get(markupName)!.toString().replace(/TopicStatus="[^"]*"/, 'TopicStatus="Accepted"')));
      const before = await dbState();
      const response = await importing(reviewer, await rezip(entries)).expect(409);
      expect(response.body.error.message).toContain('accept findings in Taulens, where a written justification is asked for');
      expect(await dbState()).toEqual(before);
    });

    describe('bad input gets a clear message and changes nothing', () => {
      const cases: { name: string; archive: () => Promise<Buffer>; fileName?: string; status: number; code: string; message: RegExp }[] = [
        {
          name: 'not a zip',
          archive: async () => Buffer.from('ISO-10303-21;\nHEADER;\nENDSEC;\n'),
          status: 400,
          code: 'bcf_not_zip',
          message: /not a readable zip file/,
        },
        {
          name: 'a zip bomb',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: Buffer.alloc(24 * 1024 * 1024, 0x20) }]),
          status: 413,
          code: 'bcf_archive_refused',
          message: /expands \d+ times/,
        },
        {
          name: 'a topic without markup',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/viewpoint.bcfv`, contents: '<VisualizationInfo/>' }]),
          status: 400,
          code: 'bcf_missing_markup',
          message: new RegExp(`Topic folder ${TOPIC_GUID} has no markup.bcf`),
        },
        {
          name: 'XML with an external entity (XXE)',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: XXE_MARKUP }]),
          status: 400,
          code: 'bcf_unsafe_xml',
          message: /DOCTYPE|document type/i,
        },
        {
          name: 'a topic GUID that matches no finding',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('Resolved') }]),
          status: 409,
          code: 'bcf_unknown_guids',
          message: new RegExp(`1 topic\\(s\\) that match no finding of this project \\(${TOPIC_GUID}\\)`),
        },
        {
          name: 'a file that is not named .bcf or .bcfzip',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }]),
          fileName: 'issues.zip',
          status: 400,
          code: 'bcf_wrong_file_type',
          message: /choose a \.bcf or \.bcfzip file/,
        },
        {
          name: 'a file with a non-ASCII name that is not BCF, named as written',
          archive: () => zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }]),
          fileName: 'Prüfbericht_钢梁.zip',
          status: 400,
          code: 'bcf_wrong_file_type',
          message: /^“Prüfbericht_钢梁\.zip” is not a BCF file/,
        },
      ];

      it.each(cases)('$name', async ({ archive, fileName, status, code, message }) => {
        const before = await dbState();
        const response = await importing(engineer, await archive(), fileName).expect(status);
        expect(response.body.error.code).toBe(code);
        expect(response.body.error.message).toMatch(message);
        expect(await dbState()).toEqual(before);
      });

      it('no file at all', async () => {
        const response = await engineer.post(url('/import')).field('note', 'forgot the file').expect(400);
        expect(response.body.error.code).toBe('bcf_file_missing');
      });
    });
  });

  describe('an accepted finding in every export', () => {
    const justification = 'Bearing stiffener pair on sheet S-410 carries the reaction (invented scenario).';
    let warning: Finding;

    beforeAll(async () => {
      warning = await app.dataSource.getRepository(Finding).findOneByOrFail({ projectId: team.project.id, kind: 'web-shear-warning' });
      await reviewer.post(url(`/${warning.id}/transitions`)).send({ to: 'accepted', justification }).expect(200);
    });

    it.each(['2.1', '3.0'] as const)('BCF %s carries the justification as a comment of the topic with the reviewer and the date', async (version) => {
      const { entries } = await exported(version);
      const markup = entries.get(`${warning.guid}/markup.bcf`)!.toString();
      expect(await schemaErrors(version, 'markup', 'markup.bcf', markup)).toEqual([]);
      const accepted = await app.dataSource.getRepository(FindingChange).findOneByOrFail({ findingId: warning.id, field: 'justification' });
      expect(markup).toMatch(
        new RegExp(`<Comment Guid="[0-9a-f-]{36}">\\s*<Date>${accepted.at.toISOString()}</Date>\\s*<Author>${team.reviewer.email}</Author>\\s*<Comment>Accepted as it is: ${justification.replace(/[()]/g, '\\$&')}</Comment>`),
      );
    });

    it('the CSV carries it in its own columns', async () => {
      const response = await reviewer.get(url('/export.csv')).expect(200);
      expect(response.text).toContain(`,${justification},${team.reviewer.email},`);
    });

    it('importing the export back adds no comment: the acceptance is recognised', async () => {
      for (const version of ['2.1', '3.0'] as const) {
        const { response } = await exported(version);
        const result = await importing(reviewer, response.body as Buffer).expect(200);
        expect(result.body.import).toMatchObject({ version, statusChanges: 0, commentsAdded: 0 });
      }
    });
  });
});
