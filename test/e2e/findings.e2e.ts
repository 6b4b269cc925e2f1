/**
 * The review journey through the demo project's findings, in Debian's chromium against the real server with the
 * demo seed: the findings list, accepting one open finding with a written justification that the BCF and CSV
 * downloads carry, and a second check run by another standard that updates findings instead of adding duplicates.
 */
import { readFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { openArchive } from '../../server/findings/bcf/bcf-archive-reader';
import type { FindingDetailView, FindingPageView, FindingView } from '../../server/findings/finding-api-types';
import { DEPOT, type DemoBrowser, startDemoBrowser } from './demo-browser';

// Screenshots for looking at the rendered pages by eye; nothing compares them.
const SCREENSHOTS = os.tmpdir();

let demo: DemoBrowser;
let page: Page;
/** The finding the reviewer accepts, as it was right after acceptance. */
let accepted: FindingView;

const JUSTIFICATION = 'Checked by hand against the bearing stiffener shown on the fabrication drawings.';

/** The API as the signed-in browser sees it (same cookies), to compare what the pages showed with the stored data. */
async function api<T>(url: string): Promise<T> {
  const response = await page.request.get(`${demo.server.url}${url}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as T;
}

function projectIdOf(url: string): string {
  return /\/projects\/([0-9a-f-]{36})/.exec(url)![1];
}

async function signOut(): Promise<void> {
  await page.getByRole('button', { name: /^Account:/ }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.waitForURL(`${demo.server.url}/sign-in`);
}

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
  await dialog.getByLabel('Justification').fill(JUSTIFICATION);
  await dialog.getByRole('button', { name: 'Accept finding' }).click();
  await page.getByRole('region', { name: 'Justification' }).getByText('Checked by hand against the bearing stiffener').waitFor();
  await page.locator('h1 + p .status', { hasText: 'Accepted' }).waitFor();
  await page.getByText(/accepted it because: Checked by hand/).waitFor();
  const projectId = projectIdOf(page.url());
  const findingId = page.url().split('/').at(-1)!;
  ({ finding: accepted } = await api<FindingDetailView>(`/api/projects/${projectId}/findings/${findingId}`));
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
  // The justification travels with the topic as a comment by the reviewer (the file is read by our own BCF reader).
  const archive = await openArchive(await readFile(file));
  try {
    const markup = (await archive.read(`${accepted.guid}/markup.bcf`)).toString();
    expect(markup).toMatch(/<Author>reviewer@taulens\.test<\/Author>\s*<Comment>Accepted as it is: Checked by hand against the bearing stiffener/);
  } finally {
    archive.close();
  }

  await page.getByRole('button', { name: 'Export' }).click();
  const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('menuitem', { name: /CSV/ }).click()]);
  expect(await readFile(await csv.path(), 'utf8')).toContain(`,${JUSTIFICATION},reviewer@taulens.test,`);
  await signOut();
});

test('a second check run by another standard updates the findings, keeps the accepted one as accepted, and adds no duplicate', async () => {
  await demo.signIn('engineer@taulens.test');
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: 'Checks' }).click();
  await page.getByRole('heading', { level: 1, name: 'Checks' }).waitFor();
  await page.getByRole('table', { name: 'Check runs' }).getByRole('link', { name: 'Finished' }).first().waitFor();

  const before = (await api<FindingPageView>(`/api/projects/${projectIdOf(page.url())}/findings?pageSize=200`)).findings;

  await page.getByRole('button', { name: 'Start a check' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByRole('combobox', { name: 'Standard' }).click();
  await page.getByRole('option', { name: 'AISC 360-22, LRFD' }).click();
  await dialog.getByRole('button', { name: 'Start the check' }).click();
  // The new run's page opens and follows it until it is finished.
  await page.waitForURL(/\/checks\/[0-9a-f-]{36}$/);
  await page.getByRole('heading', { level: 1, name: 'Check run' }).waitFor();
  const projectId = projectIdOf(page.url());
  const runId = page.url().split('/').at(-1)!;
  // The findings follow the finished run; wait until one shows it.
  let findings: FindingView[] = [];
  for (let tries = 0; tries < 300 && !findings.some((finding) => finding.runId === runId); tries++) {
    await page.waitForTimeout(300);
    findings = (await api<FindingPageView>(`/api/projects/${projectId}/findings?pageSize=200`)).findings;
  }
  const followed = findings.filter((finding) => finding.runId === runId);
  expect(followed.length).toBeGreaterThan(0);
  expect(followed.every((finding) => finding.description.includes('AISC 360-22 LRFD check'))).toBe(true);
  const webShear = findings.filter((finding) => finding.kind === 'web-shear-fail' || finding.kind === 'web-shear-warning');
  const members = webShear.map((finding) => finding.memberGlobalIds[0]);
  expect(members.length).toBeGreaterThan(0);
  expect(new Set(members).size).toBe(members.length);
  expect(findings.find((finding) => finding.id === accepted.id)).toMatchObject({
    status: 'accepted',
    justification: JUSTIFICATION,
    runId: accepted.runId,
    utilisation: accepted.utilisation,
    description: accepted.description,
  });

  // The page shows what the run wrote.
  const updated = webShear.find((finding) => finding.runId === runId && before.some((old) => old.id === finding.id))!;
  await page.goto(`${demo.server.url}/projects/${projectId}/findings/${updated.id}`);
  await page.getByText('AISC 360-22 LRFD check of model revision').first().waitFor();
  await page.getByText(/System changed the description/).first().waitFor();
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-finding-after-second-run.png'), fullPage: true });
});
