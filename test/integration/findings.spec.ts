import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { FindingChange } from '../../server/findings/finding-change.entity';
import { FindingComment } from '../../server/findings/finding-comment.entity';
import { Finding } from '../../server/findings/finding.entity';
import { FINDING_STATUSES, type FindingStatus } from '../../server/findings/finding-fields';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam, createUser } from '../fixtures/test-accounts';
import { MEMBER_IDS, TINY_PNG, findingsUrl, insertFindings, raiseFinding, setStatus } from './findings-fixtures';

type Role = 'coordinator' | 'engineer' | 'reviewer' | 'admin';
const ROLES: Role[] = ['coordinator', 'engineer', 'reviewer', 'admin'];

/**
 * Who may take each step, written out from the brief (issue 7 and PRODUCT.md "Who uses it"): engineers work on and
 * resolve findings, reviewers verify, send back or accept them (with a justification), coordinators only assign.
 * Ready to verify is reached only through a check run. A site admin may do everything. Any other pair is no step.
 */
const STEPS: Readonly<Record<string, 'engineer' | 'reviewer'>> = {
  'open → in-progress': 'engineer',
  'open → resolved': 'engineer',
  'open → accepted': 'reviewer',
  'in-progress → open': 'engineer',
  'in-progress → resolved': 'engineer',
  'in-progress → accepted': 'reviewer',
  'resolved → in-progress': 'engineer',
  'resolved → verified': 'reviewer',
  'resolved → open': 'reviewer',
  'resolved → accepted': 'reviewer',
  'ready-to-verify → verified': 'reviewer',
  'ready-to-verify → open': 'reviewer',
  'ready-to-verify → accepted': 'reviewer',
  'verified → open': 'reviewer',
  'accepted → open': 'reviewer',
};

function mayTake(role: Role, from: FindingStatus, to: FindingStatus): boolean {
  const owner = STEPS[`${from} → ${to}`];
  return owner !== undefined && (role === 'admin' || owner === role);
}

