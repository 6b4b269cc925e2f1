import type { Test } from 'supertest';
import type { Project } from '../../server/projects/project.entity';
import type { User } from '../../server/users/user.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createProject, createUser } from '../fixtures/test-accounts';

/**
 * Every API route × every kind of caller. Expected statuses are written out from the brief
 * (issue 2, "Roles and permissions" and "API contract"), not derived from permissions.ts.
 * Each project route runs against a fresh project, so one case cannot change another's data.
 */
type Caller = 'anonymous' | 'outsider' | 'reviewer' | 'engineer' | 'coordinator' | 'admin';
const CALLERS: Caller[] = ['anonymous', 'outsider', 'reviewer', 'engineer', 'coordinator', 'admin'];

interface Scene {
  project: Project;
  /** An engineer member other than the callers, to change or remove. */
  extra: User;
  /** A user in no project, for the admin user routes. */
  target: User;
  unique: string;
}

interface Case {
  route: string;
  send(agent: ApiAgent, scene: Scene): Test;
  expected: [anonymous: number, outsider: number, reviewer: number, engineer: number, coordinator: number, admin: number];
  archived?: boolean;
}

const CASES: Case[] = [
  { route: 'GET /api/health', send: (a) => a.get('/api/health'), expected: [200, 200, 200, 200, 200, 200] },
  { route: 'GET /api/auth/csrf', send: (a) => a.get('/api/auth/csrf'), expected: [200, 200, 200, 200, 200, 200] },
  { route: 'GET /api/auth/me', send: (a) => a.get('/api/auth/me'), expected: [401, 200, 200, 200, 200, 200] },
  {
    route: 'GET /api/auth/invitations/:token',
    send: (a) => a.get('/api/auth/invitations/unknown-token'),
    expected: [404, 404, 404, 404, 404, 404],
  },
  {
    route: 'POST /api/auth/login (wrong password)',
    send: (a, s) => a.post('/api/auth/login').send({ email: `nobody-${s.unique}@example.test`, password: 'not the password' }),
    expected: [401, 401, 401, 401, 401, 401],
  },
  {
    route: 'POST /api/auth/invitations/:token/join',
    send: (a) => a.post('/api/auth/invitations/unknown-token/join'),
    expected: [401, 404, 404, 404, 404, 404],
  },
  {
    route: 'POST /api/auth/invitations/:token/accept',
    send: (a) => a.post('/api/auth/invitations/unknown-token/accept').send({ name: 'N', password: 'long enough password' }),
    expected: [404, 404, 404, 404, 404, 404],
  },
  {
    route: 'GET /api/auth/password-reset/:token',
    send: (a) => a.get('/api/auth/password-reset/unknown-token'),
    expected: [404, 404, 404, 404, 404, 404],
  },
  {
    route: 'POST /api/auth/password-reset/:token',
    send: (a) => a.post('/api/auth/password-reset/unknown-token').send({ password: 'long enough password' }),
    expected: [404, 404, 404, 404, 404, 404],
  },
  {
    route: 'POST /api/auth/password-reset',
    send: (a, s) => a.post('/api/auth/password-reset').send({ email: `nobody-${s.unique}@example.test` }),
    expected: [202, 202, 202, 202, 202, 202],
  },
  { route: 'GET /api/dev/outbox', send: (a) => a.get('/api/dev/outbox'), expected: [401, 403, 403, 403, 403, 200] },

  { route: 'GET /api/users', send: (a) => a.get('/api/users'), expected: [401, 403, 403, 403, 403, 200] },
  {
    route: 'POST /api/users/invitations',
    send: (a, s) => a.post('/api/users/invitations').send({ email: `invitee-${s.unique}@example.test` }),
    expected: [401, 403, 403, 403, 403, 201],
  },
  {
    route: 'POST /api/users/:userId/deactivate',
    send: (a, s) => a.post(`/api/users/${s.target.id}/deactivate`),
    expected: [401, 403, 403, 403, 403, 200],
  },
  {
    route: 'POST /api/users/:userId/reactivate',
    send: (a, s) => a.post(`/api/users/${s.target.id}/reactivate`),
    expected: [401, 403, 403, 403, 403, 200],
  },
  {
    route: 'POST /api/users/:userId/password-reset',
    send: (a, s) => a.post(`/api/users/${s.target.id}/password-reset`),
    expected: [401, 403, 403, 403, 403, 202],
  },

  { route: 'GET /api/projects', send: (a) => a.get('/api/projects?archived=false'), expected: [401, 200, 200, 200, 200, 200] },
  {
    route: 'POST /api/projects',
    send: (a, s) => a.post('/api/projects').send({ name: 'New project', code: `N-${s.unique}` }),
    expected: [401, 403, 403, 403, 201, 201],
  },
  {
    route: 'GET /api/projects/:projectId (not a UUID)',
    send: (a) => a.get('/api/projects/not-a-uuid'),
    expected: [401, 404, 404, 404, 404, 404],
  },
  {
    route: 'GET /api/projects/:projectId',
    send: (a, s) => a.get(`/api/projects/${s.project.id}`),
    expected: [401, 404, 200, 200, 200, 200],
  },
  {
    route: 'PATCH /api/projects/:projectId',
    send: (a, s) => a.patch(`/api/projects/${s.project.id}`).send({ description: 'Revised scope' }),
    expected: [401, 404, 403, 403, 200, 200],
  },
  {
    route: 'POST /api/projects/:projectId/archive',
    send: (a, s) => a.post(`/api/projects/${s.project.id}/archive`),
    expected: [401, 404, 403, 403, 200, 200],
  },
  {
    route: 'POST /api/projects/:projectId/unarchive',
    send: (a, s) => a.post(`/api/projects/${s.project.id}/unarchive`),
    expected: [401, 404, 403, 403, 200, 200],
    archived: true,
  },
  {
    route: 'GET /api/projects/:projectId/members',
    send: (a, s) => a.get(`/api/projects/${s.project.id}/members`),
    expected: [401, 404, 200, 200, 200, 200],
  },
  {
    route: 'POST /api/projects/:projectId/members',
    send: (a, s) => a.post(`/api/projects/${s.project.id}/members`).send({ email: `member-${s.unique}@example.test`, role: 'reviewer' }),
    expected: [401, 404, 403, 403, 201, 201],
  },
  {
    route: 'PUT /api/projects/:projectId/members/:userId',
    send: (a, s) => a.put(`/api/projects/${s.project.id}/members/${s.extra.id}`).send({ role: 'reviewer' }),
    expected: [401, 404, 403, 403, 200, 200],
  },
  {
    route: 'DELETE /api/projects/:projectId/members/:userId',
    send: (a, s) => a.delete(`/api/projects/${s.project.id}/members/${s.extra.id}`),
    expected: [401, 404, 403, 403, 204, 204],
  },
];

