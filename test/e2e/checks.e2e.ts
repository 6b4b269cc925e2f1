/**
 * The engineer's journey through a finished check run of the demo project, in Debian's chromium against the real
 * server with the demo seed: the runs list, the results table filtered to failing members, and one member's
 * calculation sheet with its drawings and the cautions.
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
  demo = await startDemoBrowser({ timeout_ms: 20_000 });
  ({ page } = demo);
});

afterAll(async () => {
  await demo?.close();
});

async function signIn(email: string): Promise<void> {
  await demo.signIn(email);
}

async function eventually(condition: () => Promise<boolean>, what: string): Promise<void> {
  for (let tries = 0; tries < 100; tries++) {
    if (await condition()) return;
    await page.waitForTimeout(100);
  }
  throw new Error(`Timed out waiting until ${what}.`);
}

test('an engineer opens the finished demo run, filters to failing members and reads a calculation sheet', async () => {
  await signIn('engineer@taulens.test');
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('heading', { level: 1, name: DEPOT }).waitFor();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Checks' }).click();
  await page.getByRole('heading', { level: 1, name: 'Checks' }).waitFor();

  // The seeded run may still be computing when the page opens; the list follows it until it is finished.
  const runs = page.getByRole('table', { name: 'Check runs' });
  await runs.getByRole('link', { name: 'Finished' }).first().click();
  await page.getByRole('heading', { level: 1, name: 'Check run' }).waitFor();
  await page.getByRole('heading', { name: 'Before you rely on a result' }).waitFor();

  const members = page.getByRole('table', { name: 'Members of this check run' });
  await members.locator('tbody tr.mat-mdc-row').first().waitFor();
  await page.getByRole('button', { name: /^Fail: / }).click();
  await page.waitForURL(/status=fail/);
  // Every row left is a failing member (zoneless rendering lands a moment after the click, so poll).
  await eventually(async () => {
    const statuses = (await members.locator('tbody .status').allTextContents()).map((status) => status.trim());
    return statuses.length > 0 && statuses.every((status) => status === 'Fail');
  }, 'the table shows only failing members');
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-check-run-failing.png'), fullPage: true });

  await members.locator('a.member-link').first().click();
  await page.waitForURL(/\/members\//);
  await page.getByRole('heading', { level: 1, name: /^Calculation sheet · / }).waitFor();
  await page.getByRole('img', { name: /drawn to scale 1:/ }).waitFor();
  await page.getByRole('img', { name: /Shear stress over the depth; τmax = / }).waitFor();
  expect(await page.locator('svg.section-drawing .dimension').count()).toBeGreaterThanOrEqual(4);
  expect(await page.locator('svg.stress-plot .jump').count()).toBe(2);
  await page.getByRole('heading', { name: 'Clause by clause' }).waitFor();
  await page.getByRole('heading', { name: 'Before you rely on a result' }).waitFor();
  expect(await page.getByText('Follow the governing local building code, its national annex and the engineer of record.').count()).toBeGreaterThan(0);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-calculation-sheet.png'), fullPage: true });
});
