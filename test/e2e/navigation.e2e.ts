/**
 * Each demo role signs in through the real client, served by the real server, in Debian's chromium,
 * and sees the navigation and actions its role allows on the demo project.
 */
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { DEPOT, type DemoBrowser, startDemoBrowser } from './demo-browser';

const ALL_SECTIONS = ['Overview', 'Models', 'Shear results', 'Checks', '3D view', 'Findings', 'Members'];
// Screenshots for looking at the rendered look by eye; nothing compares them.
const SCREENSHOTS = os.tmpdir();

let demo: DemoBrowser;
let page: Page;
let server: DemoBrowser['server'];

beforeAll(async () => {
  demo = await startDemoBrowser({ timeout_ms: 15_000 });
  ({ page, server } = demo);
});

afterAll(async () => {
  await demo?.close();
});

async function signIn(email: string): Promise<void> {
  await demo.signIn(email);
  await page.getByRole('link', { name: new RegExp(DEPOT) }).waitFor();
}

async function signOut(): Promise<void> {
  await page.getByRole('button', { name: /^Account:/ }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.waitForURL(`${server.url}/sign-in`);
}

/** The words of the links in a navigation landmark (each link's label span, without the icon's ligature name). */
async function linkLabels(navigationName: string): Promise<string[]> {
  const labels = await page.getByRole('navigation', { name: navigationName }).getByRole('link').locator('span').allTextContents();
  return labels.map((label) => label.trim());
}

async function openDepot(): Promise<void> {
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('heading', { level: 1, name: DEPOT }).waitFor();
}

async function openSection(label: string, landmark: string): Promise<void> {
  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: label }).click();
  await page.getByRole('heading', { level: 1, name: landmark }).waitFor();
}

async function count(role: 'button' | 'link', name: string): Promise<number> {
  return page.getByRole(role, { name, exact: true }).count();
}

test('an admin sees user admin, every project and the outbox', async () => {
  await signIn('admin@taulens.test');
  expect(await linkLabels('Main')).toEqual(['Projects', 'Users', 'Outbox']);
  expect(await count('button', 'New project')).toBe(1);
  expect(await page.getByRole('link', { name: /Orrinbeck Canteen Roof Extension/ }).count()).toBe(1);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-projects-admin.png') });

  await openDepot();
  expect(await linkLabels('Project sections')).toEqual(ALL_SECTIONS);
  expect(await count('button', 'Edit details')).toBe(1);

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Users' }).click();
  await page.getByRole('heading', { level: 1, name: 'Users' }).waitFor();
  await page.getByRole('cell', { name: 'reviewer@taulens.test' }).waitFor();
  expect(await count('button', 'Invite user')).toBe(1);
  await signOut();
});

test('a coordinator edits the project, uploads models and manages members, but has no user admin', async () => {
  await signIn('coordinator@taulens.test');
  expect(await linkLabels('Main')).toEqual(['Projects']);
  expect(await count('button', 'New project')).toBe(1);

  await openDepot();
  expect(await linkLabels('Project sections')).toEqual(ALL_SECTIONS);
  expect(await count('button', 'Edit details')).toBe(1);
  expect(await count('button', 'Archive project')).toBe(1);
  await page.getByRole('heading', { name: 'Before you rely on a result' }).waitFor();
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-overview-coordinator.png'), fullPage: true });

  // The national annex of the project: γM0 kept with the project for every later check run.
  await page.getByRole('button', { name: 'Edit check defaults' }).click();
  const defaults = page.getByRole('form', { name: 'Edit check defaults' });
  await defaults.getByLabel('γM0').fill('1.05');
  await defaults.getByRole('button', { name: 'Save check defaults' }).click();
  await page.getByRole('button', { name: 'Edit check defaults' }).waitFor();
  await page.reload();
  await page.getByRole('region', { name: 'Check defaults' }).getByText('1.05').waitFor();

  await openSection('Models', 'Models');
  await page.getByRole('button', { name: 'Choose IFC file' }).waitFor();
  expect(await count('button', 'Upload revision')).toBe(1);

  await openSection('Members', 'Members');
  await page.getByRole('cell', { name: 'engineer@taulens.test' }).waitFor();
  expect(await count('button', 'Add member')).toBe(1);

  await page.goto(`${server.url}/admin/users`);
  await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
  expect(page.url()).toBe(`${server.url}/admin/users`);
  await signOut();
});

