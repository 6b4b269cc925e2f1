import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/demo/seed';
import { type RunningServer, startServer } from '../../server/main';
import { launchChromium } from './chromium';

export const DEPOT = 'Brindlecote Riverside Depot and Offices';

/** The real server with the demo seed and the built client, and a fresh chromium profile driving it. */
export interface DemoBrowser {
  server: RunningServer;
  context: BrowserContext;
  page: Page;
  /** Signs in through the sign-in form and waits for the projects list. */
  signIn(email: string): Promise<void>;
  close(): Promise<void>;
}

export async function startDemoBrowser(options: { timeout_ms?: number } = {}): Promise<DemoBrowser> {
  const dataDir = await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-data-'));
  const profileDir = await mkdtemp(path.join(os.tmpdir(), 'taulens-e2e-profile-'));
  const server = await startServer({
    port: 0,
    dataDir,
    fakeSmtp: true,
    fakeSmtpPort: 0,
    seedDemo: true,
    logLevel: 'error',
    webRoot: path.resolve(__dirname, '../../dist/web/browser'),
  });
  const context = await launchChromium(profileDir);
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(options.timeout_ms ?? 20_000);
  return {
    server,
    context,
    page,
    async signIn(email) {
      await page.goto(`${server.url}/sign-in`);
      await page.getByLabel('E-mail address').fill(email);
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL(`${server.url}/projects`);
    },
    async close() {
      await context.close();
      await server.close();
      await rm(profileDir, { recursive: true, force: true });
      await rm(dataDir, { recursive: true, force: true });
    },
  };
}
