import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import * as yazl from 'yazl';
import { ModelMember } from '../../server/models/model-member.entity';
import { ModelMemberRecord } from '../../server/models/model-member-record.entity';
import { ModelRevision } from '../../server/models/model-revision.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { buildingSmartSample } from '../fixtures/ifc/buildingsmart-samples';
import { generateFrame } from '../generator/generate-frame';

const sample = (name: string): Buffer => readFileSync(buildingSmartSample(name));
const sha256 = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

interface Revision {
  id: string;
  number: number;
  status: string;
  progress: { phase: string; fraction: number } | null;
  error: string | null;
  counts: { members: number; ok: number; notApplicable: number; flagged: number; context: number } | null;
  [field: string]: unknown;
}

const modelsUrl = (team: TestTeam) => `/api/projects/${team.project.id}/models`;

function zipOf(entries: Record<string, Buffer | string>): Promise<Buffer> {
  const zip = new yazl.ZipFile();
  for (const [name, content] of Object.entries(entries)) zip.addBuffer(Buffer.from(content), name);
  zip.end();
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    zip.outputStream.on('data', (chunk: Buffer) => chunks.push(chunk));
    zip.outputStream.on('end', () => resolve(Buffer.concat(chunks)));
    zip.outputStream.on('error', reject);
  });
}

/** Text of an SSE stream that the server ends once the revision is ready or failed. */
function eventStream(agent: ApiAgent, url: string): Promise<string> {
  return new Promise((resolve, reject) => {
    agent
      .get(url)
      .buffer(true)
      .parse((res, done) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => (text += chunk));
        res.on('end', () => done(null, text));
      })
      .end((error, res) => (error ? reject(error) : resolve(res.body as string)));
  });
}

