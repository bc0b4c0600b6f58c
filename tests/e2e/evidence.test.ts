import path from 'node:path';
import type { Page } from 'playwright-core';
import { craftListSchema } from '@/shared/schemas/crafts';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

/** Below this width the Sheet screen is a list of rows that open an edit sheet. */
const PHONE_BELOW = 900;
/** A mass row of Kenji's Booms subsystem. */
const ROW = 'boom_mass';
/** A PDF of about 300 kB: its header, then a comment that pads it out. */
const DATASHEET = Buffer.concat([
  Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\n%'),
  Buffer.alloc(300_000, 0x41),
  Buffer.from('\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n'),
]);

jest.setTimeout(90_000);

async function ternId(page: Page): Promise<string> {
  const { crafts } = craftListSchema.parse(await (await page.request.get(`${appUrl}/api/crafts`)).json());
  const tern = crafts.find((craft) => craft.name === 'Tern');
  if (!tern) throw new Error('Tern is missing from GET /api/crafts');
  return tern.id;
}

describeInBrowser('evidence on a row in the browser', () => {
  const browser = useBrowser();

  it.each(viewports)(
    'a subsystem owner attaches a datasheet to his row, sees it listed and downloads it at $width x $height',
    async (viewport) => {
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));
      const shot = (part: string) => page.screenshot({ path: path.join(artifactsDir, `evidence-${viewport.name}-${part}.png`) });
      const name = `Boom datasheet ${viewport.name}.pdf`;
      try {
        await signInAs(page, appUrl, 'demo-kenji');
        const craftId = await ternId(page);
        await page.goto(`${appUrl}/crafts/${craftId}/sheet`);
        await page.getByTestId('sheet-screen').waitFor();
        if (viewport.width < PHONE_BELOW) await page.getByTestId(`sheet-row-${ROW}`).getByRole('button').first().click();
        else await page.getByTestId(`sheet-open-${ROW}`).click();
        const evidence = page.getByTestId('row-evidence');
        await evidence.scrollIntoViewIfNeeded();
        await evidence
          .getByText(/No datasheet, weighing report or test report attached yet|Datasheet ·/)
          .first()
          .waitFor();

        // Measured is not offered before a weighing report is attached, and the editor says why.
        expect(await page.getByTestId('row-maturity-measured-note').innerText()).toMatch(/weighing report/);

        await evidence.getByRole('radio', { name: 'Datasheet' }).click();
        // A slow uplink (about 2 s for the file), so that the progress bar is seen part way.
        const network = await context.newCDPSession(page);
        await network.send('Network.enable');
        await network.send('Network.emulateNetworkConditions', {
          offline: false,
          latency: 0,
          downloadThroughput: -1,
          uploadThroughput: DATASHEET.length / 2,
        });
        const uploaded = page.waitForResponse(
          (response) => response.request().method() === 'POST' && response.url().endsWith(`/${ROW}/attachments`),
        );
        await page.getByTestId('row-evidence-attach-input').setInputFiles({ name, mimeType: 'application/pdf', buffer: DATASHEET });
        const bar = page.getByRole('progressbar', { name: `Upload of ${name}` });
        await bar.waitFor();
        await bar.scrollIntoViewIfNeeded();
        await page.waitForFunction(
          (label) => Number(document.querySelector(`[aria-label="${label}"]`)?.getAttribute('aria-valuenow') ?? 0) > 0,
          `Upload of ${name}`,
        );
        await shot('uploading');
        expect((await uploaded).status()).toBe(201);
        await network.send('Network.emulateNetworkConditions', {
          offline: false,
          latency: 0,
          downloadThroughput: -1,
          uploadThroughput: -1,
        });
        await bar.waitFor({ state: 'detached' });

        const item = evidence.getByTestId('row-evidence-item').filter({ hasText: name });
        await item.waitFor();
        expect(await item.innerText()).toMatch(/Datasheet · 300\.1 kB · Kenji Hollis · \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
        await item.scrollIntoViewIfNeeded();
        await shot('listed');

        // The link downloads the file as it was uploaded.
        const link = item.getByTestId('row-evidence-download');
        const href = await link.getAttribute('href');
        expect(href).toMatch(new RegExp(`^/api/crafts/${craftId}/attachments/[0-9a-f-]{36}$`));
        const download = page.waitForEvent('download');
        await link.click();
        expect((await download).suggestedFilename()).toBe(name);
        const response = await page.request.get(`${appUrl}${String(href)}`);
        expect(response.headers()['content-disposition']).toContain('attachment');
        expect(Buffer.from(await response.body())).toEqual(DATASHEET);

        // Removed again, so the test runs again on the same database.
        await item.getByTestId('row-evidence-remove').click();
        await item.getByTestId('row-evidence-remove-confirm').click();
        await item.waitFor({ state: 'detached' });
        expect(problems).toEqual([]);
      } catch (error) {
        await shot('failure');
        throw error;
      } finally {
        await context.close();
      }
    },
  );
});
