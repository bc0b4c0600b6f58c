import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Page } from 'playwright-core';
import { artifactsDir, launchBrowser, signInAs } from '@/tests/e2e/browser';
import { quantile } from './statistics';

/** Where `expo export` leaves the web app, and its JavaScript within. */
export const webDist = path.resolve(__dirname, '..', '..', 'dist');
const webScripts = path.join(webDist, '_expo', 'static', 'js');

/** Sum of the gzip sizes (default level, as a server would send them) of every .js file the web build emits; undefined without a build. */
export function webJavaScriptGzipBytes(): number | undefined {
  if (!fs.existsSync(webScripts)) return undefined;
  return fs
    .readdirSync(webScripts, { recursive: true, encoding: 'utf8' })
    .filter((file) => file.endsWith('.js'))
    .reduce((total, file) => total + zlib.gzipSync(fs.readFileSync(path.join(webScripts, file))).length, 0);
}

/** The figure the keystroke benchmark watches, and the input it types into (both testIDs of the Sheet screen). */
const WATCHED_FIGURE = 'summary-figure-characteristic_acceleration';
const TYPED_INPUT = 'sheet-input-sail_side';
const SAMPLES = 40;
const WARM_UP = 5;

declare global {
  interface Window {
    /** Milliseconds from each timed keydown to the watched figure's text changing, filled in by the page. */
    keystrokeSamples?: number[];
  }
}

/**
 * Starts timing in the page: performance.now() at every keydown (captured before the app sees it), and a
 * MutationObserver on the watched figure that records the delay when its text changes.
 */
function watchFigure(page: Page): Promise<void> {
  return page.getByTestId(WATCHED_FIGURE).evaluate((figure) => {
    const samples: number[] = [];
    window.keystrokeSamples = samples;
    let keyAt: number | undefined;
    let shown = figure.textContent;
    document.addEventListener('keydown', () => (keyAt = performance.now()), { capture: true });
    new MutationObserver(() => {
      if (figure.textContent === shown) return;
      shown = figure.textContent;
      if (keyAt !== undefined) samples.push(performance.now() - keyAt);
      keyAt = undefined;
    }).observe(figure, { subtree: true, childList: true, characterData: true });
  });
}

async function sampleCount(page: Page): Promise<number> {
  return page.evaluate(() => window.keystrokeSamples?.length ?? 0);
}

/** Presses a key and waits until the watched figure has changed; false when it did not change within the wait. */
async function timedKey(page: Page, key: string, waitMs: number): Promise<boolean> {
  const before = await sampleCount(page);
  await page.keyboard.press(key);
  try {
    await page.waitForFunction((count) => (window.keystrokeSamples?.length ?? 0) > count, before, { timeout: waitMs });
    return true;
  } catch {
    return false;
  }
}

/** How the screen took the edits: recomputed as typed, or only when Enter committed the input. */
export type KeystrokeMode = 'as typed' | 'on Enter';

/**
 * Keystroke to updated summary on a craft's Sheet screen in headless Chromium at 1280x800: signs `subject` in
 * through the browser, opens the sheet, then types into the sail side's input, replacing its last digit, and
 * measures in the page from each keydown to the characteristic acceleration's text changing. When the screen
 * recomputes only on Enter, the timed key is Enter after the digits are typed. Returns the median in ms.
 */
export async function benchKeystrokeToSummary(
  appUrl: string,
  subject: string,
  craftId: string,
): Promise<{ median: number; mode: KeystrokeMode }> {
  const browser = await launchBrowser();
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
  try {
    await signInAs(page, appUrl, subject);
    await page.goto(`${appUrl}/crafts/${craftId}/sheet`);
    await page.getByTestId(WATCHED_FIGURE).waitFor({ timeout: 60_000 });
    const input = page.getByTestId(TYPED_INPUT);
    await input.click();
    await watchFigure(page);

    let mode: KeystrokeMode = 'as typed';
    for (let edit = 0; edit < SAMPLES + WARM_UP; edit += 1) {
      // The side's last digit becomes 1..9 in turn (the template's 40 m gives 41..49 m): each edit changes the figure.
      const digit = String(1 + (edit % 9));
      if (mode === 'as typed') {
        await input.evaluate((field) => {
          if (field instanceof HTMLInputElement) field.setSelectionRange(field.value.length - 1, field.value.length);
        });
        if (await timedKey(page, digit, 1000)) continue;
        mode = 'on Enter';
      }
      await input.fill(`4${digit}`);
      if (!(await timedKey(page, 'Enter', 5000))) throw new Error(`${WATCHED_FIGURE} did not change after typing 4${digit} and Enter`);
    }
    const samples = await page.evaluate(() => window.keystrokeSamples ?? []);
    return { median: quantile(samples.slice(-SAMPLES), 0.5), mode };
  } catch (error) {
    const screenshot = path.join(artifactsDir, 'bench-keystroke-failure.png');
    await page.screenshot({ path: screenshot });
    throw new Error(
      `${error instanceof Error ? error.message.split('\n')[0] : String(error)} (screenshot: ${path.relative(process.cwd(), screenshot)})`,
    );
  } finally {
    await browser.close();
  }
}
