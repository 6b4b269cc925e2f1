import type { Response } from 'superagent';
import type { Test } from 'supertest';
import { Finding } from '../../server/findings/finding.entity';
import type { Project } from '../../server/projects/project.entity';
import type { User } from '../../server/users/user.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import { VERSION_2_1, zipOf } from '../fixtures/bcf/hostile-archives';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createProject, createUser } from '../fixtures/test-accounts';
import { MEMBER_IDS, TINY_PNG, findingsUrl, insertFindings } from './findings-fixtures';

/**
 * Every findings route × every kind of caller, active and archived project. Expected statuses are written out from
 * the brief (PRODUCT.md "Who uses it", issue 7: engineers resolve, reviewers verify or accept, coordinators assign;
 * everyone reads, comments and exports; archived projects are read-only), not derived from permissions.ts.
 */
type Caller = 'anonymous' | 'outsider' | 'reviewer' | 'engineer' | 'coordinator' | 'admin';
const CALLERS: Caller[] = ['anonymous', 'outsider', 'reviewer', 'engineer', 'coordinator', 'admin'];

interface Scene {
  project: Project;
  findingId: string;
  guid: string;
  engineer: User;
}

interface Case {
  route: string;
  send(agent: ApiAgent, scene: Scene): Test | Promise<Response>;
  expected: [anonymous: number, outsider: number, reviewer: number, engineer: number, coordinator: number, admin: number];
  /** When the project is archived; reads are unchanged, every change is 409 for everyone who may make it. */
  archived?: [anonymous: number, outsider: number, reviewer: number, engineer: number, coordinator: number, admin: number];
}

const url = (scene: Scene, rest = '') => findingsUrl(scene.project.id, rest);

