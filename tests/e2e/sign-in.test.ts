import path from 'node:path';
import { demoPeople } from '@/server/seed/demo-scenario';
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

describeInBrowser('a sign-in claiming an existing account by e-mail', () => {
  const browser = useBrowser();
  const admin = demoPeople.find((person) => person.subject === 'demo-ines');

  for (const viewport of viewports) {
    it(`is refused, and the sign-in page says why, at ${viewport.width}x${viewport.height}`, async () => {
      if (!admin) throw new Error('demo-ines is missing from the demo people');
      const context = await browser().newContext({ viewport: { width: viewport.width, height: viewport.height } });
      const page = await context.newPage();
      await page.goto(testStack.TEST_APP_URL);
      await page.getByTestId('sign-in-google').click();
      // The fake's "someone else": any name with the admin's address, which the fake calls verified.
      await page.getByTestId('other-name').fill('Mallory');
      await page.getByTestId('other-email').fill(admin.email);
      await page.getByTestId('person-other').click();
      await page.waitForURL(/\/sign-in\?error=identity_not_linked$/);
      const message = page.getByTestId('sign-in-error');
      await message.waitFor();
      expect(await message.textContent()).toContain('signs in another way, so this sign-in was refused');
      // The whole message is on screen, not cut off or beside the viewport.
      const box = await message.boundingBox();
      expect(box && box.x >= 0 && box.x + box.width <= viewport.width).toBe(true);
      await page.screenshot({ path: path.join(artifactsDir, `sign-in-refused-${viewport.name}.png`), fullPage: true });
      await context.close();
    }, 90_000);
  }
});
