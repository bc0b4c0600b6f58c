import path from 'node:path';
import type { Page } from 'playwright-core';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, launchBrowser, signInAs, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;

async function signInAndOpenWhatIf(page: Page) {
  await signInAs(page, testStack.TEST_APP_URL, 'demo-amara');
  await page.getByTestId('nav-what-if').click();
  await page.waitForURL(/\/what-if$/);
  await page.getByTestId('what-if-screen').waitFor();
}

function sailArea(page: Page): Promise<string> {
  return page.getByTestId('param-sail_area').innerText();
}

/** Opens the sandbox in a fresh Chromium at a viewport, runs the steps, and checks the page threw nothing. */
async function onWhatIf(viewport: (typeof viewports)[number], steps: (page: Page) => Promise<void>) {
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    await signInAndOpenWhatIf(page);
    await steps(page);
    expect(problems).toEqual([]);
  } finally {
    await browser.close();
  }
}

describeInBrowser('what-if sizing in the browser', () => {
  it.each(viewports)(
    'recomputes the sail area from an edited side and undoes it at $width x $height',
    (viewport) =>
      onWhatIf(viewport, async (page) => {
        expect(await page.title()).toBe('Sizing sandbox · Trimsheet');
        // Geometry: the template's 40 m square has an area of 1600 m^2.
        expect(await sailArea(page)).toContain('1600 m²');
        await page.screenshot({ path: path.join(artifactsDir, `what-if-${viewport.name}-start.png`) });

        const side = page.getByTestId('param-input-sail_side');
        await side.fill('60 m');
        await side.press('Enter');
        // Geometry: a 60 m square has an area of 3600 m^2.
        await page.getByTestId('param-sail_area').getByText('3600 m²').waitFor();
        expect(await side.inputValue()).toBe('60');

        await side.fill('25 kg');
        await side.press('Enter');
        await page
          .getByTestId('param-error-sail_side')
          .getByText(/expects m but "25 kg" is kg/)
          .waitFor();
        expect(await sailArea(page)).toContain('3600 m²');
        await page.getByTestId('param-sail_side').evaluate((row) => row.scrollIntoView({ block: 'center' }));
        await page.screenshot({ path: path.join(artifactsDir, `what-if-${viewport.name}.png`) });

        await page.getByTestId('undo').click();
        await page.getByTestId('param-sail_area').getByText('1600 m²').waitFor();
        expect(await side.inputValue()).toBe('40');
        expect(await page.getByTestId('redo').isEnabled()).toBe(true);
        expect(await page.getByTestId('undo').isDisabled()).toBe(true);
      }),
    120_000,
  );

  it.each(viewports)(
    'runs a solving for a target on the template and shows the analyses at $width x $height',
    (viewport) =>
      onWhatIf(viewport, async (page) => {
        const shot = (part: string) => page.screenshot({ path: path.join(artifactsDir, `what-if-analyses-${viewport.name}${part}.png`) });
        await page.getByTestId('analyses').waitFor();
        // McInnes 1999 ch. 2: ideal sail 35.26°; the template's optical model is close.
        expect(await page.getByTestId('best-transverse-cone-angle').innerText()).toMatch(/^35\.\d+°$/);
        await page.getByTestId('analysis-cone-sweep').scrollIntoViewIfNeeded();
        await shot('-sweep');

        await page.getByTestId('goal-seek-target').fill('0.55 mm/s^2');
        await page.getByTestId('goal-seek-run').click();
        await page
          .getByTestId('goal-seek-result')
          .getByText(/sail_side = [\d.]+ m/)
          .waitFor();
        await page.getByTestId('analysis-goal-seek').scrollIntoViewIfNeeded();
        await shot('');

        await page.getByTestId('analysis-temperature').evaluate((card) => card.scrollIntoView({ block: 'start' }));
        await shot('-temperature');
        await page.getByTestId('analysis-spiral').scrollIntoViewIfNeeded();
        expect(await page.getByTestId('spiral-transfer-time').innerText()).toMatch(/days$/);
        expect(await page.getByTestId('drag-crossover-altitude').innerText()).toMatch(/km$/);
        expect(await page.getByTestId('closest-safe-distance').innerText()).toMatch(/AU$/);
        await shot('-checks');
      }),
    120_000,
  );
});
