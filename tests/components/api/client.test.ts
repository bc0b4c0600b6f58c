import { z } from 'zod';
import { ApiError, apiRequest, rememberCsrfToken } from '@/components/api/client';
import { demoSession, demoUser, mockFetch } from '../helpers/api';

beforeEach(() => rememberCsrfToken(null));

describe('apiRequest', () => {
  it('sends cookies and JSON, and fetches the session once for the CSRF token of a state-changing request', async () => {
    const fetchMock = mockFetch({
      'GET /api/auth/session': { status: 200, body: demoSession(demoUser) },
      'POST /api/things': { status: 201, body: { id: 'a' } },
    });
    const schema = z.object({ id: z.string() });

    await expect(apiRequest('POST', '/api/things', { body: { name: 'x' }, schema })).resolves.toEqual({ id: 'a' });
    await apiRequest('POST', '/api/things', { body: { name: 'y' }, schema });

    const posts = fetchMock.mock.calls.filter(([, init]) => init?.method === 'POST');
    expect(posts).toHaveLength(2);
    for (const [, init] of posts) {
      expect(init).toMatchObject({
        credentials: 'include',
        headers: { 'x-csrf-token': 'test-csrf-token', 'content-type': 'application/json' },
      });
    }
    expect(fetchMock.mock.calls.filter(([path]) => path === '/api/auth/session')).toHaveLength(1);
  });

  it('fetches a fresh CSRF token and tries once more when the server calls the token void', async () => {
    let sessionFetches = 0;
    const fetchMock = mockFetch({
      'GET /api/auth/session': () => {
        sessionFetches += 1;
        return { status: 200, body: { ...demoSession(demoUser), csrfToken: `token-${sessionFetches}` } };
      },
      'DELETE /api/things/a': { status: 403, body: { error: { code: 'invalid_csrf_token', message: 'invalid csrf token' } } },
    });
    rememberCsrfToken('stale');
    await expect(apiRequest('DELETE', '/api/things/a')).rejects.toMatchObject({ status: 403, code: 'invalid_csrf_token' });

    const tokens = fetchMock.mock.calls
      .filter(([, init]) => init?.method === 'DELETE')
      .map(([, init]) => (init?.headers as Record<string, string>)['x-csrf-token']);
    expect(tokens).toEqual(['stale', 'token-1']);
  });

  it('sends no CSRF header on GET', async () => {
    const fetchMock = mockFetch({ 'GET /api/crafts': { status: 200, body: {} } });
    await apiRequest('GET', '/api/crafts');
    expect(fetchMock.mock.calls[0]?.[1]?.headers).not.toHaveProperty('x-csrf-token');
  });

  it('turns the error shape into an ApiError with status, code, message and field details', async () => {
    mockFetch({
      'GET /api/crafts': {
        status: 400,
        body: {
          error: { code: 'invalid_input', message: 'Invalid input', details: [{ path: 'body.name', message: 'must not be empty' }] },
        },
      },
    });
    const error: unknown = await apiRequest('GET', '/api/crafts').catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'invalid_input', message: 'Invalid input' });
    expect((error as ApiError).fieldErrors).toEqual([{ path: 'body.name', message: 'must not be empty' }]);
  });

  it('names the request and the place when an answer does not match its schema', async () => {
    mockFetch({ 'GET /api/crafts': { status: 200, body: { crafts: 'none' } } });
    await expect(apiRequest('GET', '/api/crafts', { schema: z.object({ crafts: z.array(z.string()) }) })).rejects.toMatchObject({
      code: 'unexpected_response',
      message: 'The server\'s answer to GET /api/crafts was not understood at "crafts".',
    });
  });

  it('reports an unreachable server as a network error instead of throwing a bare TypeError', async () => {
    global.fetch = jest.fn(async () => {
      throw new TypeError('Failed to fetch');
    }) as unknown as typeof fetch;
    await expect(apiRequest('GET', '/api/crafts')).rejects.toMatchObject({
      status: 0,
      code: 'network_error',
      message: 'Could not reach the server (GET /api/crafts): Failed to fetch',
    });
  });

  it('gives a readable error for a failure without the error shape', async () => {
    mockFetch({
      'DELETE /api/crafts/x': { status: 502, body: '<html>Bad gateway</html>' },
      'GET /api/auth/session': { status: 200, body: demoSession(null) },
    });
    await expect(apiRequest('DELETE', '/api/crafts/x')).rejects.toMatchObject({
      status: 502,
      code: 'http_error',
      message: 'DELETE /api/crafts/x failed with HTTP 502.',
    });
  });
});
