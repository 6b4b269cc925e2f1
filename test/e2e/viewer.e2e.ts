/// <reference lib="dom" />
/**
 * The engineer's 3D view of the demo project, in Debian's chromium (software WebGL) against the real server with the
 * demo seed: the model draws, a failing and a passing member show their legend colours on screen, a click opens
 * the clicked member's results, and "Only failing" takes the passing members off the screen.
 *
 * Which members fail or pass comes from the check run's own results API, not from this test.
 */
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { VIEWER_TEST_HOOK_KEY, type ViewerTestHook } from '../../src/app/viewer/viewer-probe';
import { DEPOT, type DemoBrowser, startDemoBrowser } from './demo-browser';

// Screenshots for looking at the view by eye; nothing compares them.
const SCREENSHOTS = os.tmpdir();
/** Flat shading draws the legend colour itself; a channel may still differ by rounding in software WebGL. */
const COLOUR_TOLERANCE = 3;
/** Background with the see-through pale grey context possibly in front of it. */
const BACKGROUND_TOLERANCE = 24;
/** Software WebGL on a busy two-core machine can take a while to draw a frame. */
const VIEW_TIMEOUT_MS = 60_000;
/** How `waitForFunction` asks the view: every quarter second, for as long as a frame may take. */
const POLL_VIEW = { polling: 250, timeout: VIEW_TIMEOUT_MS };

type Rgb = [number, number, number];

interface RunRow {
  globalId: string;
  tag: string | null;
  utilisation: number | null;
  status: string;
}

let demo: DemoBrowser;
let page: Page;

beforeAll(async () => {
  demo = await startDemoBrowser({ timeout_ms: VIEW_TIMEOUT_MS });
  // The production build installs the viewer's test hook only when asked to.
  await demo.context.addInitScript(([key]) => localStorage.setItem(key, 'on'), [VIEWER_TEST_HOOK_KEY]);
  page = demo.page;
});

afterAll(async () => {
  await demo?.close();
});

/** GET through the signed-in page, so the session cookie goes with it. */
function apiGet<T>(url: string): Promise<T> {
  return page.evaluate(async (path) => {
    const response = await fetch(path, { credentials: 'same-origin' });
    if (!response.ok) throw new Error(`GET ${path} answered ${response.status}`);
    return (await response.json()) as T;
  }, url);
}

/** The seeded run computes in the background after start-up; wait until it has finished. */
async function finishedDemoRun(projectId: string): Promise<string> {
  for (let tries = 0; tries < 240; tries++) {
    const { runs } = await apiGet<{ runs: { id: string; status: string }[] }>(`/api/projects/${projectId}/checks`);
    const done = runs.find((run) => run.status === 'done');
    if (done) return done.id;
    await page.waitForTimeout(500);
  }
  throw new Error('The demo check run did not finish.');
}

async function runRows(projectId: string, runId: string, status: string): Promise<RunRow[]> {
  const url = `/api/projects/${projectId}/checks/${runId}/members?status=${status}&pageSize=50`;
  return (await apiGet<{ rows: RunRow[] }>(url)).rows;
}

function closeTo(actual: Rgb, expected: Rgb, tolerance: number): boolean {
  return actual.every((channel, i) => Math.abs(channel - expected[i]) <= tolerance);
}

/** The swatch colour the legend shows for a key, as sRGB bytes. */
async function legendColour(key: string): Promise<Rgb> {
  const css = await page.locator(`tl-viewer-legend li[data-legend-key="${key}"] .swatch`).evaluate((swatch) => getComputedStyle(swatch).backgroundColor);
  const match = /rgb\((\d+), (\d+), (\d+)\)/.exec(css);
  if (match === null) throw new Error(`The legend swatch ${key} has no rgb colour: ${css}`);
  return [Number(match[1]), Number(match[2]), Number(match[3])];
}

/**
 * Frames one member and reads its colour unshaded, polling until it matches (colours arrive after the model);
 * fails naming the colour last seen.
 */
async function expectMemberColour(globalId: string, expected: Rgb): Promise<void> {
  const matches = ([id, want, tolerance]: readonly [string, Rgb, number]) => {
    const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer;
    hook?.fitTo([id]);
    const rgb = hook?.memberColour(id)?.slice(0, 3) ?? null;
    (globalThis as { lastMemberColour?: number[] | null }).lastMemberColour = rgb;
    return rgb !== null && rgb.every((channel, i) => Math.abs(channel - want[i]) <= tolerance);
  };
  try {
    await page.waitForFunction(matches, [globalId, expected, COLOUR_TOLERANCE] as const, POLL_VIEW);
  } catch (error) {
    const seen = await page.evaluate(() => (globalThis as { lastMemberColour?: number[] | null }).lastMemberColour ?? null);
    const shown = seen ? `rgb(${seen.join(', ')})` : 'nowhere';
    throw new Error(`Member ${globalId} should show rgb(${expected.join(', ')}) but shows ${shown}. ${String(error)}`);
  }
}

