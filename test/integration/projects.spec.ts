import { Project } from '../../server/projects/project.entity';
import { ProjectMember } from '../../server/projects/project-member.entity';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { createProject, createTeam, createUser } from '../fixtures/test-accounts';

describe('projects', () => {
  let app: TestApp;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(() => app.close());

  describe('POST /api/projects', () => {
    it('creates a project with default settings for its standard and makes the creator coordinator', async () => {
      const admin = await createUser(app.dataSource, { isAdmin: true });
      const agent = await app.signIn(admin);
      const response = await agent
        .post('/api/projects')
        .send({ name: ' Wharf Shed ', code: 'WS-1', client: 'Invented Client', standard: 'en1993-1-1' })
        .expect(201);
      expect(response.body.project).toEqual({
        id: expect.stringMatching(/^[0-9a-f-]{36}$/),
        name: 'Wharf Shed',
        code: 'WS-1',
        description: '',
        client: 'Invented Client',
        location: '',
        standard: 'en1993-1-1',
        settings: { defaultGrade: 'S355', gammaM0: 1, gammaM1: 1, eta: 1.2, warningBand: 0.9 },
        archived: false,
        createdAt: expect.any(String),
        updatedAt: expect.any(String),
        role: 'coordinator',
      });
      const member = await app.dataSource.getRepository(ProjectMember).findOneByOrFail({ projectId: response.body.project.id });
      expect(member).toMatchObject({ userId: admin.id, role: 'coordinator' });
    });

    it('refuses a code another project uses, whatever its case, and keeps nothing', async () => {
      const admin = await app.signIn(await createUser(app.dataSource, { isAdmin: true }));
      await admin.post('/api/projects').send({ name: 'First', code: 'DUP-1' }).expect(201);
      const response = await admin.post('/api/projects').send({ name: 'Second', code: 'dup-1' }).expect(409);
      expect(response.body.error.code).toBe('project_code_taken');
      expect(await app.dataSource.getRepository(Project).countBy({ name: 'Second' })).toBe(0);
    });

    it('validates every field at once', async () => {
      const admin = await app.signIn(await createUser(app.dataSource, { isAdmin: true }));
      const response = await admin
        .post('/api/projects')
        .send({ name: '', code: 'has space', standard: 'bs5950', settings: { gammaM0: 0.5 } })
        .expect(400);
      expect(response.body.error.details.map((d: { field: string }) => d.field)).toEqual(['name', 'code', 'standard', 'settings.gammaM0']);
    });
  });

  describe('GET /api/projects', () => {
    it('lists only the caller\u2019s projects with their role; archived ones on request', async () => {
      const team = await createTeam(app.dataSource);
      const archived = await createProject(app.dataSource, [[team.engineer, 'reviewer']], { archived: true });
      await createProject(app.dataSource, [[team.coordinator, 'coordinator']]);
      const engineer = await app.signIn(team.engineer);

      const open = await engineer.get('/api/projects').expect(200);
      expect(open.body.projects.map((p: { id: string; role: string }) => [p.id, p.role])).toEqual([[team.project.id, 'engineer']]);
      const onlyArchived = await engineer.get('/api/projects?archived=true').expect(200);
      expect(onlyArchived.body.projects.map((p: { id: string }) => p.id)).toEqual([archived.id]);
      const all = await engineer.get('/api/projects?archived=all').expect(200);
      expect(all.body.projects).toHaveLength(2);
      await engineer.get('/api/projects?archived=maybe').expect(400);
    });

    it('shows a site admin every project, with role null where not a member', async () => {
      const { project } = await createTeam(app.dataSource);
      const admin = await app.signIn(await createUser(app.dataSource, { isAdmin: true }));
      const response = await admin.get('/api/projects?archived=all').expect(200);
      expect(response.body.projects).toContainEqual(expect.objectContaining({ id: project.id, role: null }));
    });
  });

  describe('GET and PATCH /api/projects/:projectId', () => {
    it('returns the project with the caller\u2019s role and permissions', async () => {
      const team = await createTeam(app.dataSource);
      const reviewer = await app.signIn(team.reviewer);
      const response = await reviewer.get(`/api/projects/${team.project.id}`).expect(200);
      expect(response.body).toEqual({
        project: expect.objectContaining({ id: team.project.id, role: 'reviewer' }),
        role: 'reviewer',
        permissions: ['project.read', 'model.read', 'check.read', 'finding.assign', 'finding.verify', 'finding.accept', 'finding.comment', 'export'],
      });
    });

    it('changes fields and settings; a change of standard family moves the default grade', async () => {
      const team = await createTeam(app.dataSource);
      const coordinator = await app.signIn(team.coordinator);
      const response = await coordinator
        .patch(`/api/projects/${team.project.id}`)
        .send({ location: 'Quay 2', standard: 'aisc360-22-asd', settings: { warningBand: 0.85 } })
        .expect(200);
      expect(response.body.project).toMatchObject({
        location: 'Quay 2',
        standard: 'aisc360-22-asd',
        settings: { defaultGrade: 'A992', warningBand: 0.85, eta: 1.2 },
      });
      const empty = await coordinator.patch(`/api/projects/${team.project.id}`).send({}).expect(400);
      expect(empty.body.error.message).toContain('give at least one field to change');
    });

    it('keeps an archived project read-only until it is unarchived', async () => {
      const team = await createTeam(app.dataSource);
      const coordinator = await app.signIn(team.coordinator);
      await coordinator.post(`/api/projects/${team.project.id}/archive`).expect(200);
      const blocked = await coordinator.patch(`/api/projects/${team.project.id}`).send({ name: 'Renamed' }).expect(409);
      expect(blocked.body.error.code).toBe('project_archived');
      const detail = await coordinator.get(`/api/projects/${team.project.id}`).expect(200);
      expect(detail.body.project.archived).toBe(true);
      expect(detail.body.permissions).toEqual(['project.read', 'project.archive', 'model.read', 'check.read', 'export']);
      await coordinator.post(`/api/projects/${team.project.id}/unarchive`).expect(200);
      await coordinator.patch(`/api/projects/${team.project.id}`).send({ name: 'Renamed' }).expect(200);
    });
  });

  describe('members', () => {
    it('lists members with their roles', async () => {
      const team = await createTeam(app.dataSource);
      const engineer = await app.signIn(team.engineer);
      const response = await engineer.get(`/api/projects/${team.project.id}/members`).expect(200);
      expect(response.body.members).toEqual(
        expect.arrayContaining([
          { userId: team.coordinator.id, email: team.coordinator.email, name: team.coordinator.name, role: 'coordinator', active: true },
          { userId: team.engineer.id, email: team.engineer.email, name: team.engineer.name, role: 'engineer', active: true },
          { userId: team.reviewer.id, email: team.reviewer.email, name: team.reviewer.name, role: 'reviewer', active: true },
        ]),
      );
    });

    it('never leaves a project without a coordinator (409 last_coordinator)', async () => {
      const team = await createTeam(app.dataSource);
      const coordinator = await app.signIn(team.coordinator);
      const url = `/api/projects/${team.project.id}/members`;
      const demote = await coordinator.put(`${url}/${team.coordinator.id}`).send({ role: 'engineer' }).expect(409);
      expect(demote.body.error.code).toBe('last_coordinator');
      const remove = await coordinator.delete(`${url}/${team.coordinator.id}`).expect(409);
      expect(remove.body.error.code).toBe('last_coordinator');

      await coordinator.put(`${url}/${team.engineer.id}`).send({ role: 'coordinator' }).expect(200);
      await coordinator.delete(`${url}/${team.coordinator.id}`).expect(204);
      await coordinator.get(`/api/projects/${team.project.id}`).expect(404);
    });

    it('answers 404 for a user who is not a member, and 400 for a bad role', async () => {
      const team = await createTeam(app.dataSource);
      const coordinator = await app.signIn(team.coordinator);
      const url = `/api/projects/${team.project.id}/members`;
      const missing = await coordinator.put(`${url}/${team.outsider.id}`).send({ role: 'engineer' }).expect(404);
      expect(missing.body.error.code).toBe('member_not_found');
      await coordinator.put(`${url}/${team.engineer.id}`).send({ role: 'owner' }).expect(400);
    });
  });
});
