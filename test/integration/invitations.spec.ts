import request from 'supertest';
import { Invitation } from '../../server/users/invitation.entity';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createTeam, createUser } from '../fixtures/test-accounts';
import { lastMailTo, linkIn, mailsTo, waitForMailsTo } from '../fixtures/test-outbox';

const NEW_PASSWORD = 'a fresh password 7';

describe('invitations', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  async function adminAgent() {
    return app.signIn(await createUser(app.dataSource, { isAdmin: true, name: 'Ines Admin' }));
  }

  it('e-mails a single-use link through the fake SMTP server that creates the account and signs in', async () => {
    const admin = await adminAgent();
    const created = await admin.post('/api/users/invitations').send({ email: 'New.Person@Example.test', name: 'New Person' }).expect(201);
    expect(created.body.invitation).toEqual({ id: expect.any(String), email: 'new.person@example.test', expiresAt: expect.any(String) });
    const days = (Date.parse(created.body.invitation.expiresAt) - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(6.99);
    expect(days).toBeLessThanOrEqual(7);

    const mail = await lastMailTo(app.dataSource, 'new.person@example.test');
    expect(mail.subject).toBe('You are invited to Taulens');
    expect(mail.text).toContain('Ines Admin invited you');
    const link = linkIn(mail, app.config.publicUrl, '/invitations/');
    expect(mail.html).toContain(link.url);

    const invitee = await app.agent();
    const lookup = await invitee.get(`/api/auth/invitations/${link.token}`).expect(200);
    expect(lookup.body).toEqual({
      email: 'new.person@example.test',
      name: 'New Person',
      expiresAt: created.body.invitation.expiresAt,
      hasAccount: false,
      project: null,
    });

    const accepted = await invitee.post(`/api/auth/invitations/${link.token}/accept`).send({ name: 'Nell Person', password: NEW_PASSWORD }).expect(200);
    expect(accepted.body.user).toMatchObject({ email: 'new.person@example.test', name: 'Nell Person', isAdmin: false });
    const me = await invitee.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('new.person@example.test');
    await app.signIn({ email: 'new.person@example.test' }, NEW_PASSWORD);
  });

  it('stores only a hash of the token', async () => {
    const admin = await adminAgent();
    const created = await admin.post('/api/users/invitations').send({ email: 'hashed@example.test' }).expect(201);
    const { token } = linkIn(await lastMailTo(app.dataSource, 'hashed@example.test'), app.config.publicUrl, '/invitations/');
    const row = await app.dataSource.getRepository(Invitation).findOneByOrFail({ id: created.body.invitation.id });
    expect(row.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(row)).not.toContain(token);
  });

  it('says a used invitation was used (410 invitation_used)', async () => {
    const admin = await adminAgent();
    await admin.post('/api/users/invitations').send({ email: 'once@example.test' }).expect(201);
    const { token } = linkIn(await lastMailTo(app.dataSource, 'once@example.test'), app.config.publicUrl, '/invitations/');
    const invitee = await app.agent();
    await invitee.post(`/api/auth/invitations/${token}/accept`).send({ name: 'Once', password: NEW_PASSWORD }).expect(200);

    const again = await app.agent();
    const lookup = await again.get(`/api/auth/invitations/${token}`).expect(410);
    expect(lookup.body.error.code).toBe('invitation_used');
    const accept = await again.post(`/api/auth/invitations/${token}/accept`).send({ name: 'Twice', password: NEW_PASSWORD }).expect(410);
    expect(accept.body.error.code).toBe('invitation_used');
  });

  it('says an expired invitation expired (410 invitation_expired) and creates nothing', async () => {
    const admin = await adminAgent();
    const created = await admin.post('/api/users/invitations').send({ email: 'late@example.test' }).expect(201);
    const { token } = linkIn(await lastMailTo(app.dataSource, 'late@example.test'), app.config.publicUrl, '/invitations/');
    await app.dataSource.getRepository(Invitation).update({ id: created.body.invitation.id }, { expiresAt: new Date(Date.now() - 1000) });

    const invitee = await app.agent();
    const lookup = await invitee.get(`/api/auth/invitations/${token}`).expect(410);
    expect(lookup.body.error).toMatchObject({ code: 'invitation_expired', message: expect.stringMatching(/expired/) });
    await invitee.post(`/api/auth/invitations/${token}/accept`).send({ name: 'Late', password: NEW_PASSWORD }).expect(410);
    await request(app.url).get('/api/auth/me').expect(401);
    const users = await admin.get('/api/users').expect(200);
    expect(users.body.users.map((u: { email: string }) => u.email)).not.toContain('late@example.test');
  });

  it('answers an unknown token with 404', async () => {
    const agent = await app.agent();
    const response = await agent.get('/api/auth/invitations/not-a-real-token').expect(404);
    expect(response.body.error.code).toBe('invitation_not_found');
  });

  it('checks the new password before using the invitation', async () => {
    const admin = await adminAgent();
    await admin.post('/api/users/invitations').send({ email: 'weak@example.test' }).expect(201);
    const { token } = linkIn(await lastMailTo(app.dataSource, 'weak@example.test'), app.config.publicUrl, '/invitations/');
    const invitee = await app.agent();
    const response = await invitee.post(`/api/auth/invitations/${token}/accept`).send({ name: ' ', password: 'short' }).expect(400);
    expect(response.body.error.details.map((d: { field: string }) => d.field)).toEqual(['name', 'password']);
    await invitee.get(`/api/auth/invitations/${token}`).expect(200);
  });

  it('refuses to invite an address that already has an account', async () => {
    const admin = await adminAgent();
    const existing = await createUser(app.dataSource);
    const response = await admin.post('/api/users/invitations').send({ email: existing.email }).expect(409);
    expect(response.body.error.code).toBe('user_exists');
    expect(await mailsTo(app.dataSource, existing.email)).toEqual([]);
  });

  it('can make the invitee an admin, or a member of a project with a role', async () => {
    const admin = await adminAgent();
    const { project } = await createTeam(app.dataSource);
    await admin
      .post('/api/users/invitations')
      .send({ email: 'joiner@example.test', projectId: project.id, role: 'reviewer', isAdmin: true })
      .expect(201);
    const mail = await lastMailTo(app.dataSource, 'joiner@example.test');
    expect(mail.subject).toBe(`You are invited to ${project.name} on Taulens`);
    const { token } = linkIn(mail, app.config.publicUrl, '/invitations/');
    const invitee = await app.agent();
    await invitee.post(`/api/auth/invitations/${token}/accept`).send({ name: 'Joiner', password: NEW_PASSWORD }).expect(200);
    const me = await invitee.get('/api/auth/me').expect(200);
    expect(me.body.user.isAdmin).toBe(true);
    expect(me.body.memberships).toEqual([{ projectId: project.id, projectName: project.name, role: 'reviewer' }]);
  });

  it('requires projectId and role together', async () => {
    const admin = await adminAgent();
    const response = await admin.post('/api/users/invitations').send({ email: 'half@example.test', role: 'engineer' }).expect(400);
    expect(response.body.error.details).toEqual([{ location: 'body', field: 'role', message: 'give both projectId and role, or neither' }]);
  });

  it('answers a coordinator the same for an address with an account and one without: both are invited and join only by accepting', async () => {
    const team = await createTeam(app.dataSource);
    const coordinator = await app.signIn(team.coordinator);
    const membersUrl = `/api/projects/${team.project.id}/members`;
    const memberEmails = async () => (await coordinator.get(membersUrl).expect(200)).body.members.map((m: { email: string }) => m.email);

    const existing = await coordinator.post(membersUrl).send({ email: team.outsider.email, role: 'engineer' }).expect(201);
    const fresh = await coordinator.post(membersUrl).send({ email: 'site.engineer@example.test', role: 'engineer' }).expect(201);
    for (const [response, email] of [[existing, team.outsider.email], [fresh, 'site.engineer@example.test']] as const) {
      expect(response.body).toEqual({ invitation: { id: expect.any(String), email, expiresAt: expect.any(String) } });
    }
    expect(await memberEmails()).not.toContain(team.outsider.email);
    const already = await coordinator.post(membersUrl).send({ email: team.engineer.email, role: 'reviewer' }).expect(409);
    expect(already.body.error.code).toBe('already_member');

    // The holder of an account joins by signing in; the link cannot create a second account for the address.
    const existingMail = await lastMailTo(app.dataSource, team.outsider.email);
    expect(existingMail.text).toContain(`as engineer in the project “${team.project.name}”`);
    expect(existingMail.text).toContain('sign in');
    const existingLink = linkIn(existingMail, app.config.publicUrl, '/invitations/').token;
    const anonymous = await app.agent();
    expect((await anonymous.get(`/api/auth/invitations/${existingLink}`).expect(200)).body).toEqual({
      email: team.outsider.email,
      name: '',
      expiresAt: existing.body.invitation.expiresAt,
      hasAccount: true,
      project: { name: team.project.name, role: 'engineer' },
    });
    const second = await anonymous.post(`/api/auth/invitations/${existingLink}/accept`).send({ name: 'Twin', password: NEW_PASSWORD }).expect(409);
    expect(second.body.error.code).toBe('account_exists');
    await anonymous.post(`/api/auth/invitations/${existingLink}/join`).expect(401);
    const someoneElse = await app.signIn(team.reviewer);
    const wrongAccount = await someoneElse.post(`/api/auth/invitations/${existingLink}/join`).expect(403);
    expect(wrongAccount.body.error.code).toBe('invitation_for_other_account');
    expect(await memberEmails()).not.toContain(team.outsider.email);

    const invitee = await app.signIn(team.outsider);
    await invitee.post(`/api/auth/invitations/${existingLink}/join`).expect(200, { projectId: team.project.id });
    const members = (await coordinator.get(membersUrl).expect(200)).body.members;
    expect(members.map((m: { email: string; role: string }) => [m.email, m.role])).toContainEqual([team.outsider.email, 'engineer']);
    const again = await invitee.post(`/api/auth/invitations/${existingLink}/join`).expect(410);
    expect(again.body.error.code).toBe('invitation_used');

    const freshMail = await lastMailTo(app.dataSource, 'site.engineer@example.test');
    const freshLink = linkIn(freshMail, app.config.publicUrl, '/invitations/').token;
    expect((await anonymous.get(`/api/auth/invitations/${freshLink}`).expect(200)).body).toMatchObject({ hasAccount: false });
    await anonymous.post(`/api/auth/invitations/${freshLink}/accept`).send({ name: 'Site Engineer', password: NEW_PASSWORD }).expect(200);
    expect(await memberEmails()).toContain('site.engineer@example.test');
  });

  it('keeps nothing when the invitation e-mail cannot be sent', async () => {
    const broken = await startTestApp({ fakeSmtp: false, smtp: { host: '127.0.0.1', port: 1, from: 'Taulens <t@example.test>' } });
    try {
      const agent = await broken.signIn(await createUser(broken.dataSource, { isAdmin: true }));
      const response = await agent.post('/api/users/invitations').send({ email: 'unsent@example.test' }).expect(502);
      expect(response.body.error.code).toBe('mail_failed');
      expect(await broken.dataSource.getRepository(Invitation).count()).toBe(0);
      await request(broken.url).get('/api/dev/outbox').expect(404);
    } finally {
      await broken.close();
    }
  });

  it('lists received mail in the dev outbox to site admins only', async () => {
    const admin = await adminAgent();
    const response = await admin.get('/api/dev/outbox').expect(200);
    expect(response.body.messages.length).toBeGreaterThan(0);
    expect(response.body.messages[0]).toEqual({
      id: expect.any(String),
      from: 'no-reply@taulens.local',
      to: expect.any(String),
      subject: expect.any(String),
      text: expect.any(String),
      html: expect.any(String),
      receivedAt: expect.any(String),
    });
  });

  it('keeps password-reset links out of reach: no outbox for anonymous callers or other users (account takeover)', async () => {
    const victim = await createUser(app.dataSource, { name: 'Vera Victim' });
    const anonymous = await app.agent();
    await anonymous.post('/api/auth/password-reset').send({ email: victim.email }).expect(202);
    await waitForMailsTo(app.dataSource, victim.email);
    const anonymousRead = await anonymous.get('/api/dev/outbox').expect(401);
    expect(JSON.stringify(anonymousRead.body)).not.toContain('reset-password');
    const someoneElse = await app.signIn(await createUser(app.dataSource));
    const otherRead = await someoneElse.get('/api/dev/outbox').expect(403);
    expect(JSON.stringify(otherRead.body)).not.toContain('reset-password');
    expect((await someoneElse.get('/api/auth/me').expect(200)).body.devOutbox).toBe(false);
    expect((await (await adminAgent()).get('/api/auth/me').expect(200)).body.devOutbox).toBe(true);
  });

  it('serves no outbox in production even with the fake SMTP server on', async () => {
    const production = await startTestApp({ nodeEnv: 'production' });
    try {
      const admin = await production.signIn(await createUser(production.dataSource, { isAdmin: true }));
      await admin.get('/api/dev/outbox').expect(404);
      expect((await admin.get('/api/auth/me').expect(200)).body.devOutbox).toBe(false);
    } finally {
      await production.close();
    }
  });
});
