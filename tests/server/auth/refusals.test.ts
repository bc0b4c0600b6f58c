import net from 'node:net';
import request from 'supertest';
import { callbackFromFake, locationOf, type Agent, type Provider } from '../helpers/sign-in';
import { createTestApp, type TestApp } from '../helpers/test-app';

let testApp: TestApp;
const warnings = jest.spyOn(console, 'warn').mockImplementation(() => undefined);

beforeAll(async () => {
  testApp = await createTestApp();
});

beforeEach(() => warnings.mockClear());

afterAll(async () => {
  await testApp.close();
});

const landing = async (agent: Agent, path: string) => locationOf(await agent.get(path).expect(302));

describe.each<Provider>(['google', 'sso'])('a %s callback that does not belong to the sign-in', (provider) => {
  it('is refused with state_mismatch when the state was altered', async () => {
    const agent = request.agent(testApp.app);
    const callback = new URL(await callbackFromFake(agent, 'demo-tomas', provider), 'http://app.invalid');
    callback.searchParams.set('state', 'forged-state');
    expect(await landing(agent, `${callback.pathname}${callback.search}`)).toBe('/sign-in?error=state_mismatch');
    expect((await agent.get('/api/auth/session').expect(200)).body.user).toBeNull();
  });

  it('is refused with state_mismatch in a browser that did not start it', async () => {
    const callback = await callbackFromFake(request.agent(testApp.app), 'demo-tomas', provider);
    const stranger = request.agent(testApp.app);
    expect(await landing(stranger, callback)).toBe('/sign-in?error=state_mismatch');
    expect((await stranger.get('/api/auth/session').expect(200)).body.user).toBeNull();
  });
});

describe('cancelling at the provider', () => {
  it('comes back as access_denied', async () => {
    const agent = request.agent(testApp.app);
    const callback = await callbackFromFake(agent, 'cancel', 'sso');
    expect(await landing(agent, callback)).toBe('/sign-in?error=access_denied');
  });
});

describe('an unreachable company identity provider', () => {
  let closedPort = 0;
  beforeAll(async () => {
    const probe = net.createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    closedPort = (probe.address() as net.AddressInfo).port;
    await new Promise<void>((resolve) => probe.close(() => resolve()));
  });

  it('does not stop the app from starting, and sends SSO sign-ins back with provider_error', async () => {
    const app = testApp.appWith((config) => ({ ...config, sso: { ...config.sso, issuer: `http://127.0.0.1:${closedPort}` } }));
    const agent = request.agent(app);
    expect(await landing(agent, '/api/auth/sso')).toBe('/sign-in?error=provider_error');
    expect(warnings).toHaveBeenCalledWith(expect.stringContaining('[auth] SSO discovery failed'));
    expect(await landing(agent, '/api/auth/google')).toMatch(/^http/);
  });
});