describe('findings', () => {
  let app: TestApp;
  let team: TestTeam;
  const agents = new Map<Role, ApiAgent>();
  let url: (rest?: string) => string;

  beforeAll(async () => {
    app = await startTestApp();
    team = await createTeam(app.dataSource);
    for (const role of ROLES) agents.set(role, await app.signIn(team[role]));
    // E-mails have their own tests (findings-mail.spec.ts); here they would only slow every change down.
    for (const role of ROLES) {
      await as(role).put('/api/notifications/preferences').send({ assigned: false, statusChanged: false, mentioned: false }).expect(200);
    }
    url = (rest = '') => findingsUrl(team.project.id, rest);
  });
  afterAll(() => app.close());

  const as = (role: Role) => agents.get(role)!;
  const stored = (id: string) => app.dataSource.getRepository(Finding).findOneByOrFail({ id });
  const snapshotFiles = async () => {
    const folder = path.join(app.config.dataDir, 'files', 'projects', team.project.id, 'findings');
    const names = await readdir(folder, { recursive: true }).catch(() => [] as string[]);
    return names.filter((name) => name.endsWith('.png')).sort();
  };
  const historyOf = (id: string) => app.dataSource.getRepository(FindingChange).find({ where: { findingId: id }, order: { at: 'ASC' } });

  describe('POST /api/projects/:projectId/findings/:findingId/transitions', () => {
    const rows = FINDING_STATUSES.flatMap((from) =>
      FINDING_STATUSES.flatMap((to) => ROLES.map((role) => ({ from, to, role, allowed: mayTake(role, from, to) }))),
    );
    // One finding per row, made at once: each row changes only its own.
    let ids: string[] = [];
    beforeAll(async () => {
      ids = await insertFindings(app.dataSource, team.project.id, rows.map((row) => row.from));
    });

    it.each(rows.map((row, index) => ({ ...row, index })))('$from → $to as $role', async ({ from, to, role, allowed, index }) => {
      const id = ids[index];
      const response = await as(role)
        .post(url(`/${id}/transitions`))
        .send({ to, ...(to === 'accepted' && { justification: 'Connection check by the engineer of record covers this web.' }) });

      const isStep = STEPS[`${from} → ${to}`] !== undefined;
      const expectedStatus = allowed ? 200 : isStep ? 403 : 409;
      expect(response.status).toBe(expectedStatus);
      expect((await stored(id)).status).toBe(allowed ? to : from);
      if (allowed) {
        expect(response.body.finding.status).toBe(to);
        const statusChange = (await historyOf(id)).find((change) => change.field === 'status');
        expect(statusChange).toMatchObject({ actorId: team[role].id, source: 'user', fromValue: from, toValue: to });
      } else {
        expect(response.body.error.code).toBe(isStep ? 'transition_not_allowed' : 'invalid_transition');
        expect(response.body.error.details.allowed).toEqual(FINDING_STATUSES.filter((next) => mayTake(role, from, next)));
      }
    });

    it('returns 400 when accepting without a justification, and changes nothing', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const response = await as('reviewer').post(url(`/${id}/transitions`)).send({ to: 'accepted', justification: '   ' }).expect(400);
      expect(response.body.error.code).toBe('justification_required');
      expect((await stored(id)).status).toBe('open');
      expect((await historyOf(id)).map((change) => change.field)).toEqual(['created']);
    });

    it('keeps the justification while accepted and clears it when reopened, both in the history', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const justification = 'Stiffener plates shown on the fabrication drawings carry this shear; see sheet S-301.';
      const accepted = await as('reviewer').post(url(`/${id}/transitions`)).send({ to: 'accepted', justification }).expect(200);
      expect(accepted.body.finding).toMatchObject({ status: 'accepted', justification });
      await as('reviewer').post(url(`/${id}/transitions`)).send({ to: 'open' }).expect(200);
      expect((await stored(id)).justification).toBeNull();
      expect((await historyOf(id)).map((c) => [c.field, c.fromValue, c.toValue])).toEqual([
        ['created', null, 'open'],
        ['status', 'open', 'accepted'],
        ['justification', null, justification],
        ['status', 'accepted', 'open'],
        ['justification', justification, null],
      ]);
    });

    it('asks what was done before a failing finding is resolved, and keeps the note as a comment', async () => {
      const [id] = await insertFindings(app.dataSource, team.project.id, ['in-progress']);
      await app.dataSource.getRepository(Finding).update(id, { kind: 'web-shear-fail', utilisation: 1.22 });
      for (const note of [undefined, '   ']) {
        const refused = await as('engineer').post(url(`/${id}/transitions`)).send({ to: 'resolved', ...(note !== undefined && { note }) }).expect(400);
        expect(refused.body.error).toMatchObject({ code: 'resolution_note_required', details: [expect.objectContaining({ field: 'note' })] });
      }
      expect((await stored(id)).status).toBe('in-progress');
      expect(await historyOf(id)).toEqual([]);

      const note = 'Web doubler plate 10 mm added on both sides, see revision 3 of sheet S-220.';
      await as('engineer').post(url(`/${id}/transitions`)).send({ to: 'resolved', note: `  ${note} ` }).expect(200);
      expect((await stored(id)).status).toBe('resolved');
      const comments = await app.dataSource.getRepository(FindingComment).find({ where: { findingId: id } });
      expect(comments.map((comment) => [comment.authorId, comment.text])).toEqual([[team.engineer.id, note]]);
    });

    it('returns 400 for a status that does not exist', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const response = await as('engineer').post(url(`/${id}/transitions`)).send({ to: 'closed' }).expect(400);
      expect(response.body.error.details[0].field).toBe('to');
    });

    it('returns 404 for a finding of another project', async () => {
      const other = await createTeam(app.dataSource);
      const id = await raiseFinding(await app.signIn(other.coordinator), other.project.id);
      const response = await as('engineer').post(url(`/${id}/transitions`)).send({ to: 'resolved' }).expect(404);
      expect(response.body.error.code).toBe('finding_not_found');
      expect((await stored(id)).status).toBe('open');
    });
  });

  describe('POST /api/projects/:projectId/findings', () => {
    const viewpoint = {
      camera: { kind: 'perspective', viewPoint_m: [12, -8, 9], direction: [-0.5, 0.7, -0.5], up: [0, 0, 1], fieldOfView_deg: 50, aspectRatio: 1.6 },
      selectedGlobalIds: [MEMBER_IDS.beamB12],
      visibility: { defaultVisible: true, exceptionGlobalIds: [MEMBER_IDS.slabEdge] },
      clippingPlanes: [],
    };

    it('raises a manual finding with its viewpoint and snapshot', async () => {
      const response = await as('engineer')
        .post(url())
        .send({
          title: ' Bolt group clashes with the web stiffener ',
          memberGlobalIds: [MEMBER_IDS.beamB12, MEMBER_IDS.beamB12, MEMBER_IDS.columnC3],
          viewpoint,
          snapshotPng: TINY_PNG.toString('base64'),
          priority: 'critical',
          labels: ['Level 2', 'Level 2', 'Connections'],
        })
        .expect(201);
      expect(response.body.finding).toMatchObject({
        kind: 'manual',
        title: 'Bolt group clashes with the web stiffener',
        status: 'open',
        priority: 'critical',
        labels: ['Level 2', 'Connections'],
        memberGlobalIds: [MEMBER_IDS.beamB12, MEMBER_IDS.columnC3],
        viewpoint,
        hasSnapshot: true,
        createdBy: { id: team.engineer.id, name: team.engineer.name },
        guid: expect.stringMatching(/^[0-9a-f-]{36}$/),
      });
      const snapshot = await as('reviewer').get(url(`/${response.body.finding.id}/snapshot.png`)).expect(200);
      expect(snapshot.headers['content-type']).toBe('image/png');
      expect(Buffer.compare(snapshot.body as Buffer, TINY_PNG)).toBe(0);
    });

    it('numbers findings one after another within the project', async () => {
      const fresh = await createTeam(app.dataSource);
      const coordinator = await app.signIn(fresh.coordinator);
      const ids = [await raiseFinding(coordinator, fresh.project.id), await raiseFinding(coordinator, fresh.project.id)];
      const numbers = await Promise.all(ids.map(async (id) => (await stored(id)).number));
      expect(numbers).toEqual([1, 2]);
    });

    it('returns 400 for a snapshot that is not a PNG and keeps neither finding nor file', async () => {
      const findings = () => app.dataSource.getRepository(Finding).countBy({ projectId: team.project.id });
      const before = { findings: await findings(), files: await snapshotFiles() };
      const response = await as('engineer')
        .post(url())
        .send({ title: 'Not an image', memberGlobalIds: [MEMBER_IDS.beamB12], snapshotPng: Buffer.from('GIF89a....').toString('base64') })
        .expect(400);
      expect(response.body.error.code).toBe('snapshot_not_png');
      expect({ findings: await findings(), files: await snapshotFiles() }).toEqual(before);
    });

    it('validates every field at once', async () => {
      const response = await as('engineer')
        .post(url())
        .send({ title: '', memberGlobalIds: ['not-a-global-id'], priority: 'urgent', viewpoint: { ...viewpoint, camera: { ...viewpoint.camera, fieldOfView_deg: 200 } } })
        .expect(400);
      expect(response.body.error.details.map((d: { field: string }) => d.field)).toEqual([
        'title',
        'memberGlobalIds.0',
        'viewpoint.camera.fieldOfView_deg',
        'priority',
      ]);
    });

    it('returns 403 for a reviewer, who verifies rather than raises findings', async () => {
      await as('reviewer').post(url()).send({ title: 'X', memberGlobalIds: [MEMBER_IDS.beamB12] }).expect(403);
    });
  });

  describe('PATCH /api/projects/:projectId/findings/:findingId', () => {
    it('lets a coordinator assign and set priority and due date, each change in the history', async () => {
      const id = await raiseFinding(as('engineer'), team.project.id);
      const response = await as('coordinator')
        .patch(url(`/${id}`))
        .send({ assigneeId: team.engineer.id, priority: 'high', dueDate: '2027-03-31' })
        .expect(200);
      expect(response.body.finding).toMatchObject({
        assignee: { id: team.engineer.id, name: team.engineer.name, email: team.engineer.email },
        priority: 'high',
        dueDate: '2027-03-31',
      });
      expect((await historyOf(id)).slice(1).map((c) => [c.field, c.fromValue, c.toValue]).sort()).toEqual([
        ['assignee', null, team.engineer.name],
        ['dueDate', null, '2027-03-31'],
        ['priority', 'normal', 'high'],
      ]);
    });

    it('returns 403 when an engineer tries to assign, and changes nothing', async () => {
      const id = await raiseFinding(as('engineer'), team.project.id);
      const response = await as('engineer').patch(url(`/${id}`)).send({ assigneeId: team.engineer.id, labels: ['mine'] }).expect(403);
      expect(response.body.error.code).toBe('field_not_allowed');
      expect(await stored(id)).toMatchObject({ assigneeId: null, labels: [] });
    });

    it('lets anyone taking part change labels, title and description', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const response = await as('engineer')
        .patch(url(`/${id}`))
        .send({ labels: [' Transfer beams ', 'Level 2'], title: 'Notch at B-12, east end', description: 'Cope depth 60 mm.' })
        .expect(200);
      expect(response.body.finding).toMatchObject({ labels: ['Transfer beams', 'Level 2'], title: 'Notch at B-12, east end', description: 'Cope depth 60 mm.' });
    });

    it('returns 400 when the assignee is not a member of the project', async () => {
      const stranger = await createUser(app.dataSource);
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const response = await as('coordinator').patch(url(`/${id}`)).send({ assigneeId: stranger.id }).expect(400);
      expect(response.body.error.code).toBe('assignee_not_member');
      expect((await stored(id)).assigneeId).toBeNull();
    });

    it('returns 400 for an empty change and for a date that is not a date', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      await as('coordinator').patch(url(`/${id}`)).send({}).expect(400);
      const response = await as('coordinator').patch(url(`/${id}`)).send({ dueDate: '31/03/2027' }).expect(400);
      expect(response.body.error.details[0].field).toBe('dueDate');
    });
  });

  describe('POST /api/projects/:projectId/findings/bulk-assign', () => {
    it('assigns several findings at once', async () => {
      const ids = [await raiseFinding(as('coordinator'), team.project.id), await raiseFinding(as('coordinator'), team.project.id)];
      const response = await as('reviewer').post(url('/bulk-assign')).send({ findingIds: ids, assigneeId: team.engineer.id }).expect(200);
      expect(response.body.findings.map((f: { assignee: { id: string } }) => f.assignee.id)).toEqual([team.engineer.id, team.engineer.id]);
      for (const id of ids) expect((await historyOf(id)).map((c) => c.field)).toEqual(['created', 'assignee']);
    });

    it('returns 404 and assigns nothing when one finding is not in the project', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      const other = await createTeam(app.dataSource);
      const foreign = await raiseFinding(await app.signIn(other.coordinator), other.project.id);
      const response = await as('coordinator').post(url('/bulk-assign')).send({ findingIds: [id, foreign], assigneeId: team.engineer.id }).expect(404);
      expect(response.body.error.details.findingIds).toEqual([foreign]);
      expect((await stored(id)).assigneeId).toBeNull();
      expect((await stored(foreign)).assigneeId).toBeNull();
    });

    it('returns 403 for an engineer', async () => {
      const id = await raiseFinding(as('coordinator'), team.project.id);
      await as('engineer').post(url('/bulk-assign')).send({ findingIds: [id], assigneeId: team.engineer.id }).expect(403);
    });
  });

  describe('GET /api/projects/:projectId/findings', () => {
    let scene: TestTeam;
    let list: (query: string) => Promise<{ total: number; titles: string[] }>;

    beforeAll(async () => {
      scene = await createTeam(app.dataSource);
      const coordinator = await app.signIn(scene.coordinator);
      const a = await raiseFinding(coordinator, scene.project.id, { title: 'Alpha web plate', priority: 'low' });
      const b = await raiseFinding(coordinator, scene.project.id, { title: 'Bravo 50% cope', priority: 'critical' });
      await raiseFinding(coordinator, scene.project.id, { title: 'Charlie splice', priority: 'normal', memberGlobalIds: [MEMBER_IDS.columnC3] });
      await coordinator.patch(findingsUrl(scene.project.id, `/${a}`)).send({ assigneeId: scene.engineer.id }).expect(200);
      await setStatus(app.dataSource, b, 'resolved');
      const engineer = await app.signIn(scene.engineer);
      list = async (query) => {
        const response = await engineer.get(findingsUrl(scene.project.id, `?${query}`)).expect(200);
        return { total: response.body.total, titles: response.body.findings.map((f: { title: string }) => f.title) };
      };
    });

    it('lists newest first by default', async () => {
      expect(await list('')).toEqual({ total: 3, titles: ['Charlie splice', 'Bravo 50% cope', 'Alpha web plate'] });
      const engineer = await app.signIn(scene.engineer);
      const numbers = (await engineer.get(findingsUrl(scene.project.id, '?sort=priority')).expect(200)).body.findings.map((f: { number: number }) => f.number);
      expect(numbers).toEqual([2, 3, 1]);
    });

    it('sorts priorities by severity and statuses by workflow order', async () => {
      expect((await list('sort=priority&dir=desc')).titles).toEqual(['Bravo 50% cope', 'Charlie splice', 'Alpha web plate']);
      expect((await list('sort=status&dir=asc')).titles.at(-1)).toBe('Bravo 50% cope');
    });

    it('filters by status, assignee, priority and text, and pages on the server', async () => {
      expect(await list('status=resolved,verified')).toEqual({ total: 1, titles: ['Bravo 50% cope'] });
      expect((await list('assignee=me')).titles).toEqual(['Alpha web plate']);
      expect((await list('assignee=none')).total).toBe(2);
      expect((await list('priority=low,normal')).total).toBe(2);
      expect((await list('q=50%25')).titles).toEqual(['Bravo 50% cope']);
      expect((await list('q=F-0003')).titles).toEqual(['Charlie splice']);
      expect(await list('sort=number&dir=asc&page=1&pageSize=2')).toEqual({ total: 3, titles: ['Charlie splice'] });
    });

    it('returns 400 for unknown filter values', async () => {
      const engineer = await app.signIn(scene.engineer);
      const response = await engineer.get(findingsUrl(scene.project.id, '?status=closed&pageSize=500')).expect(400);
      expect(response.body.error.details.map((d: { field: string }) => d.field)).toEqual(['status.0', 'pageSize']);
    });
  });

  describe('GET /api/projects/:projectId/findings/:findingId', () => {
    it('returns the finding with comments, history and the steps the caller may take', async () => {
      const id = await raiseFinding(as('engineer'), team.project.id);
      await as('reviewer').post(url(`/${id}/comments`)).send({ text: 'Please add the cope detail.' }).expect(201);
      const response = await as('engineer').get(url(`/${id}`)).expect(200);
      expect(response.body).toEqual({
        finding: expect.objectContaining({ id, status: 'open' }),
        comments: [expect.objectContaining({ author: { id: team.reviewer.id, name: team.reviewer.name }, text: 'Please add the cope detail.' })],
        history: [expect.objectContaining({ actor: { id: team.engineer.id, name: team.engineer.name }, field: 'created', to: 'open' })],
        allowedTransitions: ['in-progress', 'resolved'],
      });
      expect((await as('coordinator').get(url(`/${id}`)).expect(200)).body.allowedTransitions).toEqual([]);
    });

    it('returns 404 for a snapshot that was never taken', async () => {
      const id = await raiseFinding(as('engineer'), team.project.id);
      const response = await as('engineer').get(url(`/${id}/snapshot.png`)).expect(404);
      expect(response.body.error.code).toBe('snapshot_not_found');
    });
  });

  describe('POST /api/projects/:projectId/findings/:findingId/comments', () => {
    it('adds a comment for any member and refuses a blank one', async () => {
      const id = await raiseFinding(as('engineer'), team.project.id);
      const response = await as('coordinator').post(url(`/${id}/comments`)).send({ text: ' Fabricator asks for the revised section. ' }).expect(201);
      expect(response.body.comment).toMatchObject({ text: 'Fabricator asks for the revised section.', author: { id: team.coordinator.id } });
      await as('coordinator').post(url(`/${id}/comments`)).send({ text: '  ' }).expect(400);
    });
  });
});
