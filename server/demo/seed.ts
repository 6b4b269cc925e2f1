import type { DesignStandard } from '../projects/design-standard';
import { Project } from '../projects/project.entity';
import { ProjectMember } from '../projects/project-member.entity';
import type { ProjectRole } from '../projects/project-role';
import { defaultSettingsFor } from '../projects/project-settings';
import { hashPassword } from '../users/password';
import { User } from '../users/user.entity';
import { type DemoContext, type DemoDeps, type DemoProjectKey, type DemoStep, type DemoUserKey, demoUser } from './demo-context';
import { demoCheckRunStep } from './demo-check-run';
import { demoFindingsStep } from './demo-findings';
import { demoModelStep } from './demo-model';
import { demoResultsStep } from './demo-results';

/** Shared by every demo account; printed once, on the first seeding. */
export const DEMO_PASSWORD = 'taulens-demo';

export interface DemoSeedResult {
  /** True when the demo accounts were created by this call (so credentials are worth printing). */
  createdAccounts: boolean;
  accounts: { email: string; role: string }[];
  password: string;
}

const DEMO_USERS: { key: DemoUserKey; email: string; name: string; isAdmin: boolean }[] = [
  { key: 'admin', email: 'admin@taulens.test', name: 'Avery Marsh (admin)', isAdmin: true },
  { key: 'coordinator', email: 'coordinator@taulens.test', name: 'Corin Ellwood', isAdmin: false },
  { key: 'engineer', email: 'engineer@taulens.test', name: 'Esme Varga', isAdmin: false },
  { key: 'reviewer', email: 'reviewer@taulens.test', name: 'Rafe Lindqvist', isAdmin: false },
];

// Invented scenarios: the names, client and places are made up for the demo.
const DEMO_PROJECTS: {
  key: DemoProjectKey;
  name: string;
  code: string;
  client: string;
  location: string;
  description: string;
  standard: DesignStandard;
  members: [DemoUserKey, ProjectRole][];
}[] = [
  {
    key: 'depot',
    name: 'Brindlecote Riverside Depot and Offices',
    code: 'BRD-17',
    client: 'Aldercrest Freight Cooperative',
    location: 'Plot 7, Brindlecote Riverside Estate',
    description:
      'Four-storey steel-framed office block over a single-storey depot hall: composite floors on rolled I-beams, ' +
      'welded transfer girders over the loading bays. Invented demo scenario.',
    standard: 'en1993-1-1',
    members: [
      ['coordinator', 'coordinator'],
      ['engineer', 'engineer'],
      ['reviewer', 'reviewer'],
    ],
  },
  {
    key: 'canteen',
    name: 'Orrinbeck Canteen Roof Extension',
    code: 'ORB-3',
    client: 'Orrinbeck Mills Trust',
    location: 'Unit 3 yard, Orrinbeck',
    description: 'Single-bay roof extension on wide-flange beams and columns. Invented demo scenario.',
    standard: 'aisc360-22-lrfd',
    members: [
      ['coordinator', 'coordinator'],
      ['reviewer', 'reviewer'],
    ],
  },
];

const demoUsersStep: DemoStep = {
  name: 'demo users',
  async run(ctx) {
    const users = ctx.dataSource.getRepository(User);
    let passwordHash: string | undefined;
    for (const demo of DEMO_USERS) {
      let user = await users.findOneBy({ email: demo.email });
      if (!user) {
        passwordHash ??= await hashPassword(DEMO_PASSWORD);
        user = await users.save(users.create({ email: demo.email, name: demo.name, isAdmin: demo.isAdmin, passwordHash }));
      }
      ctx.users.set(demo.key, user);
    }
  },
};

const demoProjectsStep: DemoStep = {
  name: 'demo projects',
  async run(ctx) {
    const projects = ctx.dataSource.getRepository(Project);
    const members = ctx.dataSource.getRepository(ProjectMember);
    for (const { key, members: roles, ...fields } of DEMO_PROJECTS) {
      const project =
        (await projects.findOneBy({ code: fields.code })) ??
        (await projects.save(projects.create({ ...fields, settings: defaultSettingsFor(fields.standard), createdById: null })));
      for (const [userKey, role] of roles) {
        const user = demoUser(ctx, userKey);
        if (!(await members.existsBy({ projectId: project.id, userId: user.id }))) {
          await members.insert({ projectId: project.id, userId: user.id, role });
        }
      }
      ctx.projects.set(key, project);
    }
  },
};

/** The steps in order; a later feature appends its own (demo model, shear results, a check run…). */
export const DEMO_STEPS: DemoStep[] = [demoUsersStep, demoProjectsStep, demoModelStep, demoResultsStep, demoCheckRunStep, demoFindingsStep];

export async function seedDemo(deps: DemoDeps, steps: readonly DemoStep[] = DEMO_STEPS): Promise<DemoSeedResult> {
  const createdAccounts = !(await deps.dataSource.getRepository(User).existsBy({ email: DEMO_USERS[0].email }));
  const ctx: DemoContext = { ...deps, users: new Map(), projects: new Map() };
  for (const step of steps) {
    deps.logger.debug({ step: step.name }, 'demo seed step');
    await step.run(ctx);
  }
  return {
    createdAccounts,
    accounts: DEMO_USERS.map((u) => ({ email: u.email, role: u.key })),
    password: DEMO_PASSWORD,
  };
}
