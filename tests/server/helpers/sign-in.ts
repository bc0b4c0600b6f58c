import type { Express } from 'express';
import request from 'supertest';

export type Provider = 'google' | 'sso';
export type Agent = ReturnType<typeof request.agent>;

/** The sign-in fake's cookies, kept by hand because its pages are fetched outside the app's agent. */
class CookieJar {
  private readonly cookies = new Map<string, string>();

  header() {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  keep(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      const [pair = ''] = line.split(';');
      const separator = pair.indexOf('=');
      const name = pair.slice(0, separator).trim();
      const value = pair.slice(separator + 1).trim();
      const expired = /expires=Thu, 01 Jan 1970/i.test(line) || /max-age=0\b/i.test(line);
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }
}

async function visit(jar: CookieJar, url: string, init: RequestInit = {}) {
  const response = await fetch(url, { ...init, redirect: 'manual', headers: { ...init.headers, cookie: jar.header() } });
  jar.keep(response);
  return response;
}

/** Follows the fake's redirects until it answers with a page, or redirects to the app's callback. */
async function followAtFake(jar: CookieJar, first: Response, from: string, callbackPath: string) {
  let response = first;
  let url = from;
  for (let hop = 0; hop < 10; hop += 1) {
    const location = response.headers.get('location');
    if (response.status < 300 || response.status >= 400 || !location) return { response, url };
    url = new URL(location, url).href;
    if (new URL(url).pathname === callbackPath) return { response, url };
    response = await visit(jar, url);
  }
  throw new Error(`the sign-in fake redirected more than 10 times (last ${url})`);
}

/**
 * Starts a sign-in with the app's agent, chooses the person on the fake's login page and returns the
 * callback address (path and query) the fake sends the browser back to, without visiting it.
 */
export async function callbackFromFake(agent: Agent, subject: string, provider: Provider): Promise<string> {
  const start = await agent.get(`/api/auth/${provider}`).expect(302);
  const authorizationUrl = start.headers.location;
  if (!authorizationUrl?.startsWith('http')) throw new Error(`GET /api/auth/${provider} redirected to ${String(authorizationUrl)}, not to the provider`);
  const callbackPath = `/api/auth/${provider}/callback`;
  const jar = new CookieJar();

  const loginPage = await followAtFake(jar, await visit(jar, authorizationUrl), authorizationUrl, callbackPath);
  const html = await loginPage.response.text();
  const action = /<form method="post" action="([^"]+\/login)"/.exec(html)?.[1];
  if (loginPage.response.status !== 200 || !action) throw new Error(`the fake did not show its login page (${loginPage.response.status}): ${html.slice(0, 300)}`);
  if (!html.includes(`data-testid="person-${subject}"`)) throw new Error(`the fake's login page offers no person ${subject}`);

  const loginUrl = new URL(action, loginPage.url).href;
  const chosen = await visit(jar, loginUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ subject }).toString(),
  });
  const back = await followAtFake(jar, chosen, loginUrl, callbackPath);
  const callback = new URL(back.url);
  if (callback.pathname !== callbackPath) throw new Error(`the fake ended at ${back.url} (${back.response.status}), not at ${callbackPath}`);
  return `${callback.pathname}${callback.search}`;
}

/**
 * Signs a demo person in through the real flow (app → sign-in fake → login page → app callback) and
 * returns an agent holding the session cookie, with the CSRF token for state-changing requests.
 */
export async function signIn(app: Express, subject: string, provider: Provider): Promise<{ agent: Agent; csrfToken: string }> {
  const agent = request.agent(app);
  const callback = await callbackFromFake(agent, subject, provider);
  const finished = await agent.get(callback);
  if (finished.status !== 302 || finished.headers.location !== '/crafts') {
    throw new Error(`signing ${subject} in with ${provider} ended at ${finished.status} ${String(finished.headers.location)}`);
  }
  const session = await agent.get('/api/auth/session').expect(200);
  return { agent, csrfToken: session.body.csrfToken as string };
}
