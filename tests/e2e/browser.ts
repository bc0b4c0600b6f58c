import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';

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
