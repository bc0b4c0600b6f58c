import { z } from 'zod';
import { craftListSchema, craftSchema, type Craft } from '@/shared/schemas/crafts';
import { revisionDetailSchema, type RevisionDetail } from '@/shared/schemas/revisions';
import { createdTokenSchema, type TokenScope } from '@/shared/schemas/tokens';
import { chooseAtFake, CookieJar } from '@/tests/server/helpers/sign-in';

/**
 * The benchmarks' way into a running server: a demo person signed in through the real flow (app, sign-in
 * fake, callback) with fetch, then plain JSON calls with the session cookie and CSRF header, or a bearer token.
 */
export interface ApiSession {
  /** Calls the API as the signed-in person; throws with the answer's body on a non-2xx status. */
  call<T>(method: string, path: string, schema: z.ZodType<T>, body?: unknown): Promise<T>;
  /** The Cookie header a browser of this person sends (the session cookie), for load runs as that browser. */
  cookieHeader(): string;
}

/** Signs a demo person (their subject at the fake, e.g. 'demo-ines') in through the company SSO button's flow. */
export async function signInWithFetch(appUrl: string, subject: string): Promise<ApiSession> {
  const jar = new CookieJar();
  const visit = async (url: string, init: RequestInit = {}) => {
    const response = await fetch(url, { ...init, redirect: 'manual', headers: { ...init.headers, cookie: jar.header() } });
    jar.keep(response);
    return response;
  };
  const authorizationUrl = (await visit(`${appUrl}/api/auth/sso`)).headers.get('location');
  if (authorizationUrl === null) throw new Error('GET /api/auth/sso did not redirect to the sign-in fake');
  const callback = await chooseAtFake(new CookieJar(), authorizationUrl, subject, '/api/auth/sso/callback');
  const landing = await visit(callback.href);
  if (landing.headers.get('location') !== '/crafts')
    throw new Error(`signing ${subject} in ended at ${landing.status} ${landing.headers.get('location')}`);
  const session = z.object({ csrfToken: z.string() }).parse(await (await visit(`${appUrl}/api/auth/session`)).json());

  return {
    cookieHeader: () => jar.header(),
    async call(method, path, schema, body) {
      const response = await visit(`${appUrl}${path}`, {
        method,
        headers: { 'content-type': 'application/json', 'x-csrf-token': session.csrfToken },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await response.text();
      if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${text.slice(0, 500)}`);
      return schema.parse(text === '' ? undefined : JSON.parse(text));
    },
  };
}

/** Creates a personal access token for the signed-in person and returns its secret (for `Authorization: Bearer`). */
export async function createToken(api: ApiSession, scope: TokenScope): Promise<string> {
  const created = await api.call('POST', '/api/account/tokens', createdTokenSchema, { name: `benchmark ${scope}`, scope });
  return created.secret;
}

/** A craft by name among those the person sees, with its working draft's id. */
export async function craftNamed(api: ApiSession, name: string): Promise<Craft & { draftRevisionId: string }> {
  const { crafts } = await api.call('GET', '/api/crafts', craftListSchema);
  const craft = crafts.find((candidate) => candidate.name === name);
  if (!craft) throw new Error(`no craft named ${name} among ${crafts.map((candidate) => candidate.name).join(', ')}`);
  return withDraft(craft);
}

/** Creates a craft from a template; the caller must be allowed to create crafts (an organisation admin in the demo). */
export async function createCraft(api: ApiSession, name: string, templateId: string): Promise<Craft & { draftRevisionId: string }> {
  return withDraft(await api.call('POST', '/api/crafts', craftSchema, { name, templateId }));
}

function withDraft(craft: Craft): Craft & { draftRevisionId: string } {
  const { draftRevisionId } = craft;
  if (draftRevisionId === null) throw new Error(`craft ${craft.name} has no working draft`);
  return { ...craft, draftRevisionId };
}

/** GET of a revision with its rows. */
export function getRevision(api: ApiSession, craftId: string, revisionId: string): Promise<RevisionDetail> {
  return api.call('GET', revisionPath(craftId, revisionId), revisionDetailSchema);
}

/** The API path of a revision. */
export function revisionPath(craftId: string, revisionId: string): string {
  return `/api/crafts/${craftId}/revisions/${revisionId}`;
}