test('an engineer runs checks but neither edits the project nor uploads', async () => {
  await signIn('engineer@taulens.test');
  expect(await linkLabels('Main')).toEqual(['Projects']);
  expect(await count('button', 'New project')).toBe(0);

  await openDepot();
  expect(await linkLabels('Project sections')).toEqual(ALL_SECTIONS);
  expect(await count('button', 'Edit details')).toBe(0);
  expect(await count('button', 'Archive project')).toBe(0);
  await page.getByRole('region', { name: 'Check defaults' }).waitFor();
  expect(await count('button', 'Edit check defaults')).toBe(0);

  await openSection('Checks', 'Checks');
  await page.getByRole('button', { name: 'Start a check' }).waitFor();

  await openSection('Models', 'Models');
  await page.getByRole('link', { name: 'Compare revisions' }).waitFor();
  expect(await count('button', 'Choose IFC file')).toBe(0);
  expect(await count('button', 'Upload revision')).toBe(0);

  await openSection('Findings', 'Findings');
  await page.getByRole('table', { name: 'Findings' }).waitFor();
  expect(await page.getByRole('checkbox', { name: 'Select all findings on this page' }).count()).toBe(0);

  await openSection('Members', 'Members');
  await page.getByRole('cell', { name: 'coordinator@taulens.test' }).waitFor();
  expect(await count('button', 'Add member')).toBe(0);
  await signOut();
});

test('a reviewer verifies findings and sees no upload button', async () => {
  await signIn('reviewer@taulens.test');
  expect(await linkLabels('Main')).toEqual(['Projects']);

  await openDepot();
  expect(await linkLabels('Project sections')).toEqual(ALL_SECTIONS);
  expect(await count('button', 'Edit details')).toBe(0);

  await openSection('Findings', 'Findings');
  await page.getByRole('button', { name: 'Export' }).waitFor();
  // Reviewers assign findings (back to an engineer, say): the list offers the selection for bulk assigning.
  await page.getByRole('checkbox', { name: 'Select all findings on this page' }).waitFor();

  await openSection('Models', 'Models');
  await page.getByRole('link', { name: 'Compare revisions' }).waitFor();
  expect(await count('button', 'Choose IFC file')).toBe(0);
  expect(await count('button', 'Upload revision')).toBe(0);

  // On a phone-sized screen the sections move behind a button.
  await page.setViewportSize({ width: 390, height: 800 });
  await page.getByRole('button', { name: 'Open project sections' }).click();
  const sections = page.getByRole('navigation', { name: 'Project sections' });
  await sections.getByRole('link', { name: 'Checks' }).click();
  await page.getByRole('heading', { level: 1, name: 'Checks' }).waitFor();
  // Picking a section closes the sliding list again.
  await sections.waitFor({ state: 'hidden' });
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-narrow-reviewer.png') });
  await page.setViewportSize({ width: 1280, height: 800 });
  await signOut();
});

test('an invitation e-mailed by the admin opens from the outbox and brings the invitee into the project', async () => {
  await signIn('admin@taulens.test');
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Users' }).click();
  await page.getByRole('button', { name: 'Invite user' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('E-mail address').fill('new.detailer@taulens.test');
  await dialog.getByLabel('Add to project (optional)').click();
  await page.getByRole('option', { name: new RegExp(DEPOT) }).click();
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await page.getByText('Invitation sent to new.detailer@taulens.test.').waitFor();

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
  const message = page.getByRole('listitem').filter({ hasText: 'new.detailer@taulens.test' });
  await message.locator('summary').click();
  const link = message.getByRole('link', { name: /\/invitations\// });
  const href = await link.getAttribute('href');
  expect(href).toMatch(/\/invitations\/[^/]+$/);
  await signOut();

  // The link carries the configured public address; the path is what the client routes.
  await page.goto(`${server.url}${new URL(href!).pathname}`);
  await page.getByText('You were invited as').waitFor();
  await page.getByLabel('Your name').fill('Nell Detailer');
  await page.getByLabel('New password').fill('a new long password');
  await page.getByLabel('Repeat the password').fill('a new long password');
  await page.getByRole('button', { name: 'Create account' }).click();
  await page.waitForURL(`${server.url}/projects`);
  await page.getByRole('link', { name: new RegExp(DEPOT) }).waitFor();
  expect(await count('button', 'New project')).toBe(0);
  await signOut();
});
