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
      TRUST_PROXY: '10.0.0.0/8',
      SESSION_SECRET: 'a-long-random-production-secret',
      OIDC_ISSUER: 'https://sso.corvid-sailworks.example',
      OIDC_CLIENT_SECRET: 'sso-secret',
      GOOGLE_CLIENT_SECRET: 'google-secret',
      GOOGLE_AUTHORIZATION_URL: 'https://accounts.google.com/o/oauth2/v2/auth',
      GOOGLE_TOKEN_URL: 'https://oauth2.googleapis.com/token',
      GOOGLE_USERINFO_URL: 'https://openidconnect.googleapis.com/v1/userinfo',
    });
    expect(config.secureCookies).toBe(true);
    expect(config.session.cookieName).toBe('__Host-trimsheet.sid');
    expect(config.trustProxy).toEqual(['10.0.0.0/8']);
    expect(config.sso.allowHttp).toBe(false);
  });

  it('trusts no proxy unless told, and never every X-Forwarded-For', () => {
    expect(loadConfig({ NODE_ENV: 'test' }).trustProxy).toBe(false);
    expect(loadConfig({ NODE_ENV: 'test', TRUST_PROXY: '2' }).trustProxy).toBe(2);
    expect(loadConfig({ NODE_ENV: 'test', TRUST_PROXY: 'loopback, 10.0.0.1' }).trustProxy).toEqual(['loopback', '10.0.0.1']);
    expect(() => loadConfig({ NODE_ENV: 'test', TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY: name the proxies/);
    expect(() => loadConfig({ NODE_ENV: 'test', PUBLIC_URL: 'https://trimsheet.example' })).toThrow(
      /TRUST_PROXY: name the TLS-terminating proxy/,
    );
  });

  it('names the session cookie without the __Host- prefix over plain HTTP, and keeps header timeouts within request timeouts', () => {
    expect(loadConfig({ NODE_ENV: 'test' }).session.cookieName).toBe('trimsheet.sid');
    expect(() => loadConfig({ NODE_ENV: 'test', SERVER_HEADERS_TIMEOUT_SECONDS: '90' })).toThrow(
      /SERVER_HEADERS_TIMEOUT_SECONDS: must not exceed SERVER_REQUEST_TIMEOUT_SECONDS/,
    );
  });
});