describe('models', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  const storedFiles = (team: TestTeam): string[] => {
    try {
      return readdirSync(path.join(app.config.dataDir, 'files', 'projects', team.project.id, 'models')).sort();
    } catch {
      return [];
    }
  };
  const tempFilesLeft = (): string[] => {
    const root = path.join(app.config.dataDir, 'tmp', 'models');
    try {
      return readdirSync(root, { recursive: true, withFileTypes: true })
        .filter((entry) => entry.isFile())
        .map((entry) => entry.name);
    } catch {
      return [];
    }
  };

  function upload(agent: ApiAgent, team: TestTeam, content: Buffer | string, fileName: string, note?: string) {
    const request = agent.post(modelsUrl(team));
    if (note !== undefined) request.field('note', note);
    return request.attach('file', Buffer.from(content), fileName);
  }

  async function untilFinal(agent: ApiAgent, team: TestTeam, revisionId: string, seen: Revision[] = []): Promise<Revision> {
    for (;;) {
      const response = await agent.get(`${modelsUrl(team)}/${revisionId}`).expect(200);
      const revision = response.body.revision as Revision;
      seen.push(revision);
      if (revision.status === 'ready' || revision.status === 'failed') return revision;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }

  async function ingested(agent: ApiAgent, team: TestTeam, content: Buffer | string, fileName: string, note?: string): Promise<Revision> {
    const response = await upload(agent, team, content, fileName, note);
    expect(response.status).toBe(202);
    return untilFinal(agent, team, response.body.revision.id);
  }

  describe('POST /api/projects/:projectId/models', () => {
    // Members, profiles and copies' sha256 as the samples' SOURCE.md lists them (buildingSMART, CC BY 4.0).
    it('reads each buildingSMART sample with the members and the IPE200 profile its SOURCE.md lists', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const expected = [
        {
          file: 'beam-varying-cardinal-points.ifc',
          bytes: 6280,
          sha256: '6671ec68e76d920be9a8dbca77fcd33bbe17db3960710aab9f3e5e021a796f46',
          members: [
            ['TopMid', 'IfcBeamStandardCase'],
            ['BotMid', 'IfcBeamStandardCase'],
            ['BotLeft', 'IfcBeamStandardCase'],
            ['TopRight', 'IfcBeamStandardCase'],
          ],
        },
        {
          file: 'beam-varying-extrusion-paths.ifc',
          bytes: 4646,
          sha256: '4415240580cc317dff9516a8fe1e7acbde037a3d36f815f7821e709997b6580b',
          members: [
            ['Extrusion', 'IfcBeamStandardCase'],
            ['Revolution', 'IfcBeamStandardCase'],
          ],
        },
        {
          file: 'column-extruded-solid.ifc',
          bytes: 3245,
          sha256: '7aff98171ebaaea8c2d52c0c690d01575c430105f413e6d9bd13f8d2f5ad5055',
          members: [[null, 'IfcColumnStandardCase']],
        },
      ];
      for (const [index, model] of expected.entries()) {
        const response = await upload(agent, team, sample(model.file), model.file, `sample ${index + 1}`).expect(202);
        expect(response.body.revision).toMatchObject({
          number: index + 1,
          fileName: model.file,
          sizeBytes: model.bytes,
          sha256: model.sha256,
          note: `sample ${index + 1}`,
          uploadedBy: { id: team.coordinator.id, name: team.coordinator.name },
          status: expect.stringMatching(/^(queued|ingesting)$/),
          schema: 'IFC4',
        });
        const revision = await untilFinal(agent, team, response.body.revision.id);
        expect(revision).toMatchObject({ status: 'ready', error: null, progress: null, lengthUnit: 'millimetre' });
        expect(revision.counts).toMatchObject({ members: model.members.length, ok: model.members.length, notApplicable: 0, flagged: 0 });

        const page = await agent.get(`${modelsUrl(team)}/${revision.id}/members`).expect(200);
        expect(page.body.total).toBe(model.members.length);
        expect(page.body.members.map((m: { name: string | null; ifcClass: string }) => [m.name, m.ifcClass])).toEqual(model.members);
        for (const member of page.body.members) {
          // #203 IFCISHAPEPROFILEDEF(.AREA.,'IPE200',$,100.0,200.0,5.6,8.5,12.0,$,$), material 'S355JR'.
          expect(member).toMatchObject({
            status: 'ok',
            profileName: 'IPE200',
            profileSource: 'ifc-profile',
            profileType: 'IfcIShapeProfileDef',
            fabrication: 'rolled',
            depth_mm: 200,
            webThickness_mm: 5.6,
            flangeWidth_mm: 100,
            flangeThickness_mm: 8.5,
            grade: 'S355',
            gradeAssumed: false,
          });
        }
      }
      // 1000 mm extrusions (SOURCE.md); the column is a vertical 2000 mm extrusion.
      const [columnRevision] = (await agent.get(modelsUrl(team)).expect(200)).body.revisions;
      const column = await agent.get(`${modelsUrl(team)}/${columnRevision.id}/members`).expect(200);
      expect(column.body.members[0].length_mm).toBeCloseTo(2000, 6);
    });

    it('accepts an .ifczip, hashing the IFC it holds, and reads a generated IFC2X3 frame in inches', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const ifc = generateFrame({ members: 60, schema: 'IFC2X3', unit: 'inch', fileName: 'wharf-annex.ifc' });
      const response = await upload(agent, team, await zipOf({ 'export/wharf-annex.ifc': ifc, 'readme.txt': 'not a model' }), 'wharf-annex.ifczip').expect(202);
      expect(response.body.revision).toMatchObject({ fileName: 'wharf-annex.ifczip', sha256: sha256(Buffer.from(ifc)), sizeBytes: Buffer.byteLength(ifc), schema: 'IFC2X3' });
      const revision = await untilFinal(agent, team, response.body.revision.id);
      expect(revision).toMatchObject({ status: 'ready', lengthUnit: 'inch' });
      expect(revision.counts?.members).toBe(60);
      // W24x62 (generator's rolled beam): d = 23.7 in, tw = 0.430 in (AISC Manual Table 1-1, from memory) in mm.
      const beams = await agent.get(`${modelsUrl(team)}/${revision.id}/members?profile=W24x62&pageSize=1`).expect(200);
      expect(beams.body.members[0].depth_mm).toBeCloseTo(23.7 * 25.4, 1);
      expect(beams.body.members[0].webThickness_mm).toBeCloseTo(0.43 * 25.4, 1);
      expect(tempFilesLeft()).toEqual([]);
    });

    it('reports progress while it reads, keeps answering other requests, and ends ready', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const response = await upload(agent, team, generateFrame({ members: 3000 }), 'frame-3000.ifc').expect(202);
      const events = eventStream(agent, `${modelsUrl(team)}/${response.body.revision.id}/events`);
      const seen: Revision[] = [];
      const final = await untilFinal(agent, team, response.body.revision.id, seen);
      expect(final.status).toBe('ready');
      expect(final.counts?.members).toBe(3000);
      // Every poll above was answered while the worker was reading.
      const running = seen.filter((r) => r.status === 'ingesting');
      expect(running.length).toBeGreaterThan(0);
      const fractions = running.map((r) => r.progress!.fraction);
      expect(fractions).toEqual([...fractions].sort((a, b) => a - b));
      expect(fractions.every((f) => f >= 0 && f <= 1)).toBe(true);

      const streamed = (await events)
        .split('\n')
        .filter((line) => line.startsWith('data: '))
        .map((line) => JSON.parse(line.slice(6)) as { status: string; phase: string | null; fraction: number | null });
      expect(streamed.at(-1)).toEqual({ status: 'ready', phase: null, fraction: null, error: null });
      const phases = streamed.filter((e) => e.status === 'ingesting').map((e) => e.phase);
      expect(phases).toContain('store');
      const streamedFractions = streamed.filter((e) => e.status === 'ingesting').map((e) => e.fraction!);
      expect(streamedFractions).toEqual([...streamedFractions].sort((a, b) => a - b));
    });

    it('refuses the same file twice in a project with 409, storing it once; another project may have it', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const file = sample('column-extruded-solid.ifc');
      const first = await ingested(agent, team, file, 'column.ifc');
      const again = await upload(agent, team, file, 'column-copy.ifc').expect(409);
      expect(again.body.error).toMatchObject({ code: 'duplicate_file', details: { revisionId: first.id } });
      expect(again.body.error.message).toContain('revision 1');
      expect(await app.dataSource.getRepository(ModelRevision).countBy({ projectId: team.project.id })).toBe(1);
      expect(storedFiles(team)).toEqual([`${first.id}.glb`, `${first.id}.ifc`]);

      const other = await createTeam(app.dataSource);
      expect((await ingested(await app.signIn(other.coordinator), other, file, 'column.ifc')).status).toBe('ready');
      expect(tempFilesLeft()).toEqual([]);
    });

    describe('refuses a bad file with a clear message and keeps nothing', () => {
      let team: TestTeam;
      let agent: ApiAgent;
      beforeAll(async () => {
        team = await createTeam(app.dataSource);
        agent = await app.signIn(team.coordinator);
      });

      const truncated = sample('beam-varying-cardinal-points.ifc').subarray(0, 3000);
      const unknownSchema = sample('column-extruded-solid.ifc').toString('latin1').replace("FILE_SCHEMA (('IFC4'))", "FILE_SCHEMA (('IFC5X1'))");
      const cases: [title: string, content: () => Promise<Buffer | string> | Buffer | string, fileName: string, status: number, code: string, message: RegExp][] = [
        ['an empty file', () => '', 'empty.ifc', 400, 'not_ifc', /empty/],
        ['a text file that is not STEP', () => 'Member list\nB1, IPE 300\n', 'members.ifc', 400, 'not_ifc', /not an IFC file.*ISO-10303-21/],
        ['a truncated STEP file', () => truncated, 'cut-off.ifc', 400, 'not_ifc', /incomplete.*END-ISO-10303-21/],
        ['an unknown schema', () => unknownSchema, 'future.ifc', 400, 'unknown_schema', /IFC5X1.*not supported/],
        ['another file type', () => 'a,b\n', 'forces.csv', 400, 'not_ifc', /'forces.csv' is not an IFC file/],
        ['a zip without an .ifc', () => zipOf({ 'notes.txt': 'no model here' }), 'empty.ifczip', 400, 'not_ifc', /no \.ifc file/],
        ['a zip that is not a zip', () => 'PK but not really', 'broken.ifczip', 400, 'not_ifc', /cannot be read as a zip/],
        ['a zip bomb', () => zipOf({ 'bomb.ifc': Buffer.alloc(20 * 1024 ** 2) }), 'bomb.ifczip', 413, 'archive_too_large', /compressed \d+ : 1/],
      ];

      it.each(cases)('%s', async (_title, content, fileName, status, code, message) => {
        const response = await upload(agent, team, await content(), fileName).expect(status);
        expect(response.body.error.code).toBe(code);
        expect(response.body.error.message).toMatch(message);
        expect(await app.dataSource.getRepository(ModelRevision).countBy({ projectId: team.project.id })).toBe(0);
        expect(storedFiles(team)).toEqual([]);
        expect(tempFilesLeft()).toEqual([]);
      });

      it('a request without a file, or with a note that is too long', async () => {
        const none = await agent.post(modelsUrl(team)).field('note', 'forgot the file').expect(400);
        expect(none.body.error.code).toBe('file_required');
        const longNote = await upload(agent, team, sample('column-extruded-solid.ifc'), 'column.ifc', 'x'.repeat(2001)).expect(400);
        expect(longNote.body.error.details).toEqual([expect.objectContaining({ field: 'note' })]);
        expect(await app.dataSource.getRepository(ModelRevision).countBy({ projectId: team.project.id })).toBe(0);
        expect(tempFilesLeft()).toEqual([]);
      });

      it('a file with no length unit fails its revision with the reason, and no members or files remain', async () => {
        const noLengthUnit = sample('beam-varying-cardinal-points.ifc')
          .toString('latin1')
          .replace('IFCSIUNIT(*,.LENGTHUNIT.,.MILLI.,.METRE.)', 'IFCSIUNIT(*,.MASSUNIT.,.KILO.,.GRAM.)');
        const revision = await ingested(agent, team, noLengthUnit, 'no-units.ifc');
        expect(revision.status).toBe('failed');
        expect(revision.error).toMatch(/^The model could not be read \(while .+\): .*length unit/i);
        expect(revision.counts).toBeNull();
        expect(await app.dataSource.getRepository(ModelMember).countBy({ revisionId: revision.id })).toBe(0);
        expect(await app.dataSource.getRepository(ModelMemberRecord).countBy({ revisionId: revision.id })).toBe(0);
        expect(storedFiles(team)).toEqual([]);
        const members = await agent.get(`${modelsUrl(team)}/${revision.id}/members`).expect(409);
        expect(members.body.error.code).toBe('revision_not_ready');
        await agent.get(`${modelsUrl(team)}/${revision.id}/geometry.glb`).expect(409);
        // A failed revision does not block uploading the same file again.
        const again = await upload(agent, team, noLengthUnit, 'no-units.ifc').expect(202);
        expect((await untilFinal(agent, team, again.body.revision.id)).status).toBe('failed');
      });
    });

    it('refuses a file over UPLOAD_LIMIT_MB, and an archive that unpacks beyond it, with 413', async () => {
      const small = await startTestApp({ uploadLimitMb: 1 });
      try {
        const team = await createTeam(small.dataSource);
        const agent = await small.signIn(team.coordinator);
        const big = generateFrame({ members: 1500 });
        expect(Buffer.byteLength(big)).toBeGreaterThan(1024 ** 2);
        const direct = await agent.post(modelsUrl(team)).attach('file', Buffer.from(big), 'big.ifc').expect(413);
        expect(direct.body.error).toMatchObject({ code: 'file_too_large', message: 'The file is larger than the upload limit of 1 MB.' });
        const zipped = await agent.post(modelsUrl(team)).attach('file', await zipOf({ 'big.ifc': big }), 'big.ifczip').expect(413);
        expect(zipped.body.error.code).toBe('archive_too_large');
        expect(await small.dataSource.getRepository(ModelRevision).count()).toBe(0);
        expect(readdirSync(path.join(small.config.dataDir, 'tmp', 'models', 'uploads'))).toEqual([]);
      } finally {
        await small.close();
      }
    });
  });

  describe('reading a ready revision', () => {
    let team: TestTeam;
    let coordinator: ApiAgent;
    let revision: Revision;
    const frame = generateFrame({ members: 300, fileName: 'frame-300.ifc' });
    type Row = Record<string, string | number | boolean | null>;

    beforeAll(async () => {
      team = await createTeam(app.dataSource);
      coordinator = await app.signIn(team.coordinator);
      revision = await ingested(coordinator, team, frame, 'frame-300.ifc');
      expect(revision.status).toBe('ready');
    });

    const membersUrl = () => `${modelsUrl(team)}/${revision.id}/members`;
    const allRows = async (query = ''): Promise<Row[]> => (await coordinator.get(`${membersUrl()}?pageSize=500${query}`).expect(200)).body.members;

    describe('GET /api/projects/:projectId/models', () => {
      it('lists revisions newest first', async () => {
        await ingested(coordinator, team, sample('column-extruded-solid.ifc'), 'column.ifc');
        const response = await coordinator.get(modelsUrl(team)).expect(200);
        expect(response.body.revisions.map((r: Revision) => r.number)).toEqual([2, 1]);
        expect(response.body.revisions[1]).toEqual({ ...revision, progress: null });
      });
    });

    describe('GET …/models/:revisionId/members', () => {
      it('pages through every member once, in file order by default', async () => {
        const pages: Row[][] = [];
        for (let page = 0; page < 4; page++) {
          const response = await coordinator.get(`${membersUrl()}?pageSize=80&page=${page}`).expect(200);
          expect(response.body.total).toBe(300);
          pages.push(response.body.members);
        }
        expect(pages.map((p) => p.length)).toEqual([80, 80, 80, 60]);
        const ids = pages.flat().map((m) => m.expressId as number);
        expect(new Set(ids).size).toBe(300);
        expect(ids).toEqual([...ids].sort((a, b) => a - b));
      });

      it('sorts on the server, both ways, ties in file order', async () => {
        const byDepth = await allRows('&sort=depth_mm&dir=desc&status=ok');
        const depths = byDepth.map((m) => m.depth_mm as number);
        expect(depths).toEqual([...depths].sort((a, b) => b - a));
        const byTag = (await allRows('&sort=tag')).map((m) => m.tag as string);
        expect(byTag).toEqual([...byTag].sort());
        const bad = await coordinator.get(`${membersUrl()}?sort=record&dir=up&pageSize=501`).expect(400);
        expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(['sort', 'dir', 'pageSize']);
      });

      it('filters by status, storey, profile and text, and combines them', async () => {
        const everyone = await allRows();
        const count = (test: (m: Row) => boolean) => everyone.filter(test).length;

        // The generator's braces (a circular hollow and an angle section) are read for checking like the beams.
        const braces = everyone.filter((m) => m.profileFamily !== 'I');
        expect(new Set(braces.map((m) => `${m.profileType} ${m.profileFamily} ${m.status}`))).toEqual(new Set(['IfcCircleHollowProfileDef tube ok', 'IfcLShapeProfileDef angle ok']));
        const skipped = await allRows('&status=not-applicable,flagged');
        expect(skipped.length).toBe(count((m) => m.status !== 'ok'));

        const facets = (await coordinator.get(`${membersUrl()}/facets`).expect(200)).body;
        expect(facets.storeys).toEqual([...new Set(everyone.map((m) => m.storey))].filter(Boolean).sort());
        expect(facets.profiles).toContain('IPE400');
        expect(facets.families).toEqual(['I', 'angle', 'tube']);
        expect(facets.sources).toEqual(['ifc-profile', 'outline']);
        // Skipped members counted by reason, every one counted once.
        expect(facets.skipped.reduce((sum: number, s: { count: number }) => sum + s.count, 0)).toBe(skipped.length);
        const tubes = await coordinator.get(`${membersUrl()}?family=tube`).expect(200);
        expect(tubes.body.total).toBe(count((m) => m.profileFamily === 'tube'));
        await coordinator.get(`${membersUrl()}?family=hexagon`).expect(400);
        const storey = facets.storeys[1] as string;
        const onStorey = await coordinator.get(`${membersUrl()}?storey=${encodeURIComponent(storey)}&profile=IPE400`).expect(200);
        expect(onStorey.body.total).toBe(count((m) => m.storey === storey && m.profileName === 'IPE400'));
        expect(onStorey.body.total).toBeGreaterThan(0);

        // The 3D view's compact list: every member once, in file order, with the table's labels.
        const labels = (await coordinator.get(`${membersUrl()}/labels`).expect(200)).body;
        expect(labels.columns).toEqual(['globalId', 'tag', 'profileName', 'storey']);
        expect(labels.members).toHaveLength(everyone.length);
        const labelOf = new Map(everyone.map((m) => [m.globalId, [m.globalId, m.tag, m.profileName, m.storey]]));
        expect(labels.members.every((row: unknown[]) => JSON.stringify(row) === JSON.stringify(labelOf.get(row[0] as string)))).toBe(true);

        const tag = everyone[17].tag as string;
        const found = await coordinator.get(`${membersUrl()}?q=${encodeURIComponent(tag.toLowerCase())}`).expect(200);
        expect(found.body.members.map((m: Row) => m.tag)).toContain(tag);
        const literal = await coordinator.get(`${membersUrl()}?q=${encodeURIComponent('%_')}`).expect(200);
        expect(literal.body.total).toBe(0);
      });
    });

    describe('GET …/members/:globalId', () => {
      it('returns the whole record, or 404', async () => {
        const [first] = await allRows('&status=ok');
        const response = await coordinator.get(`${membersUrl()}/${first.globalId}`).expect(200);
        expect(response.body.member).toMatchObject({ globalId: first.globalId, expressId: first.expressId, profile: { name: first.profileName }, section: { area_mm2: expect.any(Number) } });
        const missing = await coordinator.get(`${membersUrl()}/0000000000000000000000`).expect(404);
        expect(missing.body.error.code).toBe('member_not_found');
      });
    });

    describe('GET …/models/:revisionId/geometry.glb', () => {
      it('serves the baked glTF binary with one node per member named by GlobalId', async () => {
        const response = await coordinator.get(`${modelsUrl(team)}/${revision.id}/geometry.glb`).buffer(true).parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        });
        expect(response.status).toBe(200);
        expect(response.headers['content-type']).toBe('model/gltf-binary');
        const glb = response.body as Buffer;
        expect(glb.readUInt32LE(0)).toBe(0x46546c67); // 'glTF' magic, glTF 2.0 §4.4.3
        expect(glb.readUInt32LE(8)).toBe(glb.length);
        const json = JSON.parse(glb.subarray(20, 20 + glb.readUInt32LE(12)).toString('utf8'));
        const members = (json.nodes as { name: string; extras: { context: boolean } }[]).filter((n) => !n.extras.context).map((n) => n.name);
        expect(new Set(members)).toEqual(new Set((await allRows()).map((m) => m.globalId)));
      });
    });

    describe('GET …/models/compare', () => {
      it('lists added, removed and changed members by GlobalId with the fields that changed', async () => {
        const before = await allRows();
        const removedMember = before.find((m) => m.profileName === 'IPE400')!;
        // The next revision: IPE 300 beams become IPE 270 (EN 10365: 270 × 135, tw 6.6, tf 10.2, r 15 — from memory),
        // the S275JR material becomes S355JR, and one beam gets a new GlobalId (removed, then added).
        const next = frame
          .replace("'IPE 300',$,150.,300.,7.1,10.7,15.", "'IPE 270',$,135.,270.,6.6,10.2,15.")
          .replace("IFCMATERIAL('S275JR'", "IFCMATERIAL('S355JR'")
          .replace(`'${removedMember.globalId}'`, "'3BrdNewGlobalId0000001'");
        const second = await ingested(coordinator, team, next, 'frame-300-rev-B.ifc');
        const response = await coordinator.get(`${modelsUrl(team)}/compare?from=${revision.id}&to=${second.id}`).expect(200);
        const body = response.body;
        expect(body.from.id).toBe(revision.id);
        expect(body.to.id).toBe(second.id);
        expect(body.added.map((m: Row) => m.globalId)).toEqual(['3BrdNewGlobalId0000001']);
        expect(body.removed.map((m: Row) => m.globalId)).toEqual([removedMember.globalId]);

        const ipe300 = before.filter((m) => m.profileName === 'IPE 300');
        const s275 = before.filter((m) => m.grade === 'S275' && m.profileFamily === 'I');
        expect(ipe300.length).toBeGreaterThan(0);
        const changed = new Map<string, { field: string; from: unknown; to: unknown }[]>(body.changed.map((c: { globalId: string; changes: [] }) => [c.globalId, c.changes]));
        for (const member of ipe300) expect(changed.get(member.globalId as string)).toContainEqual({ field: 'section', from: 'IPE 300', to: 'IPE 270' });
        for (const member of s275) expect(changed.get(member.globalId as string)).toContainEqual({ field: 'grade', from: 'S275', to: 'S355' });
        expect(body.unchanged + body.changed.length + body.removed.length).toBe(300);

        await coordinator.get(`${modelsUrl(team)}/compare?from=${revision.id}&to=${revision.id}`).expect(400);
        await coordinator.get(`${modelsUrl(team)}/compare?from=${revision.id}`).expect(400);
      });
    });

    describe('who may do what', () => {
      it('lets engineers and reviewers read but not upload; hides the project from outsiders and anonymous callers', async () => {
        const urls = [modelsUrl(team), `${modelsUrl(team)}/${revision.id}`, membersUrl(), `${membersUrl()}/facets`, `${membersUrl()}/labels`, `${modelsUrl(team)}/${revision.id}/geometry.glb`];
        for (const role of ['engineer', 'reviewer', 'admin'] as const) {
          const agent = await app.signIn(team[role]);
          for (const url of urls) await agent.get(url).expect(200);
          const refused = await upload(agent, team, sample('beam-varying-extrusion-paths.ifc'), 'paths.ifc');
          expect(refused.status).toBe(role === 'admin' ? 202 : 403);
          if (role === 'admin') await untilFinal(agent, team, refused.body.revision.id);
        }
        const outsider = await app.signIn(team.outsider);
        const anonymous = await app.agent();
        for (const url of urls) {
          expect((await outsider.get(url)).status).toBe(404);
          expect((await anonymous.get(url)).status).toBe(401);
        }
        expect((await upload(outsider, team, 'x', 'x.ifc')).status).toBe(404);
        expect((await upload(anonymous, team, 'x', 'x.ifc')).status).toBe(401);
        expect(tempFilesLeft()).toEqual([]);
      });

      it('shows a revision only in its own project', async () => {
        const other = await createTeam(app.dataSource);
        const agent = await app.signIn(other.coordinator);
        const response = await agent.get(`/api/projects/${other.project.id}/models/${revision.id}`).expect(404);
        expect(response.body.error.code).toBe('revision_not_found');
        await agent.get(`/api/projects/${other.project.id}/models/${revision.id}/members`).expect(404);
      });

      it('keeps an archived project read-only', async () => {
        const archived = await createTeam(app.dataSource, { archived: true });
        const agent = await app.signIn(archived.coordinator);
        await agent.get(modelsUrl(archived)).expect(200);
        const response = await upload(agent, archived, sample('column-extruded-solid.ifc'), 'column.ifc').expect(409);
        expect(response.body.error.code).toBe('project_archived');
      });
    });
  });

  describe('POST /api/projects/:projectId/catalogue', () => {
    // A supplier's own code for UB 305x165x40 (BS 4-1: D 303.4, B 165.0, t 6.0, T 10.2, r 8.9 mm — from memory), which no
    // built-in table knows; the beams give only that name (a bare IfcProfileDef, no outline to measure).
    const CSV = 'name,series,depth_mm,width_mm,web_mm,flange_mm,root_radius_mm\nMILL-305-40,UB,303.4,165.0,6.0,10.2,8.9\n';
    const outlineFrame = generateFrame({ members: 60 }).replace(/IFCARBITRARYCLOSEDPROFILEDEF\(\.AREA\.,'HE 240 A',#\d+\)/g, "IFCPROFILEDEF(.AREA.,'MILL-305-40')")
      .replace(/'HE 240 A'/g, "'MILL-305-40'");

    it('resolves name-only profiles of later uploads through the project catalogue', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const withoutCatalogue = await ingested(agent, team, outlineFrame, 'outline.ifc');
      const flagged = await agent.get(`${modelsUrl(team)}/${withoutCatalogue.id}/members?status=flagged`).expect(200);
      expect(flagged.body.total).toBeGreaterThan(0);
      expect(flagged.body.members[0].flags).toContain('profile-not-in-catalogue');

      const catalogueUrl = `/api/projects/${team.project.id}/catalogue`;
      await agent.post(catalogueUrl).attach('file', Buffer.from(CSV), 'sections.csv').expect(200, { sections: 1 });
      const listed = await (await app.signIn(team.reviewer)).get(catalogueUrl).expect(200);
      expect(listed.body.sections).toEqual([expect.objectContaining({ name: 'MILL-305-40', depth_mm: 303.4, webThickness_mm: 6, sourceId: 'project' })]);

      const other = await createTeam(app.dataSource);
      const otherAgent = await app.signIn(other.coordinator);
      await otherAgent.post(`/api/projects/${other.project.id}/catalogue`).attach('file', Buffer.from(CSV), 'sections.csv').expect(200);
      const resolved = await ingested(otherAgent, other, outlineFrame, 'outline.ifc');
      const members = await otherAgent.get(`/api/projects/${other.project.id}/models/${resolved.id}/members?profile=MILL-305-40`).expect(200);
      expect(members.body.total).toBe(flagged.body.total);
      expect(members.body.members[0]).toMatchObject({ status: 'ok', profileSource: 'project-catalogue', depth_mm: 303.4, webThickness_mm: 6 });
    });

    it('refuses a bad catalogue whole, naming the lines, and keeps the previous one', async () => {
      const team = await createTeam(app.dataSource);
      const agent = await app.signIn(team.coordinator);
      const catalogueUrl = `/api/projects/${team.project.id}/catalogue`;
      await agent.post(catalogueUrl).attach('file', Buffer.from(CSV), 'sections.csv').expect(200);
      const bad = await agent.post(catalogueUrl).attach('file', Buffer.from(`${CSV}BAD 1,UB,abc,165,6,10,9\n`), 'sections.csv').expect(400);
      expect(bad.body.error.code).toBe('invalid_catalogue');
      expect(bad.body.error.message).toMatch(/line 3 \(depth_mm\)/);
      expect((await agent.get(catalogueUrl).expect(200)).body.sections).toHaveLength(1);
      await (await app.signIn(team.engineer)).post(catalogueUrl).attach('file', Buffer.from(CSV), 'sections.csv').expect(403);
      expect(tempFilesLeft()).toEqual([]);
    });
  });
});
