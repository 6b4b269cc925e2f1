import { PasswordReset } from '../../server/auth/password-reset.entity';
import { RATE_LIMITS } from '../../server/http/rate-limits';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { TEST_PASSWORD, createUser } from '../fixtures/test-accounts';
import { lastMailTo, linkIn, mailsTo } from '../fixtures/test-outbox';

const NEW_PASSWORD = 'another good password';

describe('password reset', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  async function resetLinkFor(email: string): Promise<string> {
    return linkIn(await lastMailTo(app.dataSource, email), app.config.publicUrl, '/reset-password/').token;
  }

  it('e-mails a 2-hour link that sets a new password and ends every other session', async () => {
    const user = await createUser(app.dataSource);
    const oldSession = await app.signIn(user);
    const anonymous = await app.agent();
    await anonymous.post('/api/auth/password-reset').send({ email: user.email.toUpperCase() }).expect(202, { status: 'accepted' });

    const mail = await lastMailTo(app.dataSource, user.email);
    expect(mail.subject).toBe('Choose a new Taulens password');
    const token = await resetLinkFor(user.email);
    const reset = await app.dataSource.getRepository(PasswordReset).findOneByOrFail({ userId: user.id });
    const hours = (reset.expiresAt.getTime() - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(1.99);
    expect(hours).toBeLessThanOrEqual(2);

    await anonymous.get(`/api/auth/password-reset/${token}`).expect(200, { email: user.email });
    await anonymous.post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(204);

    await oldSession.get('/api/auth/me').expect(401);
    const agent = await app.agent();
    await agent.post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD }).expect(401);
    await app.signIn(user, NEW_PASSWORD);
  });

  it('says a used link was used, and using one uses up the older ones too', async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    const first = await resetLinkFor(user.email);
    await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    const second = await resetLinkFor(user.email);
    expect(second).not.toBe(first);

    await agent.post(`/api/auth/password-reset/${second}`).send({ password: NEW_PASSWORD }).expect(204);
    for (const token of [first, second]) {
      const response = await agent.get(`/api/auth/password-reset/${token}`).expect(410);
      expect(response.body.error.code).toBe('reset_used');
    }
    await agent.post(`/api/auth/password-reset/${first}`).send({ password: 'yet another password' }).expect(410);
  });

  it('refuses a new password of spaces only or from the common-password list, and keeps the link usable', async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    const token = await resetLinkFor(user.email);
    const spaces = await agent.post(`/api/auth/password-reset/${token}`).send({ password: ' '.repeat(10) }).expect(400);
    expect(spaces.body.error.details).toEqual([{ location: 'body', field: 'password', message: 'must not be only spaces' }]);
    const common = await agent.post(`/api/auth/password-reset/${token}`).send({ password: 'qwertyuiop' }).expect(400);
    expect(common.body.error.details[0].message).toBe('is one of the most common passwords; choose another');
    await agent.post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(204);
  });

  it('says an expired link expired', async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    const token = await resetLinkFor(user.email);
    await app.dataSource.getRepository(PasswordReset).update({ userId: user.id }, { expiresAt: new Date(Date.now() - 1000) });
    const response = await agent.get(`/api/auth/password-reset/${token}`).expect(410);
    expect(response.body.error.code).toBe('reset_expired');
    await agent.post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(410);
    await app.signIn(user);
  });

  it('answers an unknown token with 404', async () => {
    const agent = await app.agent();
    const response = await agent.get('/api/auth/password-reset/unknown-token').expect(404);
    expect(response.body.error.code).toBe('reset_not_found');
  });

  it('answers 202 for unknown and deactivated addresses without sending anything', async () => {
    const inactive = await createUser(app.dataSource, { active: false });
    const agent = await app.agent();
    await agent.post('/api/auth/password-reset').send({ email: 'nobody@example.test' }).expect(202, { status: 'accepted' });
    await agent.post('/api/auth/password-reset').send({ email: inactive.email }).expect(202, { status: 'accepted' });
    expect(await mailsTo(app.dataSource, 'nobody@example.test')).toEqual([]);
    expect(await mailsTo(app.dataSource, inactive.email)).toEqual([]);
  });

  it(`limits requests for one address to ${RATE_LIMITS.resetRequestsPerAccount.limit} per hour`, async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    for (let i = 0; i < RATE_LIMITS.resetRequestsPerAccount.limit; i++) {
      await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    }
    const blocked = await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(await mailsTo(app.dataSource, user.email)).toHaveLength(RATE_LIMITS.resetRequestsPerAccount.limit);
  });

  it('lets an admin send the link, which says so', async () => {
    const admin = await app.signIn(await createUser(app.dataSource, { isAdmin: true }));
    const user = await createUser(app.dataSource);
    const response = await admin.post(`/api/users/${user.id}/password-reset`).expect(202);
    expect(response.body).toEqual({ status: 'accepted', expiresAt: expect.any(String) });
    expect((await lastMailTo(app.dataSource, user.email)).text).toContain('An administrator asked');
    const token = await resetLinkFor(user.email);
    const anonymous = await app.agent();
    await anonymous.post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD }).expect(204);
    await app.signIn(user, NEW_PASSWORD);
  });

  it('refuses an admin reset for a deactivated user', async () => {
    const admin = await app.signIn(await createUser(app.dataSource, { isAdmin: true }));
    const user = await createUser(app.dataSource, { active: false });
    const response = await admin.post(`/api/users/${user.id}/password-reset`).expect(409);
    expect(response.body.error.code).toBe('user_deactivated');
  });
});
