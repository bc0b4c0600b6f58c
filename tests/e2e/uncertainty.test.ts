import path from 'node:path';
import type { Page } from 'playwright-core';
import { craftListSchema } from '@/shared/schemas/crafts';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

async function ternSheetUrl(page: Page): Promise<string> {
  const { crafts } = craftListSchema.parse(await (await page.request.get(`${appUrl}/api/crafts`)).json());
  const tern = crafts.find((craft) => craft.name === 'Tern');
  if (tern === undefined) throw new Error('Tern is missing from GET /api/crafts');
  return `${appUrl}/crafts/${tern.id}/sheet`;
}

async function addInput(page: Page, label: string): Promise<void> {
  await page.getByTestId('uncertainty-add').getByRole('radio', { name: label }).click();
}

describeInBrowser('the uncertainty study in the browser', () => {
  const browser = useBrowser();

  it.each(viewports)(
    'runs a study in the Web Worker under the content security policy and shows its percentiles at $width x $height',
    async (viewport) => {
      // No bypassCSP: the worker must start under the app's own policy.
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      const problems: string[] = [];
      const workers: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));
      page.on('console', (message) => {
        // The engine's own probe for generated code is refused by design; a refused worker or script is a failure.
        if (message.type() === 'error' && /Refused to (create a worker|load the script)|worker-src/i.test(message.text()))
          problems.push(message.text());
      });
      page.on('worker', (worker) => workers.push(new URL(worker.url()).pathname));
      const shot = (part: string) => path.join(artifactsDir, `uncertainty-${viewport.name}-${part}.png`);
      try {
        await signInAs(page, appUrl, 'demo-amara');
        await page.goto(await ternSheetUrl(page));
        await page.getByTestId('sheet-views').getByRole('radio', { name: 'Uncertainty' }).click();
        const panel = page.getByTestId('uncertainty-panel');
        await panel.waitFor();
        await addInput(page, 'Sail side length');
        await addInput(page, 'Film thickness');
        await page.getByTestId('uncertainty-kind-film_thickness').getByRole('radio', { name: 'Triangular' }).click();
        await page.getByTestId('uncertainty-input-film_thickness').scrollIntoViewIfNeeded();
        await page.screenshot({ path: shot('inputs') });

        // A long study shows its progress and stops when cancelled.
        await page.getByTestId('uncertainty-samples').fill('100000');
        await page.getByTestId('uncertainty-run').click();
        await page.getByTestId('uncertainty-progress').getByRole('progressbar').waitFor();
        await page.getByTestId('uncertainty-cancel').click();
        await page.getByTestId('uncertainty-cancelled').waitFor();

        await page.getByTestId('uncertainty-samples').fill('20000');
        await page.getByTestId('uncertainty-target-acceleration').fill('0.45 mm/s^2');
        await page.getByTestId('uncertainty-run').click();
        const result = page.getByTestId('uncertainty-result');
        await result.waitFor({ timeout: 60_000 });
        expect(workers).toContain('/uncertainty-worker.js');

        const acceleration = await page.getByTestId('uncertainty-percentiles-characteristic_acceleration').innerText();
        expect(acceleration).toMatch(/P5\s+0\.\d+ mm\/s²/);
        expect(acceleration).toMatch(/P50\s+0\.\d+ mm\/s²/);
        expect(acceleration).toMatch(/P95\s+0\.\d+ mm\/s²/);
        expect(await page.getByTestId('uncertainty-requirement-request-0').innerText()).toMatch(/0\.45 mm\/s²[\s\S]*%/);
        expect(await page.getByTestId('uncertainty-requirement-margin').innerText()).toMatch(/System margin at least the required/);
        await page.getByTestId('uncertainty-requirements').scrollIntoViewIfNeeded();
        await page.screenshot({ path: shot('requirements') });
        await page.getByTestId('uncertainty-percentiles').scrollIntoViewIfNeeded();
        await page.screenshot({ path: shot('percentiles') });
        await page.getByTestId('uncertainty-histogram').scrollIntoViewIfNeeded();
        await page.screenshot({ path: shot('histogram') });
      } catch (error) {
        await page.screenshot({ path: shot('failure') });
        throw error;
      }
      expect(problems).toEqual([]);
      await context.close();
    },
    180_000,
  );
});