describe('permission matrix', () => {
  let app: TestApp;
  let users: Record<Exclude<Caller, 'anonymous'>, User>;
  const agents = new Map<Caller, ApiAgent>();
  let counter = 0;

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
    for (const [caller, user] of Object.entries(users)) agents.set(caller as Caller, await app.signIn(user));
  });
  afterAll(() => app.close());

  async function freshScene(archived: boolean): Promise<Scene> {
    const extra = await createUser(app.dataSource);
    const project = await createProject(
      app.dataSource,
      [
        [users.coordinator, 'coordinator'],
        [users.engineer, 'engineer'],
        [users.reviewer, 'reviewer'],
        [extra, 'engineer'],
      ],
      { archived },
    );
    return { project, extra, target: await createUser(app.dataSource), unique: `${++counter}x${Date.now().toString(36)}` };
  }

  const rows = CASES.flatMap((c) => CALLERS.map((caller, i) => ({ ...c, caller, status: c.expected[i] })));

  it.each(rows)('$route as $caller → $status', async ({ send, caller, status, archived }) => {
    const scene = await freshScene(archived ?? false);
    const response = await send(agents.get(caller)!, scene);
    expect({ status: response.status, code: response.body?.error?.code }).toEqual({
      status,
      code: status >= 400 ? expect.any(String) : undefined,
    });
  });

  it('keeps every caller signed in (or not) as at the start', async () => {
    for (const caller of CALLERS) {
      await agents.get(caller)!.get('/api/auth/me').expect(caller === 'anonymous' ? 401 : 200);
    }
  });
});
