import { CookieAccessInfo } from 'cookiejar';
import type { Express } from 'express';
import request from 'supertest';
import { demoPeople, type DemoPerson } from '@/server/seed/demo-scenario';

export type Provider = 'google' | 'sso';
/** Whom to choose at the fake: a demo person's subject, 'cancel', or someone else by name and e-mail. */
export type FakeChoice = string | { name: string; email: string };
export type Agent = ReturnType<typeof request.agent>;

/** The Cookie header an agent sends: to make its requests to another app on the same database (another API process). */
export function cookieHeaderOf(agent: Agent): string {
  return agent.jar
    .getCookies(CookieAccessInfo.All)
    .map((cookie) => `${cookie.name}=${cookie.value}`)
    .join('; ');
}

/** Where a redirect response points; fails the test when it is not a redirect. */
export function locationOf(response: request.Response): string {
  const location: unknown = response.headers.location;
  if (typeof location !== 'string') throw new Error(`expected a redirect, got ${response.status} without a Location`);
  return location;
}

/** The sign-in fake's cookies, kept by hand because its pages are fetched outside the app's agent. */
export class CookieJar {
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
 * At the fake, from an authorization request: opens the login page, chooses the person (or presses Cancel
 * when the choice is 'cancel') and follows the fake's redirects until they point at `callbackPath`.
 * Returns that callback URL without visiting it.
 */
export async function chooseAtFake(jar: CookieJar, authorizationUrl: string, choice: FakeChoice, callbackPath: string): Promise<URL> {
  const loginPage = await followAtFake(jar, await visit(jar, authorizationUrl), authorizationUrl, callbackPath);
  const html = await loginPage.response.text();
  const button = choice === 'cancel' ? 'data-testid="cancel"' : `data-testid="person-${typeof choice === 'string' ? choice : 'other'}"`;
  const form = html.split('<form').find((part) => part.includes(button));
  const action = form && /method="post" action="([^"]+)"/.exec(form)?.[1];
  if (loginPage.response.status !== 200 || !action) {
    throw new Error(`the fake's login page (${loginPage.response.status}) has no ${button}: ${html.slice(0, 300)}`);
  }

  const formUrl = new URL(action, loginPage.url).href;
  const chosen = await visit(jar, formUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(choice === 'cancel' ? {} : typeof choice === 'string' ? { subject: choice } : choice).toString(),
  });
  const back = await followAtFake(jar, chosen, formUrl, callbackPath);
  const callback = new URL(back.url);
  if (callback.pathname !== callbackPath)
    throw new Error(`the fake ended at ${back.url} (${back.response.status}), not at ${callbackPath}`);
  return callback;
}

/**
 * Starts a sign-in with the app's agent, makes the choice at the fake (see chooseAtFake) and returns the
 * callback address (path and query) the fake sends the browser back to, without visiting it.
 */
export async function callbackFromFake(agent: Agent, choice: FakeChoice, provider: Provider): Promise<string> {
  const authorizationUrl = locationOf(await agent.get(`/api/auth/${provider}`).expect(302));
  if (!authorizationUrl.startsWith('http'))
    throw new Error(`GET /api/auth/${provider} redirected to ${authorizationUrl}, not to the provider`);
  const callback = await chooseAtFake(new CookieJar(), authorizationUrl, choice, `/api/auth/${provider}/callback`);
  return `${callback.pathname}${callback.search}`;
}

/**
 * Signs a demo person in through the real flow (app → sign-in fake → login page → app callback) and
 * returns an agent holding the session cookie, with the CSRF token for state-changing requests.
 */
export async function signIn(app: Express, choice: FakeChoice, provider: Provider): Promise<{ agent: Agent; csrfToken: string }> {
  const agent = request.agent(app);
  const callback = await callbackFromFake(agent, choice, provider);
  const landing = locationOf(await agent.get(callback).expect(302));
  if (landing !== '/crafts') throw new Error(`signing ${JSON.stringify(choice)} in with ${provider} ended at ${landing}`);
  const session = await agent.get('/api/auth/session').expect(200);
  return { agent, csrfToken: session.body.csrfToken as string };
}

/** The demo person the sign-in fake offers under this subject (e.g. 'demo-ines'); fails the test when there is none. */
export function demoPerson(subject: string): DemoPerson {
  const found = demoPeople.find((candidate) => candidate.subject === subject);
  if (!found) throw new Error(`no demo person ${subject}`);
  return found;
}
