/**
 * The reviewer's journey through the demo project's findings, in Debian's chromium against the real server with the
 * demo seed: the findings list, accepting one open finding with a written justification, and a BCF download.
 */
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEPOT, type DemoBrowser, startDemoBrowser } from './demo-browser';

// Screenshots for looking at the rendered pages by eye; nothing compares them.
const SCREENSHOTS = os.tmpdir();

let demo: DemoBrowser;
let page: Page;

beforeAll(async () => {
  demo = await startDemoBrowser();
  ({ page } = demo);
});

afterAll(async () => {
  await demo?.close();
});

test('a reviewer accepts a finding with a justification and exports the findings as BCF', async () => {
  await demo.signIn('reviewer@taulens.test');
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
