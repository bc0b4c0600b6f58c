import { loadConfig } from '@/server/env';

describe('loadConfig', () => {
  it('names each bad variable', () => {
    expect(() => loadConfig({ PORT: 'eighty', NODE_ENV: 'test' })).toThrow(/PORT: /);
  });

  it('refuses the development secrets and the local sign-in fake in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET: set a real SESSION_SECRET.*OIDC_ISSUER: set OIDC_ISSUER/);
  });

  it('accepts a production configuration that names its real providers', () => {
    const config = loadConfig({
      NODE_ENV: 'production',
      PUBLIC_URL: 'https://trimsheet.corvid-sailworks.example',
      SESSION_SECRET: 'a-long-random-production-secret',
      OIDC_ISSUER: 'https://sso.corvid-sailworks.example',
      OIDC_CLIENT_SECRET: 'sso-secret',
      GOOGLE_CLIENT_SECRET: 'google-secret',
      GOOGLE_AUTHORIZATION_URL: 'https://accounts.google.com/o/oauth2/v2/auth',
      GOOGLE_TOKEN_URL: 'https://oauth2.googleapis.com/token',
      GOOGLE_USERINFO_URL: 'https://openidconnect.googleapis.com/v1/userinfo',
    });
    expect(config.secureCookies).toBe(true);
    expect(config.sso.allowHttp).toBe(false);
  });
});
