import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import { createTestApp, type TestApp } from './test-app';

export const ARTIFACTS_DIR = path.join(PROJECT_ROOT, 'artifacts', 'e2e');

export interface BrowserSession {
  t: TestApp;
  baseUrl: string;
  context: BrowserContext;
  page: Page;
  /** Script errors and Content-Security-Policy refusals seen so far; tests expect none. */
  problems: string[];
  close(): Promise<void>;
}

/** Desktop and phone sizes the screens are checked at. */
export const DESKTOP = { width: 1366, height: 900 } as const;
export const PHONE = { width: 390, height: 844 } as const;

/** The real app on a port of its own, driven by Debian's Chromium with a fresh profile. */
export async function openBrowser(
  viewport: { width: number; height: number } = DESKTOP,
): Promise<BrowserSession> {
  const t = await createTestApp();
  const server: Server = await new Promise((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'thalpos-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    headless: true,
    viewport,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const problems: string[] = [];
  page.on('console', (msg) => {
    // Failed requests (e.g. the anonymous 401 from /api/v1/me) are expected; refusals are not.
    if (msg.type() === 'error' && /Content Security Policy|Refused to/i.test(msg.text())) {
      problems.push(msg.text());
    }
  });
  page.on('pageerror', (err) => problems.push(err.message));
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  return {
    t,
    baseUrl,
    context,
    page,
    problems,
    async close() {
      await context.close();
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await t.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export const screenshot = (page: Page, name: string) =>
  page.screenshot({ path: path.join(ARTIFACTS_DIR, `${name}.png`), fullPage: true });

const OVERFLOW = 'document.documentElement.scrollWidth - window.innerWidth';

/**
 * How far the page sticks out sideways beyond the viewport (0 when it fits). Layout settles
 * after a resize (charts redraw from their resize observers), so it first waits a while for the
 * page to fit within `allowed`, and then reports what it measures for the test to assert.
 */
export async function sidewaysOverflow(page: Page, allowed = 0): Promise<number> {
  await page
    .waitForFunction(`${OVERFLOW} <= ${allowed}`, undefined, { timeout: 30_000 })
    .catch(() => undefined);
  return page.evaluate<number>(OVERFLOW);
}

/**
 * Signs in as a person does: the Sign in link, the local provider's chooser page (on its own
 * origin), then back on the home page once the top bar shows the user's name. The chooser's entry
 * is matched on login and name together, as `demo-editor` is a prefix of `demo-editor-2`.
 */
export async function signInFromHome(s: BrowserSession, login: string, name: string) {
  const { page, baseUrl } = s;
  await page.goto(baseUrl);
  await page
    .getByRole('link', { name: /sign in/i })
    .first()
    .click();
  await page.waitForURL(/\/login\/oauth\/authorize/);
  await page.getByRole('link', { name: `${login} — ${name}` }).click();
  await page.waitForURL(`${baseUrl}/`);
  await page.getByText(name).waitFor();
}

/** Signs in through the app's sign-in route straight to `returnTo`, skipping the chooser page. */
export async function signInTo(s: BrowserSession, login: string, returnTo: string) {
  await s.page.goto(
    `${s.baseUrl}/auth/github?login=${login}&returnTo=${encodeURIComponent(returnTo)}`,
  );
  await s.page.waitForURL(`${s.baseUrl}${returnTo}`);
}
