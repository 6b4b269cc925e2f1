/**
 * The reviewer's journey through the demo project's findings, in Debian's chromium against the real server with the
 * demo seed: the findings list, accepting one open finding with a written justification, and a BCF download.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/demo/seed';
import { RunningServer, startServer } from '../../server/main';
import { launchChromium } from './chromium';

const DEPOT = 'Brindlecote Riverside Depot and Offices';
// Screenshots for looking at the rendered pages by eye; nothing compares them.
const SCREENSHOTS = os.tmpdir();

let server: RunningServer;
let context: BrowserContext;
let page: Page;
let dataDir: string;
let profileDir: string;

beforeAll(async () => {
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-data-'));
  profileDir = await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-profile-'));
  server = await startServer({
    port: 0,
    dataDir,
    fakeSmtp: true,
    fakeSmtpPort: 0,
    seedDemo: true,
    logLevel: 'error',
    webRoot: path.resolve(__dirname, '../../dist/web/browser'),
  });
  context = await launchChromium(profileDir);
  page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(20_000);
});

afterAll(async () => {
  await context?.close();
  await server?.close();
  await rm(profileDir, { recursive: true, force: true });
  await rm(dataDir, { recursive: true, force: true });
});

test('a reviewer accepts a finding with a justification and exports the findings as BCF', async () => {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill('reviewer@taulens.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${server.url}/projects`);
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Findings' }).click();
  await page.getByRole('heading', { level: 1, name: 'Findings' }).waitFor();

  // Open findings only, through the page address the list keeps its filters in.
  await page.goto(`${page.url()}?status=open`);
  const table = page.getByRole('table', { name: 'Findings' });
  await table.locator('a.finding-link').first().click();
  await page.waitForURL(/\/findings\/[0-9a-f-]{36}$/);

  await page.getByRole('button', { name: 'Accept as is…' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Justification').fill('Checked by hand against the bearing stiffener shown on the fabrication drawings.');
  await dialog.getByRole('button', { name: 'Accept finding' }).click();
  await page.getByRole('region', { name: 'Justification' }).getByText('Checked by hand against the bearing stiffener').waitFor();
  await page.locator('h1 + p .status', { hasText: 'Accepted' }).waitFor();
  await page.getByText(/accepted it because: Checked by hand/).waitFor();
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-finding-accepted.png'), fullPage: true });

  await page.getByRole('link', { name: 'All findings' }).click();
  await page.getByRole('heading', { level: 1, name: 'Findings' }).waitFor();
  await table.locator('a.finding-link').first().waitFor();
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-findings-list.png'), fullPage: true });
  await page.getByRole('button', { name: 'Export' }).click();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('menuitem', { name: 'BCF 2.1' }).click()]);
  expect(download.suggestedFilename()).toBe('BRD-17-findings-bcf-2.1.bcf');
  const file = await download.path();
  expect(file).toBeTruthy();
});
