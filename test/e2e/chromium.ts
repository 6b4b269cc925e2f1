import { BrowserContext, chromium } from 'playwright-core';

/** Debian's chromium package; `.ci/run` installs it when missing. */
export const CHROMIUM_PATH = '/usr/bin/chromium';

// Software WebGL through SwiftShader, stated explicitly so it keeps working if Chrome drops its
// automatic fallback; no sandbox in containers, and no background traffic.
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--use-gl=angle',
  '--use-angle=swiftshader',
  '--enable-unsafe-swiftshader',
];

/** A headless chromium with a fresh profile in `profileDir` (Playwright refuses --user-data-dir in args). */
export function launchChromium(profileDir: string, viewport = { width: 1280, height: 800 }): Promise<BrowserContext> {
  return chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
  });
}
