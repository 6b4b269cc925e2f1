import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { Finding } from '../../server/findings/finding.entity';
import { NotificationPreference } from '../../server/notifications/notification-preference.entity';
import type { ApiAgent } from '../fixtures/api-agent';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { mailsTo } from '../fixtures/test-outbox';
import { findingsUrl, raiseFinding } from './findings-fixtures';

describe('finding e-mails', () => {
  let app: TestApp;
  let team: TestTeam;
  let coordinator: ApiAgent;
  let engineer: ApiAgent;
  let reviewer: ApiAgent;

  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  beforeEach(async () => {
    team = await createTeam(app.dataSource);
    [coordinator, engineer, reviewer] = await Promise.all([app.signIn(team.coordinator), app.signIn(team.engineer), app.signIn(team.reviewer)]);
  });

  const findingLink = (findingId: string) => `http://taulens.test/projects/${team.project.id}/findings/${findingId}`;
  const subjects = async (email: string) => (await mailsTo(app.dataSource, email)).map((mail) => mail.subject);

  describe('GET/PUT /api/notifications/preferences', () => {
    it('starts with every e-mail on and keeps what the user chooses', async () => {
      expect((await engineer.get('/api/notifications/preferences').expect(200)).body).toEqual({ assigned: true, statusChanged: true, mentioned: true });
      const saved = await engineer.put('/api/notifications/preferences').send({ assigned: false, statusChanged: true, mentioned: false }).expect(200);
      expect(saved.body).toEqual({ assigned: false, statusChanged: true, mentioned: false });
      expect(await app.dataSource.getRepository(NotificationPreference).findOneByOrFail({ userId: team.engineer.id })).toMatchObject({ assigned: false, mentioned: false });
      expect((await coordinator.get('/api/notifications/preferences').expect(200)).body.assigned).toBe(true);
    });

    it('returns 400 for a partial or unknown setting and 401 when signed out', async () => {
      await engineer.put('/api/notifications/preferences').send({ assigned: false }).expect(400);
      await engineer.put('/api/notifications/preferences').send({ assigned: false, statusChanged: true, mentioned: true, digest: true }).expect(400);
      await (await app.agent()).get('/api/notifications/preferences').expect(401);
    });
  });

  it('tells the assignee, with a link to the finding page', async () => {
    const id = await raiseFinding(coordinator, team.project.id, { title: 'Web plate too thin at grid C' });
    await coordinator.patch(findingsUrl(team.project.id, `/${id}`)).send({ assigneeId: team.engineer.id }).expect(200);
    const [mail] = await mailsTo(app.dataSource, team.engineer.email);
    expect(mail.subject).toBe(`[${team.project.code}] F-0001 assigned to you: Web plate too thin at grid C`);
    expect(mail.text).toContain(`${team.coordinator.name} assigned the finding F-0001`);
    expect(mail.text).toContain(`Open the finding: ${findingLink(id)}`);
    expect(mail.html).toContain(`href="${findingLink(id)}"`);
    expect(await subjects(team.coordinator.email)).toEqual([]);
  });

  it('sends one e-mail for a bulk assignment, linking to the assignee’s list', async () => {
    const ids = [await raiseFinding(coordinator, team.project.id), await raiseFinding(coordinator, team.project.id)];
    await reviewer.post(findingsUrl(team.project.id, '/bulk-assign')).send({ findingIds: ids, assigneeId: team.engineer.id }).expect(200);
    const mails = await mailsTo(app.dataSource, team.engineer.email);
    expect(mails.map((mail) => mail.subject)).toEqual([`[${team.project.code}] 2 findings assigned to you`]);
    expect(mails[0].text).toContain(`http://taulens.test/projects/${team.project.id}/findings?assignee=me`);
  });

  it('tells the assignee and the creator about a status change, but not the person who made it', async () => {
    const id = await raiseFinding(coordinator, team.project.id, { title: 'Cope at B-7' });
    await coordinator.patch(findingsUrl(team.project.id, `/${id}`)).send({ assigneeId: team.engineer.id }).expect(200);
    await engineer.post(findingsUrl(team.project.id, `/${id}/transitions`)).send({ to: 'resolved' }).expect(200);
    expect(await subjects(team.coordinator.email)).toEqual([`[${team.project.code}] F-0001 is now Resolved: Cope at B-7`]);
    expect(await subjects(team.engineer.email)).toEqual([`[${team.project.code}] F-0001 assigned to you: Cope at B-7`]);

    const justification = 'End plate and stiffener shown on S-410 carry the shear.';
    await reviewer.post(findingsUrl(team.project.id, `/${id}/transitions`)).send({ to: 'accepted', justification }).expect(200);
    const [, accepted] = await mailsTo(app.dataSource, team.engineer.email);
    expect(accepted.subject).toBe(`[${team.project.code}] F-0001 is now Accepted: Cope at B-7`);
    expect(accepted.text).toContain(`${team.reviewer.name} moved the finding F-0001 “Cope at B-7”`);
    expect(accepted.text).toContain(`Justification: ${justification}`);
    expect((await subjects(team.coordinator.email)).length).toBe(2);
    expect(await subjects(team.reviewer.email)).toEqual([]);
  });

  it('tells the members a comment mentions, by address or by name', async () => {
    const id = await raiseFinding(coordinator, team.project.id, { title: 'Splice at level 3' });
    await reviewer
      .post(findingsUrl(team.project.id, `/${id}/comments`))
      .send({ text: `@${team.engineer.email.toUpperCase()} and @${team.coordinator.name}: which detail applies?` })
      .expect(201);
    const [toEngineer] = await mailsTo(app.dataSource, team.engineer.email);
    expect(toEngineer.subject).toBe(`[${team.project.code}] ${team.reviewer.name} mentioned you on F-0001: Splice at level 3`);
    expect(toEngineer.text).toContain('which detail applies?');
    expect(toEngineer.text).toContain(findingLink(id));
    expect(await subjects(team.coordinator.email)).toHaveLength(1);
    expect(await subjects(team.outsider.email)).toEqual([]);
  });

  it('sends nothing of a kind the user switched off', async () => {
    await engineer.put('/api/notifications/preferences').send({ assigned: false, statusChanged: false, mentioned: false }).expect(200);
    const id = await raiseFinding(coordinator, team.project.id);
    await coordinator.patch(findingsUrl(team.project.id, `/${id}`)).send({ assigneeId: team.engineer.id }).expect(200);
    await reviewer.post(findingsUrl(team.project.id, `/${id}/comments`)).send({ text: `@${team.engineer.email} see above` }).expect(201);
    await reviewer.post(findingsUrl(team.project.id, `/${id}/transitions`)).send({ to: 'accepted', justification: 'Covered by test load report TL-3.' }).expect(200);
    expect(await subjects(team.engineer.email)).toEqual([]);
    expect(await subjects(team.coordinator.email)).toHaveLength(1);
  });
});

describe('finding e-mails when the SMTP server is down', () => {
  let app: TestApp;

  beforeAll(async () => {
    // A port that was free a moment ago: nothing listens there, so every e-mail fails to connect.
    const probe = createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const { port } = probe.address() as AddressInfo;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
    app = await startTestApp({ fakeSmtp: false, smtp: { host: '127.0.0.1', port, from: 'Taulens <no-reply@taulens.test>' } });
  });
  afterAll(() => app.close());

  it('keeps the change and answers normally', async () => {
    const team = await createTeam(app.dataSource);
    const coordinator = await app.signIn(team.coordinator);
    const id = await raiseFinding(coordinator, team.project.id);
    const response = await coordinator.patch(findingsUrl(team.project.id, `/${id}`)).send({ assigneeId: team.engineer.id }).expect(200);
    expect(response.body.finding.assignee.id).toBe(team.engineer.id);
    expect((await app.dataSource.getRepository(Finding).findOneByOrFail({ id })).assigneeId).toBe(team.engineer.id);
  });
});
