import path from 'node:path';
import { testStack } from '../server/helpers/test-app';
import { artifactsDir, useBrowser, viewports } from './browser';

const describeInBrowser = testStack.TEST_SKIP_BROWSER === '1' ? describe.skip : describe;

const journeys = [
  { provider: 'google', button: 'sign-in-google', person: 'demo-tomas', name: 'Tomás Reyes' },
  { provider: 'sso', button: 'sign-in-sso', person: 'demo-kenji', name: 'Kenji Hollis' },
] as const;

describeInBrowser('signing in through the fake', () => {
  const browser = useBrowser();

  for (const viewport of viewports) {
    for (const journey of journeys) {
      it(`lands on the craft list with ${journey.button} at ${viewport.width}x${viewport.height}`, async () => {
        const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
        const page = await context.newPage();
        await page.goto(testStack.TEST_APP_URL);
        await page.getByTestId(journey.button).click();
        await page.getByTestId(`person-${journey.person}`).click();
        await page.waitForURL(/\/crafts$/);
        await page.getByTestId('craft-list').getByText('Tern').waitFor();
        await page.screenshot({ path: path.join(artifactsDir, `sign-in-${journey.provider}-${viewport.name}.png`), fullPage: true });
        await context.close();
      }, 90_000);
    }
  }
});
