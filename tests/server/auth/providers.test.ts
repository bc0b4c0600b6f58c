import { demoPeople } from '@/server/seed/demo-scenario';
import { signIn, type Provider } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe.each<Provider>(['google', 'sso'])('signing in with %s', (provider) => {
  it.each(demoPeople.map((person) => [person.subject, person]))('signs %s in as themselves', async (_subject, person) => {
    const { agent, csrfToken } = await signIn(testApp.app, person.subject, provider);
    const session = await agent.get('/api/auth/session').expect(200);
    expect(session.body.user).toEqual(expect.objectContaining({ email: person.email, name: person.name, isOrgAdmin: person.isOrgAdmin }));
    expect(session.body.csrfToken).toBe(csrfToken);
  });
});
