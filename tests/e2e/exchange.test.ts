import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { craftListSchema } from '@/shared/schemas/crafts';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, signInAs, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;
const appUrl = testStack.TEST_APP_URL;

jest.setTimeout(120_000);

describeInBrowser('spreadsheet exchange in the browser', () => {
  const browser = useBrowser();

  it.each(viewports)(
    'a systems engineer exports the draft, imports an edited workbook, reads the preview and accepts it as a study at $width x $height',
    async (viewport) => {
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      const problems: string[] = [];
      page.on('pageerror', (error) => problems.push(error.message));
      const shot = (part: string) =>
        page.screenshot({ path: path.join(artifactsDir, `exchange-${viewport.name}-${part}.png`), fullPage: true });
      const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'trimsheet-exchange-'));
      try {
        await signInAs(page, appUrl, 'demo-amara');
        const { crafts } = craftListSchema.parse(await (await page.request.get(`${appUrl}/api/crafts`)).json());
        const tern = crafts.find((craft) => craft.name === 'Tern');
        if (!tern?.draftRevisionId) throw new Error('Tern or its working draft is missing');

        await page.goto(`${appUrl}/crafts/${tern.id}/revisions`);
        await page.getByTestId(`revision-exchange-${tern.draftRevisionId}`).click();
        const panel = page.getByTestId(`exchange-${tern.draftRevisionId}`);
        await panel.waitFor();
        await shot('panel');

        // Export: the button downloads the workbook.
        const download = page.waitForEvent('download');
        await panel.getByTestId('export-xlsx').click();
        const saved = path.join(folder, 'export.xlsx');
        await (await download).saveAs(saved);

        // A partner's edit of the downloaded file: the deployer's mass (a row no other browser test writes, as
        // they run at the same time on the same database) and a bad unit.
        const workbook = new ExcelJS.Workbook();
        await workbook.xlsx.readFile(saved);
        const parameters = workbook.getWorksheet('Parameters');
        if (!parameters) throw new Error('the export has no Parameters sheet');
        let deployer = 0;
        let payload = 0;
        parameters.eachRow((row, number) => {
          if (row.getCell('A').text === 'deployer_mass') deployer = number;
          if (row.getCell('A').text === 'payload_mass') payload = number;
        });
        const mass = viewport.name === 'phone' ? 6.25 : 6.75;
        parameters.getCell(`D${deployer}`).value = mass;
        parameters.getCell(`E${payload}`).value = 'furlongs';
        const edited = path.join(folder, 'partner.xlsx');
        await workbook.xlsx.writeFile(edited);

        const [chooser] = await Promise.all([page.waitForEvent('filechooser'), panel.getByTestId('import-choose').click()]);
        await chooser.setFiles(edited);
        const preview = page.getByTestId('import-preview');
        await preview.waitFor();
        await page.getByTestId('import-changed').getByText(`${mass} kg`).waitFor();
        await page.getByTestId('import-problems').getByText(`Parameters!E${payload}`).waitFor();
        await preview.scrollIntoViewIfNeeded();
        await shot('preview');

        await page.getByTestId('import-accept').click();
        await page.waitForURL(/\/sheet\?revision=/);
        await page.getByText('Tern: Import of partner.xlsx (study)').first().waitFor();
        await shot('study');
        expect(problems).toEqual([]);
      } finally {
        fs.rmSync(folder, { recursive: true, force: true });
        await context.close();
      }
    },
  );
});
