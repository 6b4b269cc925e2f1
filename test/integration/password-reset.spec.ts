import { type Server, type Socket, createServer } from 'node:net';
import { PasswordReset } from '../../server/auth/password-reset.entity';
import { RATE_LIMITS } from '../../server/http/rate-limits';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { TEST_PASSWORD, createUser } from '../fixtures/test-accounts';
import { lastMailTo, linkIn, mailsTo, waitForMailsTo } from '../fixtures/test-outbox';

const NEW_PASSWORD = 'another good password';

describe('password reset', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  /** The link in the `nth` reset mail to this address, once it has arrived (it is sent after the answer). */
  async function resetLinkFor(email: string, nth = 1): Promise<string> {
    const mail = (await waitForMailsTo(app.dataSource, email, nth))[nth - 1];
    return linkIn(mail, app.config.publicUrl, '/reset-password/').token;
  }

  it('e-mails a 2-hour link that sets a new password and ends every other session', async () => {
    const user = await createUser(app.dataSource);
    const oldSession = await app.signIn(user);
    const anonymous = await app.agent();
    await anonymous.post('/api/auth/password-reset').send({ email: user.email.toUpperCase() }).expect(202, { status: 'accepted' });

    const [mail] = await waitForMailsTo(app.dataSource, user.email);
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
    const second = await resetLinkFor(user.email, 2);
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
    // Requests are handled in order behind the answers: once a later one's mail is there, these were handled.
    const known = await createUser(app.dataSource);
    await agent.post('/api/auth/password-reset').send({ email: known.email }).expect(202);
    await waitForMailsTo(app.dataSource, known.email);
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
    expect(await waitForMailsTo(app.dataSource, user.email, RATE_LIMITS.resetRequestsPerAccount.limit)).toHaveLength(
      RATE_LIMITS.resetRequestsPerAccount.limit,
    );
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

describe('password reset while the mail server is slow', () => {
  // An SMTP server that accepts connections and never greets: sending a mail to it waits until nodemailer gives up.
  let stalled: Server;
  const sockets = new Set<Socket>();
  let app: TestApp;
  beforeAll(async () => {
    stalled = createServer((socket) => sockets.add(socket));
    await new Promise<void>((resolve) => stalled.listen(0, '127.0.0.1', resolve));
    const port = (stalled.address() as { port: number }).port;
    app = await startTestApp({ fakeSmtp: false, smtp: { host: '127.0.0.1', port, from: 'taulens@example.test' } });
  });
  afterAll(async () => {
    for (const socket of sockets) socket.destroy();
    await app.close();
    await new Promise((resolve) => stalled.close(resolve));
  });

  // The answer must not wait for the mail, or its time would tell a registered address from an unknown one.
  it('answers a request for a registered address at once, as for an unknown one', async () => {
    const user = await createUser(app.dataSource);
    const agent = await app.agent();
    await agent.post('/api/auth/password-reset').timeout(3000).send({ email: 'nobody@example.test' }).expect(202, { status: 'accepted' });
    await agent.post('/api/auth/password-reset').timeout(3000).send({ email: user.email }).expect(202, { status: 'accepted' });
  });
});