/** Frames one member and returns a canvas point where it is drawn. */
async function framedPoint(globalId: string): Promise<{ x_px: number; y_px: number }> {
  const point = await page.evaluate((id) => {
    const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer!;
    hook.fitTo([id]);
    return hook.screenPositionOf(id);
  }, globalId);
  if (point === null) throw new Error(`Member ${globalId} is not visible after framing it.`);
  return point;
}

/** The bin of a utilisation ratio as the legend keys it: 0 for [0, 10 %), …, 9 for [90 %, 100 %]. */
function binKey(utilisation: number): string {
  return `bin-${Math.min(9, Math.floor(utilisation * 10 + 1e-9))}`;
}

test('the engineer sees the demo model coloured by utilisation, opens a failing member and filters to failing ones', async () => {
  await demo.signIn('engineer@taulens.test');
  await page.getByRole('link', { name: new RegExp(DEPOT) }).click();
  await page.getByRole('heading', { level: 1, name: DEPOT }).waitFor();
  const projectId = /\/projects\/([0-9a-f-]{36})/.exec(page.url())![1];
  const runId = await finishedDemoRun(projectId);

  // Members from the run's own results: one over capacity, one passing away from a bin edge.
  const failing = (await runRows(projectId, runId, 'fail')).find((row) => row.utilisation !== null && row.utilisation > 1);
  const passing = (await runRows(projectId, runId, 'pass')).find((row) => {
    const u = row.utilisation;
    return u !== null && u > 0 && Math.abs(u * 10 - Math.round(u * 10)) > 0.05;
  });
  if (!failing || !passing) throw new Error('The demo run should have a member over capacity and a passing one.');

  await page.getByRole('navigation', { name: 'Project sections' }).getByRole('link', { name: '3D view' }).click();
  await page.getByRole('heading', { level: 1, name: '3D view' }).waitFor();
  await page.getByRole('heading', { name: 'Utilisation' }).waitFor();

  // The model renders: members are in the view, drawn in a handful of calls, and the canvas is not blank.
  await page.waitForFunction(
    () => {
      const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer;
      return hook !== undefined && hook.stats().members > 0 && hook.stats().drawCalls > 0;
    },
    undefined,
    POLL_VIEW,
  );
  const canvas = page.locator('tl-viewer-canvas canvas');
  const box = (await canvas.boundingBox())!;
  const background = await page.locator('tl-viewer-canvas').evaluate((host) => getComputedStyle(host).backgroundColor);
  const drawn = await page.evaluate(
    ([width, height]) => {
      const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer!;
      const corner = hook.readPixel(2, 2).slice(0, 3).join(',');
      let differing = 0;
      for (let x = 0.1; x < 1; x += 0.1) {
        for (let y = 0.1; y < 1; y += 0.1) if (hook.readPixel(x * width, y * height).slice(0, 3).join(',') !== corner) differing++;
      }
      return differing;
    },
    [box.width, box.height] as const,
  );
  expect(drawn).toBeGreaterThan(3);
  expect(background).toMatch(/^rgb/);

  // The failing member shows the legend's over-capacity colour, the passing one its bin's colour.
  const over = await legendColour('over');
  await expectMemberColour(failing.globalId, over);
  const bin = await legendColour(binKey(passing.utilisation!));
  await expectMemberColour(passing.globalId, bin);
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-3d-view.png') });

  // A click on the failing member opens its results beside the model.
  const failingPoint = await framedPoint(failing.globalId);
  await page.mouse.click(box.x + failingPoint.x_px, box.y + failingPoint.y_px);
  const panel = page.getByRole('complementary', { name: failing.tag ?? failing.globalId });
  await panel.waitFor();
  await panel.getByText(failing.globalId).waitFor();
  await panel.locator('.status', { hasText: 'Fail' }).waitFor();
  await panel.getByRole('link', { name: 'Calculation sheet' }).waitFor();
  expect(await panel.getByRole('link', { name: 'Calculation sheet' }).getAttribute('href')).toBe(
    `/projects/${projectId}/checks/${runId}/members/${failing.globalId}`,
  );

  // "Only failing": where the passing member was drawn, the background (or a failing member) shows now.
  const passingPoint = await framedPoint(passing.globalId);
  await page.getByRole('switch', { name: 'Only failing' }).click();
  const after = await page.waitForFunction(
    ([id, point]) => {
      const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer!;
      if (hook.screenPositionOf(id) !== null) return null;
      return { pixel: hook.readPixel(point.x_px, point.y_px).slice(0, 3), picked: hook.pick(point.x_px, point.y_px) };
    },
    [passing.globalId, passingPoint] as const,
    POLL_VIEW,
  );
  const { pixel, picked } = (await after.jsonValue()) as { pixel: Rgb; picked: string | null };
  expect(picked).not.toBe(passing.globalId);
  if (picked === null) {
    const [r, g, b] = /rgb\((\d+), (\d+), (\d+)\)/.exec(background)!.slice(1).map(Number);
    expect(closeTo(pixel, [r, g, b], BACKGROUND_TOLERANCE)).toBe(true);
  }
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-3d-view-only-failing.png') });

  // The cautions stay on screen with the results (the frame's footer, under every page).
  await page.locator('footer.frame-footer tl-cautions-notice').waitFor();
  expect(await page.locator('footer.frame-footer tl-cautions-notice').isVisible()).toBe(true);
});