/** A BCF 2.1 file that repeats the scene's finding as it is. */
async function unchangedBcf(scene: Scene): Promise<Buffer> {
  const markup =
    '<?xml version="1.0" encoding="UTF-8"?><Markup>' +
    `<Topic Guid="${scene.guid}" TopicStatus="Open"><Title>Set-up</Title>` +
    '<CreationDate>2026-01-05T08:00:00Z</CreationDate><CreationAuthor>someone@example.com</CreationAuthor></Topic></Markup>';
  return zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${scene.guid}/markup.bcf`, contents: markup }]);
}

const CAMERA = { kind: 'perspective', viewPoint_m: [10, -10, 8], direction: [-1, 1, -0.8], up: [0, 0, 1], fieldOfView_deg: 50, aspectRatio: 1.5 };

const CASES: Case[] = [
  { route: 'GET …/findings', send: (a, s) => a.get(url(s)), expected: [401, 404, 200, 200, 200, 200], archived: [401, 404, 200, 200, 200, 200] },
  {
    route: 'POST …/findings',
    send: (a, s) => a.post(url(s)).send({ title: 'Clash at the splice', memberGlobalIds: [MEMBER_IDS.beamB12] }),
    expected: [401, 404, 403, 201, 201, 201],
    archived: [401, 404, 403, 409, 409, 409],
  },
  { route: 'GET …/findings/:id', send: (a, s) => a.get(url(s, `/${s.findingId}`)), expected: [401, 404, 200, 200, 200, 200], archived: [401, 404, 200, 200, 200, 200] },
  {
    route: 'PATCH …/findings/:id (priority)',
    send: (a, s) => a.patch(url(s, `/${s.findingId}`)).send({ priority: 'high' }),
    expected: [401, 404, 200, 403, 200, 200],
    archived: [401, 404, 409, 409, 409, 409],
  },
  {
    route: 'PATCH …/findings/:id (assignee)',
    send: (a, s) => a.patch(url(s, `/${s.findingId}`)).send({ assigneeId: s.engineer.id }),
    expected: [401, 404, 200, 403, 200, 200],
  },
  {
    route: 'PATCH …/findings/:id (labels)',
    send: (a, s) => a.patch(url(s, `/${s.findingId}`)).send({ labels: ['Level 2'] }),
    expected: [401, 404, 200, 200, 200, 200],
  },
  {
    route: 'POST …/findings/:id/transitions (resolve)',
    send: (a, s) => a.post(url(s, `/${s.findingId}/transitions`)).send({ to: 'resolved' }),
    expected: [401, 404, 403, 200, 403, 200],
    archived: [401, 404, 409, 409, 409, 409],
  },
  {
    route: 'POST …/findings/:id/transitions (accept)',
    send: (a, s) => a.post(url(s, `/${s.findingId}/transitions`)).send({ to: 'accepted', justification: 'Covered by the site test report.' }),
    expected: [401, 404, 200, 403, 403, 200],
  },
  {
    route: 'POST …/findings/:id/comments',
    send: (a, s) => a.post(url(s, `/${s.findingId}/comments`)).send({ text: 'Seen.' }),
    expected: [401, 404, 201, 201, 201, 201],
    archived: [401, 404, 409, 409, 409, 409],
  },
  {
    route: 'POST …/findings/bulk-assign',
    send: (a, s) => a.post(url(s, '/bulk-assign')).send({ findingIds: [s.findingId], assigneeId: s.engineer.id }),
    expected: [401, 404, 200, 403, 200, 200],
    archived: [401, 404, 409, 403, 409, 409],
  },
  {
    route: 'GET …/findings/:id/snapshot.png',
    send: (a, s) => a.get(url(s, `/${s.findingId}/snapshot.png`)),
    expected: [401, 404, 200, 200, 200, 200],
  },
  { route: 'GET …/findings/export.bcfzip', send: (a, s) => a.get(url(s, '/export.bcfzip?version=3.0')), expected: [401, 404, 200, 200, 200, 200], archived: [401, 404, 200, 200, 200, 200] },
  { route: 'GET …/findings/export.csv', send: (a, s) => a.get(url(s, '/export.csv')), expected: [401, 404, 200, 200, 200, 200], archived: [401, 404, 200, 200, 200, 200] },
  {
    route: 'POST …/findings/import',
    send: async (a, s) => await a.post(url(s, '/import')).attach('file', await unchangedBcf(s), 'returned.bcf'),
    expected: [401, 404, 200, 200, 200, 200],
    archived: [401, 404, 409, 409, 409, 409],
  },
  {
    route: 'GET …/viewpoints',
    send: (a, s) => a.get(`/api/projects/${s.project.id}/viewpoints`),
    expected: [401, 404, 200, 200, 200, 200],
  },
  {
    route: 'POST …/viewpoints',
    send: (a, s) => a.post(`/api/projects/${s.project.id}/viewpoints`).send({ name: 'East bay from above', camera: CAMERA, selectedGlobalIds: [MEMBER_IDS.beamB12] }),
    expected: [401, 404, 403, 201, 201, 201],
    archived: [401, 404, 403, 409, 409, 409],
  },
  { route: 'GET /api/notifications/preferences', send: (a) => a.get('/api/notifications/preferences'), expected: [401, 200, 200, 200, 200, 200] },
  {
    route: 'PUT /api/notifications/preferences',
    send: (a) => a.put('/api/notifications/preferences').send({ assigned: true, statusChanged: true, mentioned: true }),
    expected: [401, 200, 200, 200, 200, 200],
  },
];

describe('findings permissions', () => {
  let app: TestApp;
  let users: Record<Exclude<Caller, 'anonymous'>, User>;
  const agents = new Map<Caller, ApiAgent>();

  beforeAll(async () => {
    app = await startTestApp();
    const ds = app.dataSource;
    users = {
      outsider: await createUser(ds, { name: 'Outsider' }),
      reviewer: await createUser(ds, { name: 'Reviewer' }),
      engineer: await createUser(ds, { name: 'Engineer' }),
      coordinator: await createUser(ds, { name: 'Coordinator' }),
      admin: await createUser(ds, { name: 'Admin', isAdmin: true }),
    };
    agents.set('anonymous', await app.agent());
    for (const [caller, user] of Object.entries(users)) {
      const agent = await app.signIn(user);
      // E-mails are tested in findings-mail.spec.ts.
      await agent.put('/api/notifications/preferences').send({ assigned: false, statusChanged: false, mentioned: false }).expect(200);
      agents.set(caller as Caller, agent);
    }
  });
  afterAll(() => app.close());

  async function freshScene(archived: boolean): Promise<Scene> {
    const project = await createProject(
      app.dataSource,
      [
        [users.coordinator, 'coordinator'],
        [users.engineer, 'engineer'],
        [users.reviewer, 'reviewer'],
      ],
      { archived },
    );
    const [findingId] = await insertFindings(app.dataSource, project.id, ['open']);
    const key = `projects/${project.id}/findings/${findingId}/snapshot.png`;
    await app.server.context.storage.put(key, TINY_PNG);
    await app.dataSource.getRepository(Finding).update(findingId, { snapshotKey: key });
    const { guid } = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: findingId });
    return { project, findingId, guid, engineer: users.engineer };
  }

  const rows = CASES.flatMap((c) => [
    ...CALLERS.map((caller, i) => ({ route: c.route, send: c.send, caller, archived: false, status: c.expected[i] })),
    ...(c.archived ? CALLERS.map((caller, i) => ({ route: `${c.route} [archived]`, send: c.send, caller, archived: true, status: c.archived![i] })) : []),
  ]);

  it.each(rows)('$route as $caller → $status', async ({ send, caller, archived, status }) => {
    const scene = await freshScene(archived);
    const response = await send(agents.get(caller)!, scene);
    expect({ status: response.status, code: response.body?.error?.code }).toEqual({
      status,
      code: status >= 400 ? expect.any(String) : undefined,
    });
    if (status >= 400) {
      const finding = await app.dataSource.getRepository(Finding).findOneByOrFail({ id: scene.findingId });
      expect(finding).toMatchObject({ status: 'open', priority: 'normal', assigneeId: null, labels: [] });
    }
  });
});
