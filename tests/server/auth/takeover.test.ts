import { Op } from 'sequelize';
import request from 'supertest';
import { Identity, User } from '@/server/models';
import { callbackFromFake, demoPerson, locationOf, signIn } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

const guestIdentities = async (email: string) => {
  const user = await User.findOne({ where: { email }, rejectOnEmpty: true });
  return Identity.count({ where: { userId: user.id, subject: { [Op.like]: 'guest-%' } } });
};

describe('a new identity claiming an existing person by e-mail', () => {
  it.each(['google', 'sso'] as const)('is refused with identity_not_linked through %s, and nothing is linked', async (provider) => {
    const ines = demoPerson('demo-ines');
    const attacker = request.agent(testApp.app);
    // The fake's "someone else" form: any name, the admin's address, and the provider calls it verified.
    const callback = await callbackFromFake(attacker, { name: 'Mallory', email: ines.email }, provider);
    expect(locationOf(await attacker.get(callback).expect(302))).toBe('/sign-in?error=identity_not_linked');
    expect((await attacker.get('/api/auth/session').expect(200)).body.user).toBeNull();
    expect(await guestIdentities(ines.email)).toBe(0);
  });
});

describe('linking another sign-in from the account', () => {
  const personalGoogle = { name: 'Tomás at home', email: 'tomas.home@example.org' };

  it('links the provider identity to the signed-in person, who can then sign in with it', async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    const start = await tomas.agent
      .post('/api/account/identities')
      .set('x-csrf-token', tomas.csrfToken)
      .send({ provider: 'google' })
      .expect(200);
    expect(start.body).toEqual({ startUrl: '/api/auth/google' });
    const callback = await callbackFromFake(tomas.agent, personalGoogle, 'google');
    expect(locationOf(await tomas.agent.get(callback).expect(302))).toBe('/account?link=linked&provider=google');
    // Still Tomás in this browser, and the personal Google account now signs in as him elsewhere.
    expect((await tomas.agent.get('/api/auth/session').expect(200)).body.user.email).toBe(demoPerson('demo-tomas').email);
    const elsewhere = await signIn(testApp.app, personalGoogle, 'google');
    expect((await elsewhere.agent.get('/api/auth/session').expect(200)).body.user.email).toBe(demoPerson('demo-tomas').email);
    const identities = await tomas.agent.get('/api/account/identities').expect(200);
    expect(identities.body.identities).toEqual(expect.arrayContaining([{ provider: 'google', linkedAt: expect.any(String) }]));
  });

  it('refuses an identity already linked to someone else with identity_in_use', async () => {
    const tomas = await signIn(testApp.app, 'demo-tomas', 'sso');
    await tomas.agent.post('/api/account/identities').set('x-csrf-token', tomas.csrfToken).send({ provider: 'google' }).expect(200);
    const callback = await callbackFromFake(tomas.agent, 'demo-amara', 'google');
    expect(locationOf(await tomas.agent.get(callback).expect(302))).toBe('/account?link=identity_in_use&provider=google');
    const amara = await User.findOne({ where: { email: demoPerson('demo-amara').email }, rejectOnEmpty: true });
    expect(await Identity.count({ where: { provider: 'google', subject: 'demo-amara', userId: amara.id } })).toBe(1);
  });

  it('sends a cancelled link back to the account with access_denied, the person still signed in', async () => {
    const kenji = await signIn(testApp.app, 'demo-kenji', 'sso');
    await kenji.agent.post('/api/account/identities').set('x-csrf-token', kenji.csrfToken).send({ provider: 'google' }).expect(200);
    const callback = await callbackFromFake(kenji.agent, 'cancel', 'google');
    expect(locationOf(await kenji.agent.get(callback).expect(302))).toBe('/account?link=access_denied&provider=google');
    expect((await kenji.agent.get('/api/auth/session').expect(200)).body.user.email).toBe(demoPerson('demo-kenji').email);
  });

  it('needs the CSRF token to ask for a link, and a session', async () => {
    const oren = await signIn(testApp.app, 'demo-oren', 'sso');
    await oren.agent.post('/api/account/identities').send({ provider: 'google' }).expect(403);
    await request(testApp.app)
      .post('/api/account/identities')
      .send({ provider: 'google' })
      .expect((response) => {
        expect([401, 403]).toContain(response.status);
      });
    const wrong = await oren.agent
      .post('/api/account/identities')
      .set('x-csrf-token', oren.csrfToken)
      .send({ provider: 'github' })
      .expect(400);
    expect(wrong.body.error.details).toEqual([expect.objectContaining({ path: 'body.provider' })]);
  });

  it('links nothing for a browser that did not ask, even when someone is signed in there', async () => {
    const oren = await signIn(testApp.app, 'demo-oren', 'sso');
    const callback = await callbackFromFake(oren.agent, { name: 'Mallory', email: demoPerson('demo-oren').email }, 'google');
    expect(locationOf(await oren.agent.get(callback).expect(302))).toBe('/sign-in?error=identity_not_linked');
    expect(await guestIdentities(demoPerson('demo-oren').email)).toBe(0);
  });
});
