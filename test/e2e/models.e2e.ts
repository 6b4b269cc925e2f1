/**
 * The coordinator's model journey in Debian's chromium against the real server with the demo seed: the depot's
 * revisions, an upload followed to "Ready", the members read from it, what a revision skipped and why, and the
 * compare of the demo revisions C and D. The sample file is buildingSMART's (CC BY 4.0, see
 * test/fixtures/ifc/buildingsmart/SOURCE.md).
 */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/demo/seed';
import { RunningServer, startServer } from '../../server/main';
import { buildingSmartSample } from '../fixtures/ifc/buildingsmart-samples';
import { launchChromium } from './chromium';

const DEPOT = 'Brindlecote Riverside Depot and Offices';
const SAMPLE = buildingSmartSample('beam-varying-cardinal-points.ifc');

let server: RunningServer;
let context: BrowserContext;
let page: Page;
const dirs: string[] = [];

beforeAll(async () => {
  const [dataDir, profileDir] = [await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-data-')), await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-profile-'))];
  dirs.push(dataDir, profileDir);
  server = await startServer({ port: 0, dataDir, fakeSmtp: true, fakeSmtpPort: 0, seedDemo: true, logLevel: 'error', webRoot: path.resolve(__dirname, '../../dist/web/browser') });
  context = await launchChromium(profileDir);
  page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(30_000);
});

afterAll(async () => {
  await context?.close();
  await server?.close();
  for (const dir of dirs) await rm(dir, { recursive: true, force: true });
});

async function openDepotModels(email: string): Promise<void> {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${server.url}/projects`);
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Models' }).click();
  await page.getByRole('heading', { level: 1, name: 'Models' }).waitFor();
}

test('a coordinator uploads a revision, waits until it is read and looks through its members', async () => {
  await openDepotModels('coordinator@taulens.test');
  const revisions = page.getByRole('table', { name: 'Model revisions' });
  await revisions.getByRole('link', { name: '400 members' }).first().waitFor();

  await page.getByLabel('IFC file').setInputFiles(SAMPLE);
  await page.getByLabel('Note for this revision').fill('Sample beams for the cardinal points');
  await page.getByRole('button', { name: 'Upload revision' }).click();
  // SOURCE.md: four IfcBeamStandardCase, all IPE200.
  await revisions.getByRole('link', { name: '4 members' }).click();
  await page.getByRole('heading', { level: 1, name: 'Revision 3' }).waitFor();
  const members = page.getByRole('table', { name: 'Members of this revision' });
  await members.getByRole('button', { name: 'TopMid' }).waitFor();
  expect(await members.locator('tbody tr.mat-mdc-row').count()).toBe(4);
  expect(await members.locator('tbody').textContent()).toContain('IPE200');

  await members.getByRole('button', { name: 'BotLeft' }).click();
  await page.getByText('S355JR → grade S355').waitFor();
});

test('a reviewer sees what was skipped and how revision D differs from C, and cannot upload', async () => {
  await context.clearCookies();
  await openDepotModels('reviewer@taulens.test');
  expect(await page.getByRole('button', { name: 'Upload revision' }).count()).toBe(0);

  await page.getByRole('table', { name: 'Model revisions' }).getByRole('link', { name: '400 members' }).last().click();
  await page.getByRole('heading', { level: 1, name: 'Revision 1' }).waitFor();
  // The demo's braces are CHS 168.3x8 and L100x100x10: read with their family and dimensions, like the beams.
  await page.getByRole('combobox', { name: 'Family' }).click();
  await page.getByRole('option', { name: 'circular hollow section' }).click();
  const members = page.getByRole('table', { name: 'Members of this revision' });
  await members.getByText('BR269').waitFor();
  expect(await members.locator('tbody').textContent()).not.toContain('IPE');
  await members.locator('button.member-link').first().click();
  const detail = page.locator('tl-member-detail');
  await detail.getByRole('row', { name: 'Outside diameter 168.3 mm' }).waitFor();
  await detail.getByRole('row', { name: 'Wall thickness 8 mm' }).waitFor();

  await page.getByRole('link', { name: '← All revisions' }).click();
  await page.getByRole('link', { name: 'Compare revisions' }).click();
  await page.getByRole('heading', { level: 1, name: 'Compare revisions' }).waitFor();
  // The newest two are the sample uploaded above and D; choose C and D.
  await page.getByRole('combobox', { name: 'Earlier revision' }).click();
  await page.getByRole('option', { name: 'Revision 1 · brindlecote-frame-rev-C.ifc' }).click();
  await page.getByRole('combobox', { name: 'Later revision' }).click();
  await page.getByRole('option', { name: 'Revision 2 · brindlecote-frame-rev-D.ifc' }).click();
  const differences = page.getByRole('table', { name: 'Changed, added and removed members' });
  await differences.getByText('Section IPE 300 → IPE 270').first().waitFor();
  await differences.getByText(/PG600x250 \(d 600, tw 10,.*→ PG600x250 \(d 600, tw 8,/).first().waitFor();
});
