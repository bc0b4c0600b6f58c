import path from 'node:path';
import type { Page } from 'playwright-core';
import { craftListSchema } from '@/shared/schemas/crafts';
import { templates } from '@/shared/templates';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

/** The id of the craft of this name, as its creator lists them. */
async function craftIdOf(page: Page, name: string): Promise<string> {
  const { crafts } = craftListSchema.parse(await (await page.request.get(`${appUrl}/api/crafts`)).json());
  const craft = crafts.find((candidate) => candidate.name === name);
  if (craft === undefined) throw new Error(`no craft named ${name}`);
  return craft.id;
}

/** Creates a craft from the template through the craft list's chooser, as an organisation admin does. */
async function createFromTemplate(page: Page, templateId: string, name: string): Promise<string> {
  await page.goto(`${appUrl}/crafts`);
  await page.getByTestId('new-craft').click();
  await page.getByTestId(`craft-origin-template-${templateId}`).click();
  await page.getByTestId('new-craft-name').fill(name);
  await page.getByTestId('new-craft-submit').click();
  await page.getByTestId('new-craft-card').waitFor({ state: 'detached' });
  return craftIdOf(page, name);
}

describeInBrowser('crafts from every template in the browser', () => {
  const browser = useBrowser();

  it.each(viewports)(
    'an admin creates a craft from each template and sees its headline figures and a plot at $width x $height',
    async (viewport) => {
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));
      try {
        await signInAs(page, appUrl, 'demo-ines');
        for (const template of templates) {
          const shot = (part: string) =>
            page.screenshot({ path: path.join(artifactsDir, `templates-${viewport.name}-${template.id}-${part}.png`) });
          const craftId = await createFromTemplate(page, template.id, `${template.name} ${viewport.name} ${Date.now()}`);
          await page.goto(`${appUrl}/crafts/${craftId}/sheet`);
          const summary = page.getByTestId('sheet-summary');
          await summary.waitFor();
          for (const role of template.roles.headline) {
            const figure = summary.getByTestId(`summary-figure-${role}`);
            await figure.waitFor({ state: 'attached' });
            // A figure with a value reads a number, never the dash of a missing one.
            expect({ template: template.id, role, text: await figure.innerText() }).toEqual({
              template: template.id,
              role,
              text: expect.not.stringContaining('—'),
            });
          }
          await shot('summary');
          await page.getByTestId('sheet-views').getByText('Plots', { exact: true }).click();
          const plots = page.getByTestId('sheet-plots');
          await plots.locator('svg').first().waitFor();
          await plots
            .getByText(/^Preliminary sizing estimates/)
            .first()
            .waitFor();
          await shot('plots');
        }
        expect(problems).toEqual([]);
      } catch (error) {
        await page.screenshot({ path: path.join(artifactsDir, `templates-${viewport.name}-failure.png`) });
        throw error;
      } finally {
        await context.close();
      }
    },
    300_000,
  );
});