test('links open the view on a member or a finding, and a finding raised from the selection keeps the view and its picture', async () => {
  // The first test signed in and the run has finished; the project is the one open in the page.
  const projectId = /\/projects\/([0-9a-f-]{36})/.exec(page.url())![1];
  const runId = await finishedDemoRun(projectId);
  const [failing] = await runRows(projectId, runId, 'fail');

  // "Show in 3D" from the results table: the member is selected, framed and its results open.
  await page.goto(`${demo.server.url}/projects/${projectId}/3d-view?run=${runId}&member=${encodeURIComponent(failing.globalId)}`);
  const panel = page.getByRole('complementary', { name: failing.tag ?? failing.globalId });
  await panel.getByText(failing.globalId).waitFor();
  await page.waitForFunction(
    (id) => {
      const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer;
      return hook !== undefined && hook.getViewpoint().selectedGlobalIds.join() === id && hook.screenPositionOf(id) !== null;
    },
    failing.globalId,
    POLL_VIEW,
  );

  // A finding raised from the selection, with a title and a note.
  await page.getByRole('button', { name: 'Create finding from selection' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Title').fill('Web of the end bay girder to review on site');
  await dialog.getByLabel('Note').fill('Raised from the 3D view in a browser test.');
  await dialog.getByRole('button', { name: 'Create finding' }).click();
  const created = page.getByRole('status').filter({ hasText: /Finding F-\d{4} created\./ });
  await created.waitFor();
  const findingPath = await created.getByRole('link').getAttribute('href');
  const findingId = findingPath!.split('/').pop()!;
  type SavedCamera = { viewPoint_m: [number, number, number] };
  const { finding } = await apiGet<{ finding: { memberGlobalIds: string[]; hasSnapshot: boolean; kind: string; viewpoint: { camera?: SavedCamera; selectedGlobalIds: string[] } | null } }>(
    `/api/projects/${projectId}/findings/${findingId}`,
  );
  expect(finding.kind).toBe('manual');
  expect(finding.memberGlobalIds).toEqual([failing.globalId]);
  expect(finding.hasSnapshot).toBe(true);
  expect(finding.viewpoint?.camera).toBeDefined();
  expect(finding.viewpoint?.selectedGlobalIds).toEqual([failing.globalId]);
  const snapshot = await page.evaluate(async (url) => {
    const response = await fetch(url, { credentials: 'same-origin' });
    const bytes = new Uint8Array(await response.arrayBuffer());
    return { type: response.headers.get('content-type'), signature: [...bytes.slice(0, 8)] };
  }, `/api/projects/${projectId}/findings/${findingId}/snapshot.png`);
  expect(snapshot.type).toMatch(/^image\/png/);
  // The PNG file signature (ISO/IEC 15948 §5.2).
  expect(snapshot.signature).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

  // Opened from a finding: its view comes back, camera where it was and its member selected.
  await page.goto(`${demo.server.url}/projects/${projectId}/3d-view?viewpoint=${findingId}`);
  await page.getByRole('complementary', { name: failing.tag ?? failing.globalId }).waitFor();
  await page.waitForFunction(
    ([id, saved]) => {
      const hook = (globalThis as { __taulensViewer?: ViewerTestHook }).__taulensViewer;
      const now = hook?.getViewpoint();
      if (!now?.camera || now.selectedGlobalIds.join() !== id) return false;
      return now.camera.viewPoint_m.every((coordinate, i) => Math.abs(coordinate - saved[i]) < 1e-3);
    },
    [failing.globalId, finding.viewpoint!.camera!.viewPoint_m] as const,
    POLL_VIEW,
  );
  await page.screenshot({ path: path.join(SCREENSHOTS, 'taulens-3d-view-finding.png') });
});
