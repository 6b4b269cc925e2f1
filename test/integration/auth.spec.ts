import request from 'supertest';
import { RATE_LIMITS } from '../../server/http/rate-limits';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { TEST_PASSWORD, createProject, createUser } from '../fixtures/test-accounts';

describe('sign-in and session', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  describe('CSRF', () => {
    it('rejects a state-changing request without a token with 403 csrf_invalid', async () => {
      const user = await createUser(app.dataSource);
      const response = await request(app.url).post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD }).expect(403);
      expect(response.body.error.code).toBe('csrf_invalid');
    });

    it('rejects a token that belongs to another browser session', async () => {
      const user = await createUser(app.dataSource);
      const mine = await app.agent();
      const theirs = await request(app.url).get('/api/auth/csrf').expect(200);
      const response = await mine
        .post('/api/auth/login')
        .set('x-csrf-token', theirs.body.token)
        .send({ email: user.email, password: TEST_PASSWORD })
        .expect(403);
      expect(response.body.error.code).toBe('csrf_invalid');
    });

    it('rejects a signed-in request without the header', async () => {
      const user = await createUser(app.dataSource);
      const agent = await app.signIn(user);
      await agent.post('/api/auth/logout').set('x-csrf-token', '').expect(403);
      await agent.get('/api/auth/me').expect(200);
    });

    it('keeps the same token valid across sign-in and sign-out', async () => {
      const user = await createUser(app.dataSource);
      const agent = await app.signIn(user);
      await agent.post('/api/auth/logout').expect(204);
      await agent.post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD }).expect(200);
    });
  });

  describe('POST /api/auth/login', () => {
    it('signs in and GET /api/auth/me describes the session', async () => {
      const user = await createUser(app.dataSource, { name: 'Mira Holt' });
      const other = await createUser(app.dataSource);
      const project = await createProject(app.dataSource, [[user, 'engineer'], [other, 'coordinator']], { name: 'Gantry 4' });
      const agent = await app.agent();
      const login = await agent.post('/api/auth/login').send({ email: user.email.toUpperCase(), password: TEST_PASSWORD }).expect(200);
      expect(login.body).toEqual({ user: { id: user.id, email: user.email, name: 'Mira Holt', isAdmin: false } });

      const me = await agent.get('/api/auth/me').expect(200);
      expect(me.body).toEqual({
        user: { id: user.id, email: user.email, name: 'Mira Holt', isAdmin: false },
        memberships: [{ projectId: project.id, projectName: 'Gantry 4', role: 'engineer' }],
        permissions: {
          [project.id]: ['project.read', 'model.read', 'check.run', 'check.read', 'finding.create', 'finding.resolve', 'finding.comment', 'export'],
        },
        canCreateProjects: false,
        devOutbox: false,
      });
      expect(me.body.user).not.toHaveProperty('passwordHash');
    });

    it('gives the same 401 for a wrong password and an unknown address', async () => {
      const user = await createUser(app.dataSource);
      const agent = await app.agent();
      const wrong = await agent.post('/api/auth/login').send({ email: user.email, password: 'not the password' }).expect(401);
      const unknown = await agent.post('/api/auth/login').send({ email: 'nobody@example.test', password: 'whatever1234' }).expect(401);
      expect(wrong.body).toEqual(unknown.body);
      expect(wrong.body.error.code).toBe('invalid_credentials');
      await agent.get('/api/auth/me').expect(401);
    });

    it('validates the body', async () => {
      const agent = await app.agent();
      const response = await agent.post('/api/auth/login').send({ email: 'not-an-address' }).expect(400);
      expect(response.body.error.details).toEqual([
        { location: 'body', field: 'email', message: 'is not a valid e-mail address' },
        { location: 'body', field: 'password', message: 'is required' },
      ]);
    });

    it(`answers 429 after ${RATE_LIMITS.signInFailuresPerAccount.limit} failed attempts for one address, even with the right password`, async () => {
      const user = await createUser(app.dataSource);
      const agent = await app.agent();
      for (let i = 0; i < RATE_LIMITS.signInFailuresPerAccount.limit; i++) {
        await agent.post('/api/auth/login').send({ email: user.email, password: `guess number ${i}` }).expect(401);
      }
      const blocked = await agent.post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD }).expect(429);
      expect(blocked.body.error.code).toBe('rate_limited');
      expect(blocked.headers['retry-after']).toBeDefined();
      // Another account from the same client is not blocked.
      const other = await createUser(app.dataSource);
      await agent.post('/api/auth/login').send({ email: other.email, password: TEST_PASSWORD }).expect(200);
    });
  });

  describe('deactivated users', () => {
    it('cannot sign in: 403 deactivated, but only with the right password', async () => {
      const user = await createUser(app.dataSource, { active: false });
      const agent = await app.agent();
      await agent.post('/api/auth/login').send({ email: user.email, password: 'wrong password' }).expect(401);
      const response = await agent.post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD }).expect(403);
      expect(response.body.error.code).toBe('deactivated');
      await agent.get('/api/auth/me').expect(401);
    });

    it('lose every open session when an admin deactivates them, and reactivation does not bring it back', async () => {
      const admin = await createUser(app.dataSource, { isAdmin: true });
      const user = await createUser(app.dataSource);
      const [adminAgent, laptop, phone] = await Promise.all([app.signIn(admin), app.signIn(user), app.signIn(user)]);
      await laptop.get('/api/auth/me').expect(200);

      const deactivated = await adminAgent.post(`/api/users/${user.id}/deactivate`).expect(200);
      expect(deactivated.body.user).toMatchObject({ id: user.id, active: false });
      await laptop.get('/api/auth/me').expect(401);
      await phone.get('/api/projects').expect(401);

      await adminAgent.post(`/api/users/${user.id}/reactivate`).expect(200);
      await laptop.get('/api/auth/me').expect(401);
      await app.signIn(user);
    });
  });

  describe('POST /api/auth/logout', () => {
    it('ends the session with 204', async () => {
      const user = await createUser(app.dataSource);
      const agent = await app.signIn(user);
      await agent.post('/api/auth/logout').expect(204);
      await agent.get('/api/auth/me').expect(401);
    });

    it('is harmless when nobody is signed in', async () => {
      const agent = await app.agent();
      await agent.post('/api/auth/logout').expect(204);
    });
  });

  it('records the last sign-in for the user list', async () => {
    const admin = await createUser(app.dataSource, { isAdmin: true });
    const adminAgent = await app.signIn(admin);
    const response = await adminAgent.get('/api/users').expect(200);
    const row = response.body.users.find((u: { id: string }) => u.id === admin.id);
    expect(row).toEqual({
      id: admin.id,
      email: admin.email,
      name: admin.name,
      isAdmin: true,
      active: true,
      createdAt: expect.any(String),
      lastSignInAt: expect.any(String),
    });
  });
});
