import path from 'node:path';
import type { Page } from 'playwright-core';
import { colors } from '@/components/ui/theme';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, axeViolations, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

type Viewport = (typeof viewports)[number];

/** `#RRGGBB` as the browser reports a computed colour. */
function rgb(hex: string): string {
  const [r, g, b] = [1, 3, 5].map((at) => parseInt(hex.slice(at, at + 2), 16));
  return `rgb(${r}, ${g}, ${b})`;
}

/** Screenshots the page as `face-<part>-<viewport>.png` and checks that all its text reads at 4.5:1 or better (axe). */
async function shootAndCheckContrast(page: Page, viewport: Viewport, part: string): Promise<void> {
  await page.screenshot({ path: path.join(artifactsDir, `face-${part}-${viewport.name}.png`) });
  const violations = await axeViolations(page);
  expect(violations.filter((violation) => violation.id === 'color-contrast' || violation.impact === 'critical')).toEqual([]);
}

describeInBrowser("Trimsheet's face: sign-in, navigation and sheet", () => {
  const browser = useBrowser();

  it.each(viewports)(
    'shows the mark on an ink-blue band, the navigation with its icons and the sheet, all legible, at $width x $height',
    async (viewport) => {
      // axe comes in as a script of its own, which the app's content security policy would refuse.
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height }, bypassCSP: true });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));

      await page.goto(appUrl);
      const band = page.getByTestId('sign-in-band');
      await band.waitFor();
      expect(await band.evaluate((element) => getComputedStyle(element).backgroundColor)).toBe(rgb(colors.ink));
      expect(await band.getByText('Trimsheet').evaluate((element) => getComputedStyle(element).color)).toBe(rgb(colors.ground));
      await page.getByTestId('sign-in-sso').waitFor();
      await shootAndCheckContrast(page, viewport, 'sign-in');

      await signInAs(page, appUrl, 'demo-amara');
      await page.getByTestId('craft-list').getByText('Tern').waitFor();
      const navigation = page.getByTestId(viewport.width >= 900 ? 'nav-side' : 'nav-bottom');
      expect(await navigation.getByRole('tab').allInnerTexts()).toEqual(expect.arrayContaining(['Crafts', 'Sandbox', 'Account']));
      await shootAndCheckContrast(page, viewport, 'navigation');
      await navigation.screenshot({ path: path.join(artifactsDir, `face-navigation-bar-${viewport.name}.png`) });

      await page.getByTestId('craft-list').getByText('Tern').click();
      await page.getByTestId('craft-open-sheet').click();
      await page.getByTestId('sheet-screen').waitFor();
      await page.getByTestId('summary-figure-characteristic_acceleration').waitFor();
      await shootAndCheckContrast(page, viewport, 'sheet');

      expect(problems).toEqual([]);
      await context.close();
    },
    120_000,
  );

  it('serves the favicon drawn from the mark', async () => {
    const page = await browser().newPage();
    await page.goto(appUrl);
    const href = await page.locator('link[rel="icon"]').getAttribute('href');
    expect(href).toBeTruthy();
    const response = await page.request.get(new URL(href ?? '', appUrl).toString());
    expect(response.status()).toBe(200);
    // The tab's icon at the sizes a browser shows it, on the ground and on ink, for a look.
    const icon = `${new URL(href ?? '', appUrl)}`;
    const images = [16, 32].map((size) => `<img src="${icon}" width="${size}" height="${size}" style="margin:8px">`).join('');
    await page.setContent(
      `<div style="display:flex;background:${colors.ground}">${images}</div><div style="display:flex;background:${colors.ink}">${images}</div>`,
    );
    await page.waitForFunction(() => Array.from(document.images).every((image) => image.complete && image.naturalWidth > 0));
    await page.screenshot({ path: path.join(artifactsDir, 'face-favicon.png'), clip: { x: 0, y: 0, width: 120, height: 100 } });
    await page.close();
  });
});
