import path from 'node:path';
import type { Page } from 'playwright-core';
import { z } from 'zod';
import { craftListSchema } from '@/shared/schemas/crafts';
import { revisionDetailSchema } from '@/shared/schemas/revisions';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

/** Tern's id and its working draft's, as the chief engineer lists them. */
async function ternOf(page: Page): Promise<{ craftId: string; draftId: string }> {
  const { crafts } = craftListSchema.parse(await (await page.request.get(`${appUrl}/api/crafts`)).json());
  const tern = crafts.find((craft) => craft.name === 'Tern');
  if (!tern?.draftRevisionId) throw new Error('Tern or its working draft is missing');
  return { craftId: tern.id, draftId: tern.draftRevisionId };
}

/** Changes a row of the draft through the API (as another tab of the same person would). */
async function setValue(page: Page, craftId: string, draftId: string, key: string, change: (value: number) => number): Promise<number> {
  const url = `${appUrl}/api/crafts/${craftId}/revisions/${draftId}`;
  const detail = revisionDetailSchema.parse(await (await page.request.get(url)).json());
  const row = detail.sheet.parameters.find((parameter) => parameter.key === key);
  if (row?.value === undefined) throw new Error(`the draft has no input ${key}`);
  const { csrfToken } = z.object({ csrfToken: z.string() }).parse(await (await page.request.get(`${appUrl}/api/auth/session`)).json());
  const response = await page.request.patch(`${url}/parameters/${key}`, {
    headers: { 'x-csrf-token': csrfToken },
    data: { version: row.version, value: change(row.value) },
  });
  if (!response.ok()) throw new Error(`setting ${key}: ${response.status()} ${await response.text()}`);
  return row.value;
}

describeInBrowser('revisions in the browser', () => {
  const browser = useBrowser();

  it.each(viewports)(
    'a chief engineer locks a baseline, compares the draft with it and sees what moved an output at $width x $height',
    async (viewport) => {
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));
      const shot = (part: string) => page.screenshot({ path: path.join(artifactsDir, `revisions-${viewport.name}-${part}.png`) });
      try {
        await signInAs(page, appUrl, 'demo-tomas');
        const { craftId, draftId } = await ternOf(page);
        const label = `Review ${viewport.name} ${Date.now()}`;

        await page.goto(`${appUrl}/crafts/${craftId}`);
        await page.getByTestId('craft-open-revisions').click();
        await page.getByTestId('revision-lock').click();
        await page.getByTestId('lock-label').fill(label);
        await shot('lock');
        await page.getByTestId('lock-submit').click();
        const baselines = page.getByTestId('revisions-baselines');
        await baselines.getByText(label).waitFor();

        // The draft moves on: a larger sail.
        const before = await setValue(page, craftId, draftId, 'sail_side', (side) => side + 5);
        try {
          const baseline = baselines.locator('[data-testid^="revision-"]').filter({ hasText: label }).first();
          await baseline.locator('[data-testid^="revision-compare-"]').click();
          await page.getByTestId('compare-screen').waitFor();
          await page.getByTestId('compare-row-sail_side').waitFor();
          await page.getByTestId('compare-pick-sail_area').click();
          const moved = page.getByTestId('compare-moved');
          await moved.waitFor();
          // All of the sail area's change comes from the sail side.
          await moved.getByTestId('compare-share-sail_side').waitFor();
          await moved.scrollIntoViewIfNeeded();
          await shot('what-moved');
        } finally {
          await setValue(page, craftId, draftId, 'sail_side', () => before);
        }
      } catch (error) {
        await shot('failure');
        throw error;
      }
      expect(problems).toEqual([]);
      await context.close();
    },
    120_000,
  );
});
