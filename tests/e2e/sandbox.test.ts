import path from 'node:path';
import type { Page } from 'playwright-core';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, launchBrowser, signInAs, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;

async function signInAndOpenSandbox(page: Page) {
  await signInAs(page, testStack.TEST_APP_URL, 'demo-amara');
  await page.getByTestId('nav-sandbox').click();
  await page.waitForURL(/\/sandbox$/);
  await page.getByTestId('sandbox-screen').waitFor();
}

function sailArea(page: Page): Promise<string> {
  return page.getByTestId('param-sail_area').innerText();
}

/** Opens the sandbox in a fresh Chromium at a viewport, runs the steps, and checks the page threw nothing. */
async function onSandbox(viewport: (typeof viewports)[number], steps: (page: Page) => Promise<void>) {
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    await signInAndOpenSandbox(page);
    await steps(page);
    expect(problems).toEqual([]);
  } finally {
    await browser.close();
  }
}

describeInBrowser('the sizing sandbox in the browser', () => {
  it.each(viewports)(
    'recomputes the sail area from an edited side and undoes it at $width x $height',
    (viewport) =>
      onSandbox(viewport, async (page) => {
        expect(await page.title()).toBe('Sizing sandbox · Trimsheet');
        // Geometry: the template's 40 m square has an area of 1600 m^2.
        expect(await sailArea(page)).toContain('1600 m²');
        await page.screenshot({ path: path.join(artifactsDir, `sandbox-${viewport.name}-start.png`) });

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
        await page.screenshot({ path: path.join(artifactsDir, `sandbox-${viewport.name}.png`) });

        await page.getByTestId('undo').click();
        await page.getByTestId('param-sail_area').getByText('1600 m²').waitFor();
        expect(await side.inputValue()).toBe('40');
        expect(await page.getByTestId('redo').isEnabled()).toBe(true);
        expect(await page.getByTestId('undo').isDisabled()).toBe(true);
      }),
    120_000,
  );

  it.each(viewports)(
    'solves for a target on the template and shows the analyses at $width x $height',
    (viewport) =>
      onSandbox(viewport, async (page) => {
        const shot = (part: string) => page.screenshot({ path: path.join(artifactsDir, `sandbox-analyses-${viewport.name}${part}.png`) });
        await page.getByTestId('analyses').waitFor();
        // McInnes 1999 ch. 2: ideal sail 35.26°; the template's optical model is close.
        expect(await page.getByTestId('best-transverse-cone-angle').innerText()).toMatch(/^35\.\d+°$/);
        await page.getByTestId('analysis-cone-sweep').scrollIntoViewIfNeeded();
        await shot('-sweep');

        await page.getByTestId('size-to-target-target').fill('0.55 mm/s^2');
        await page.getByTestId('size-to-target-run').click();
        await page
          .getByTestId('size-to-target-result')
          .getByText(/sail_side = [\d.]+ m/)
          .waitFor();
        await page.getByTestId('analysis-size-to-target').scrollIntoViewIfNeeded();
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

  it('sends the old address /what-if to the sandbox', async () => {
    const response = await fetch(`${testStack.TEST_APP_URL}/what-if`, { redirect: 'manual' });
    expect(response.status).toBe(301);
    expect(response.headers.get('location')).toBe('/sandbox');
  });
});
