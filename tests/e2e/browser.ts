import fs from 'node:fs';
import path from 'node:path';
import type * as Axe from 'axe-core';
import { chromium, type Browser, type Page } from 'playwright-core';

/** Where browser tests leave their screenshots (git-ignored). */
export const artifactsDir = path.resolve(__dirname, '..', 'artifacts');

/**
 * Debian's Chromium, headless, with the flags it needs on a machine without outside network. Playwright
 * adds --no-sandbox (needed as root) and a fresh profile folder itself.
 */
export async function launchBrowser(): Promise<Browser> {
  fs.mkdirSync(artifactsDir, { recursive: true });
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}

export const viewports = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

/**
 * Signs a demo person in through the company SSO button and the sign-in fake's page (`subject` as the fake
 * names them, e.g. 'demo-kenji') and waits for the craft list the app lands on.
 */
export async function signInAs(page: Page, appUrl: string, subject: string): Promise<void> {
  await page.goto(appUrl);
  await page.getByTestId('sign-in-sso').click();
  await page.getByTestId(`person-${subject}`).click();
  await page.waitForURL(/\/crafts$/);
}

/** One Chromium for the tests of a describe block: launched before them, closed after them. Returns its getter. */
export function useBrowser(): () => Browser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });
  return () => {
    if (browser === undefined) throw new Error('the browser is launched in beforeAll: use it inside a test');
    return browser;
  };
}

/** A violation as axe reports it, cut to what a failure message needs. */
export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: string[];
}

/** Runs axe-core on the page as it is and returns its violations (the page's context needs `bypassCSP`: axe comes in as a script of its own). */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  await page.addScriptTag({ path: require.resolve('axe-core') });
  return page.evaluate(async () => {
    const { axe } = window as unknown as { axe: typeof Axe };
    const result = await axe.run(document);
    return result.violations.map((violation) => ({
      id: violation.id,
      impact: violation.impact ?? null,
      help: violation.help,
      nodes: violation.nodes
        .slice(0, 5)
        .map((node) => `${node.html.slice(0, 200)} (${(node.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 200)})`),
    }));
  });
}
